package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.stream.IntStream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class FisherZTestTest {

    private static final int P = 8;
    private static final int N = 300;

    /** The correlation of the OLS residuals of x and y on z, with Commons Math 3.6.1. */
    static double residualCorrelation(double[][] cols, int x, int y, int[] z) {
        double[] rx = residuals(cols, x, z);
        double[] ry = residuals(cols, y, z);
        return new PearsonsCorrelation().correlation(rx, ry);
    }

    static double[] residuals(double[][] cols, int target, int[] z) {
        int n = cols[target].length;
        if (z.length == 0) {
            double mean = Arrays.stream(cols[target]).average().orElse(0);
            return Arrays.stream(cols[target]).map(v -> v - mean).toArray();
        }
        double[][] design = new double[n][z.length];
        for (int r = 0; r < n; r++) {
            for (int k = 0; k < z.length; k++) {
                design[r][k] = cols[z[k]][r];
            }
        }
        OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
        ols.newSampleData(cols[target].clone(), design);
        return ols.estimateResiduals();
    }

    static int[] randomTriple(UniformRandomProvider rng, int p, int size, int[] xy) {
        int[] perm = IntStream.range(0, p).toArray();
        for (int i = p - 1; i > 0; i--) {
            int j = rng.nextInt(i + 1);
            int t = perm[i];
            perm[i] = perm[j];
            perm[j] = t;
        }
        xy[0] = perm[0];
        xy[1] = perm[1];
        return Arrays.copyOfRange(perm, 2, 2 + size);
    }

    @Test
    @DisplayName("partial correlation equals the correlation of OLS residuals (Commons Math), |S| = 0 … 5")
    void partialCorrelationMatchesOlsResiduals() {
        double[][] cols = TestData.correlated(P, N, 1);
        FisherZTest test = FisherZTest.of(TestData.continuous(cols), 0.05);
        UniformRandomProvider rng = Seeds.random(2);
        int[] xy = new int[2];
        for (int rep = 0; rep < 120; rep++) {
            int size = rep % 6;
            int[] z = randomTriple(rng, P, size, xy);
            double expected = residualCorrelation(cols, xy[0], xy[1], z);
            double actual = test.partialCorrelation(xy[0], xy[1], z);
            assertEquals(expected, actual, 1e-9, "x=" + xy[0] + " y=" + xy[1] + " z=" + Arrays.toString(z));
        }
    }

    @Test
    @DisplayName("p-value is 2(1 − Φ(|z|)) with Φ from Commons Math, z as in Kalisch and Bühlmann (2007)")
    void pValueMatchesNormalDistribution() {
        double[][] cols = TestData.correlated(P, N, 3);
        FisherZTest test = FisherZTest.of(TestData.continuous(cols), 0.05);
        NormalDistribution normal = new NormalDistribution(0, 1);
        UniformRandomProvider rng = Seeds.random(4);
        int[] xy = new int[2];
        for (int rep = 0; rep < 100; rep++) {
            int[] z = randomTriple(rng, P, rep % 5, xy);
            double r = residualCorrelation(cols, xy[0], xy[1], z);
            double zStat = 0.5 * Math.log((1 + r) / (1 - r)) * Math.sqrt(N - z.length - 3);
            double expected = 2 * (1 - normal.cumulativeProbability(Math.abs(zStat)));
            double actual = test.pValue(xy[0], xy[1], z);
            assertEquals(expected, actual, 1e-9 + 1e-7 * expected);
        }
    }

    @Test
    @DisplayName("p-value from Commons Numbers' Erfc = 2Φ(−|z|) from Commons Math's NormalDistribution to 1e-12 relative, |z| up to 35")
    void pValueTailIsExact() {
        // 2Φ(−|z|) = erfc(|z|/√2); Commons Math 3.6.1 computes Φ through its own erfc (incomplete gamma), a
        // different algorithm from Commons Numbers' rational approximations, so agreement checks both.
        NormalDistribution normal = new NormalDistribution(0, 1);
        UniformRandomProvider rng = Seeds.random(41);
        long n = 1000;
        int checked = 0;
        for (int rep = 0; rep < 20_000; rep++) {
            int k = rep % 4;
            // |z| = atanh(|r|) √(n − k − 3) spread over 0 … 35 (p-values down to about 1e-268).
            double target = 35.0 * rep / 20_000 + 1e-3 * rng.nextDouble();
            double r = Math.tanh(target / Math.sqrt(n - k - 3.0)) * (rng.nextBoolean() ? 1 : -1);
            double zStat = FisherZTest.statistic(r, n, k);
            double expected = 2 * normal.cumulativeProbability(-Math.abs(zStat));
            double actual = FisherZTest.pValue(r, n, k);
            assertEquals(expected, actual, 1e-12 * expected, "r=" + r + " z=" + zStat);
            checked++;
        }
        assertEquals(20_000, checked);
        assertEquals(1.0, FisherZTest.pValue(0.0, n, 0), 1e-15);
        assertEquals(1.0, FisherZTest.pValue(Double.NaN, n, 0));
    }

    @Test
    @DisplayName("the fast decision (threshold on |r|) equals p > alpha")
    void fastDecisionAgreesWithPValue() {
        double[][] cols = TestData.correlated(P, 60, 5);
        DataSet data = TestData.continuous(cols);
        UniformRandomProvider rng = Seeds.random(6);
        int[] xy = new int[2];
        int agreements = 0;
        for (double alpha : new double[] {0.001, 0.01, 0.05, 0.2}) {
            FisherZTest test = FisherZTest.of(data, alpha);
            for (int rep = 0; rep < 300; rep++) {
                int[] z = randomTriple(rng, P, rep % 6, xy);
                double pv = test.pValue(xy[0], xy[1], z);
                if (Math.abs(pv - alpha) < 1e-9) {
                    continue;
                }
                assertEquals(pv > alpha, test.independent(xy[0], xy[1], z), "p=" + pv + " alpha=" + alpha);
                agreements++;
            }
        }
        assertTrue(agreements > 1000);
    }

    @Test
    @DisplayName("a conditioning variable that copies another is ignored; a target determined by S is independent")
    void collinearConditioningSets() {
        double[][] cols = TestData.correlated(4, N, 7);
        double[][] withCopy = Arrays.copyOf(cols, 6);
        withCopy[4] = cols[2].clone();
        withCopy[5] = new double[N];
        for (int r = 0; r < N; r++) {
            withCopy[5][r] = 2 * cols[2][r] - cols[3][r];
        }
        FisherZTest test = FisherZTest.of(TestData.continuous(withCopy), 0.05);
        assertEquals(test.partialCorrelation(0, 1, new int[] {2}), test.partialCorrelation(0, 1, new int[] {2, 4}), 1e-7);
        assertEquals(test.partialCorrelation(0, 1, new int[] {2, 3}),
                test.partialCorrelation(0, 1, new int[] {2, 3, 5}), 1e-7);
        assertEquals(test.partialCorrelation(0, 1, new int[] {2, 3}),
                test.partialCorrelation(0, 1, new int[] {2, 4, 3, 5}), 1e-7);
        // V5 is a linear function of V2 and V3: given both, it carries nothing more.
        assertEquals(1.0, test.pValue(5, 0, new int[] {2, 3}));
        assertTrue(test.independent(5, 0, new int[] {2, 3}));
    }

    @Test
    @DisplayName("test-wise deletion equals Fisher z on the rows complete for the test's variables (Tu et al. 2019)")
    void testwiseDeletion() {
        double[][] cols = TestData.correlated(5, N, 8);
        double[][] holed = new double[5][];
        UniformRandomProvider rng = Seeds.random(9);
        for (int j = 0; j < 5; j++) {
            holed[j] = cols[j].clone();
            for (int r = 0; r < N; r++) {
                if (rng.nextDouble() < 0.1) {
                    holed[j][r] = Double.NaN;
                }
            }
        }
        DataSet data = TestData.continuous(holed);
        TestwiseFisherZTest test = new TestwiseFisherZTest(data, 0.05);
        int[][] zs = {{}, {2}, {2, 3}, {2, 3, 4}};
        for (int[] z : zs) {
            int[] vars = IntStream.concat(IntStream.of(0, 1), Arrays.stream(z)).toArray();
            int[] rows = IntStream.range(0, N).filter(r -> Arrays.stream(vars).noneMatch(v -> Double.isNaN(holed[v][r])))
                    .toArray();
            double[][] sub = new double[5][];
            for (int j = 0; j < 5; j++) {
                final int col = j;
                sub[j] = Arrays.stream(rows).mapToDouble(r -> holed[col][r] == holed[col][r] ? holed[col][r] : 0).toArray();
            }
            double r = residualCorrelation(sub, 0, 1, z);
            double zStat = 0.5 * Math.log((1 + r) / (1 - r)) * Math.sqrt(rows.length - z.length - 3);
            double expected = 2 * (1 - new NormalDistribution(0, 1).cumulativeProbability(Math.abs(zStat)));
            assertEquals(expected, test.pValue(0, 1, z), 1e-9 + 1e-7 * expected, Arrays.toString(z));
        }
        // Without missing cells the two Fisher z tests agree.
        DataSet full = TestData.continuous(cols);
        FisherZTest shared = FisherZTest.of(full, 0.05);
        TestwiseFisherZTest each = new TestwiseFisherZTest(full, 0.05);
        for (int[] z : zs) {
            assertEquals(shared.pValue(0, 1, z), each.pValue(0, 1, z), 1e-9);
        }
    }

    @Test
    @DisplayName("concurrent calls give the same answers as sequential ones (thread safety)")
    void threadSafe() {
        double[][] cols = TestData.correlated(10, 200, 10);
        FisherZTest test = FisherZTest.of(TestData.continuous(cols), 0.05);
        int[][] z = new int[2000][];
        int[][] xy = new int[2000][2];
        UniformRandomProvider rng = Seeds.random(11);
        for (int i = 0; i < z.length; i++) {
            z[i] = randomTriple(rng, 10, i % 7, xy[i]);
        }
        double[] seq = new double[z.length];
        for (int i = 0; i < z.length; i++) {
            seq[i] = test.partialCorrelation(xy[i][0], xy[i][1], z[i]);
        }
        double[] par = IntStream.range(0, z.length).parallel()
                .mapToDouble(i -> test.partialCorrelation(xy[i][0], xy[i][1], z[i])).toArray();
        for (int i = 0; i < z.length; i++) {
            assertEquals(seq[i], par[i], 0.0);
        }
    }
}
