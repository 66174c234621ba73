package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.learners.independence.ContingencyTest;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.Locale;

/**
 * False-positive rate of the G² and χ² tests under independence with the reduced and the
 * textbook degrees of freedom, on sparse tables: x, y and |S| conditioning variables, all
 * mutually independent, each with k categories of skewed probabilities (category j with
 * weight 2^−j, so the last ones are rarely seen), n rows; CASES seeded data sets; alpha 0.05.
 * Usage: {@code DegreesOfFreedomRates CASES n k s1 s2 ...} (s: conditioning-set sizes).
 * Prints one line per setting: the rejection rate of each statistic under each rule (a
 * calibrated test rejects 5%).
 */
public final class DegreesOfFreedomRates {

    private DegreesOfFreedomRates() {
    }

    public static void main(String[] args) {
        int cases = Integer.parseInt(args[0]);
        int n = Integer.parseInt(args[1]);
        int k = Integer.parseInt(args[2]);
        System.out.println("n,categories,conditioning,cases,g2_reduced,g2_textbook,chi2_reduced,chi2_textbook");
        for (int a = 3; a < args.length; a++) {
            int s = Integer.parseInt(args[a]);
            int[] rejected = new int[4];
            int[] z = new int[s];
            for (int i = 0; i < s; i++) {
                z[i] = 2 + i;
            }
            for (int c = 0; c < cases; c++) {
                DataSet data = independent(2 + s, n, k, 7_000 + 1_000L * s + c);
                int i = 0;
                for (ContingencyTest.Statistic st : ContingencyTest.Statistic.values()) {
                    for (ContingencyTest.DegreesOfFreedom d : ContingencyTest.DegreesOfFreedom.values()) {
                        if (new ContingencyTest(data, st, 0.05, d).pValue(0, 1, z) < 0.05) {
                            rejected[i]++;
                        }
                        i++;
                    }
                }
            }
            System.out.println(String.format(Locale.ROOT, "%d,%d,%d,%d,%.4f,%.4f,%.4f,%.4f", n, k, s, cases,
                    rejected[0] / (double) cases, rejected[1] / (double) cases,
                    rejected[2] / (double) cases, rejected[3] / (double) cases));
        }
    }

    private static DataSet independent(int p, int n, int k, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        double[] cumulative = new double[k];
        double total = 0;
        for (int j = 0; j < k; j++) {
            total += Math.pow(2, -j);
            cumulative[j] = total;
        }
        DataSet.Builder b = DataSet.builder(n);
        for (int v = 0; v < p; v++) {
            int[] codes = new int[n];
            for (int r = 0; r < n; r++) {
                double u = rng.nextDouble() * total;
                int j = 0;
                while (j < k - 1 && u > cumulative[j]) {
                    j++;
                }
                codes[r] = j;
            }
            b.discrete(Variable.discrete("X" + v, k), codes);
        }
        return b.build();
    }
}
