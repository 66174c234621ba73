package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.math3.stat.descriptive.moment.Variance;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;

class ConditionalGaussianScoreTest {

    /** Columns: C1, C2 continuous; D binary; Y continuous depending on all three; B binary depending on C1. */
    private static DataSet mixed(int rows, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        double[] c1 = new double[rows];
        double[] c2 = new double[rows];
        int[] d = new int[rows];
        double[] y = new double[rows];
        int[] b = new int[rows];
        for (int r = 0; r < rows; r++) {
            c1[r] = gauss(rng);
            c2[r] = gauss(rng) + 0.5 * c1[r];
            d[r] = rng.nextDouble() < 0.4 ? 1 : 0;
            y[r] = (d[r] == 1 ? 1.5 : -0.5) * c1[r] + 0.7 * c2[r] + 2 * d[r] + gauss(rng);
            b[r] = rng.nextDouble() < 1 / (1 + Math.exp(-2 * c1[r])) ? 1 : 0;
        }
        return DataSet.builder(rows).continuous("C1", c1).continuous("C2", c2).discrete(Variable.discrete("D", 2), d)
                .continuous("Y", y).discrete(Variable.discrete("B", 2), b).build();
    }

    private static double gauss(UniformRandomProvider rng) {
        return Math.sqrt(-2 * Math.log(1 - rng.nextDouble())) * Math.cos(2 * Math.PI * rng.nextDouble());
    }

    @Test
    @DisplayName("all continuous: equals the linear Gaussian BIC (Andrews, Ramsey and Cooper 2018, §3)")
    void continuousCaseIsBic() {
        DataSet data = ScoreData.linearGaussian(RandomDags.erdosRenyi(6, 2.5, 3), 250, 7);
        ConditionalGaussianScore cg = ConditionalGaussianScore.of(data, 1.0);
        BicScore bic = BicScore.of(data.covariance(), 1.0);
        int[][] sets = {{}, {0}, {1, 2}, {0, 3, 4}, {0, 1, 2, 4}};
        for (int[] pa : sets) {
            int y = 5;
            assertEquals(bic.localScore(y, pa), cg.localScore(y, pa), 1e-7, java.util.Arrays.toString(pa));
        }
    }

    @Test
    @DisplayName("continuous child, discrete and continuous parents: per-cell Commons Math OLS log-likelihoods")
    void continuousChildPerCellRegression() {
        DataSet data = mixed(300, 11);
        int n = data.rows();
        double expected = 0;
        for (int cell = 0; cell < 2; cell++) {
            List<double[]> x = new ArrayList<>();
            List<Double> yv = new ArrayList<>();
            for (int r = 0; r < n; r++) {
                if (data.discrete(2)[r] == cell) {
                    x.add(new double[] {data.continuous(0)[r], data.continuous(1)[r]});
                    yv.add(data.continuous(3)[r]);
                }
            }
            double[] y = yv.stream().mapToDouble(Double::doubleValue).toArray();
            OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
            ols.newSampleData(y, x.toArray(new double[0][]));
            double rss = ols.calculateResidualSumOfSquares();
            int m = y.length;
            expected += -0.5 * m * (Math.log(2 * Math.PI * rss / m) + 1);
        }
        expected -= 0.5 * Math.log(n) * 2 * (2 + 2);
        double got = ConditionalGaussianScore.of(data, 1.0).localScore(3, new int[] {0, 2, 1});
        assertEquals(expected, got, 1e-8 * Math.abs(expected));
    }

    @Test
    @DisplayName("discrete child, discrete parent: the multinomial BIC by hand on a small table (common practice)")
    void discreteChildMultinomial() {
        int[] x = {0, 0, 0, 0, 1, 1};
        int[] y = {0, 0, 0, 1, 1, 1};
        DataSet data = DataSet.builder(6).discrete(Variable.discrete("X", 2), x)
                .discrete(Variable.discrete("Y", 2), y).build();
        // X = 0: counts 3, 1 → 3 ln(3/4) + ln(1/4), 1 free parameter; X = 1: counts 0, 2 → 0, no free parameter.
        double expected = 3 * Math.log(0.75) + Math.log(0.25) - 0.5 * Math.log(6) * 1;
        assertEquals(expected, ConditionalGaussianScore.of(data, 1.0).localScore(1, new int[] {0}), 1e-12);
    }

    @Test
    @DisplayName("discrete child, continuous parent: p(B | C) = p(B, C) / p(C) (Andrews et al. 2018), Commons Math variances")
    void discreteChildContinuousParent() {
        DataSet data = mixed(400, 5);
        int n = data.rows();
        double[] c = data.continuous(0);
        int[] b = data.discrete(4);
        double expected = -gaussian1(c, null, -1);
        for (int k = 0; k < 2; k++) {
            int m = 0;
            for (int v : b) {
                m += v == k ? 1 : 0;
            }
            expected += m * Math.log((double) m / n) + gaussian1(c, b, k);
        }
        // one configuration of D (none), 2 categories: (2 − 1) · (1 + 1·4/2) = 3 parameters
        expected -= 0.5 * Math.log(n) * 3;
        assertEquals(expected, ConditionalGaussianScore.of(data, 1.0).localScore(4, new int[] {0}), 1e-8 * Math.abs(expected));
    }

    /** The maximised one-dimensional Gaussian log-likelihood of the values with code == k (all when codes is null). */
    private static double gaussian1(double[] values, int[] codes, int k) {
        List<Double> v = new ArrayList<>();
        for (int r = 0; r < values.length; r++) {
            if (codes == null || codes[r] == k) {
                v.add(values[r]);
            }
        }
        double[] a = v.stream().mapToDouble(Double::doubleValue).toArray();
        double var = new Variance(false).evaluate(a);
        return -0.5 * a.length * (Math.log(2 * Math.PI * var) + 1);
    }
}
