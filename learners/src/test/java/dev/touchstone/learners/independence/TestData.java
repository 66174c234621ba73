package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/** Seeded data for the tests of this package (invented, for checks only). */
final class TestData {

    private TestData() {
    }

    /** p correlated Gaussian columns: each column is noise plus a random mix of the earlier ones. */
    static double[][] correlated(int p, int n, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double[][] x = new double[p][n];
        double[][] w = new double[p][p];
        for (int j = 0; j < p; j++) {
            for (int k = 0; k < j; k++) {
                w[j][k] = rng.nextDouble() < 0.6 ? rng.nextDouble() * 2 - 1 : 0;
            }
        }
        for (int r = 0; r < n; r++) {
            for (int j = 0; j < p; j++) {
                double s = g.sample();
                for (int k = 0; k < j; k++) {
                    s += w[j][k] * x[k][r];
                }
                x[j][r] = s;
            }
        }
        return x;
    }

    static DataSet continuous(double[][] cols) {
        DataSet.Builder b = DataSet.builder(cols[0].length);
        for (int j = 0; j < cols.length; j++) {
            b.continuous("V" + j, cols[j]);
        }
        return b.build();
    }

    /** Discrete columns: V0 uniform on k0 categories, later ones depend on V0 (and V1) with noise. */
    static int[][] discrete(int[] cards, int n, double strength, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int[][] x = new int[cards.length][n];
        for (int r = 0; r < n; r++) {
            for (int j = 0; j < cards.length; j++) {
                if (j > 0 && rng.nextDouble() < strength) {
                    x[j][r] = (x[j - 1][r] + (j > 1 ? x[0][r] : 0)) % cards[j];
                } else {
                    x[j][r] = rng.nextInt(cards[j]);
                }
            }
        }
        return x;
    }

    static DataSet discreteData(int[][] codes, int[] cards) {
        DataSet.Builder b = DataSet.builder(codes[0].length);
        for (int j = 0; j < codes.length; j++) {
            b.discrete(Variable.discrete("D" + j, cards[j]), codes[j]);
        }
        return b.build();
    }
}
