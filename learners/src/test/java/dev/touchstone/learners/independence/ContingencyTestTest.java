package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import org.apache.commons.math3.stat.inference.ChiSquareTest;
import org.apache.commons.math3.stat.inference.GTest;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ContingencyTestTest {

    private static long[][] table(int[] x, int[] y, int kx, int ky, int[] z, int zValue) {
        long[][] t = new long[kx][ky];
        for (int r = 0; r < x.length; r++) {
            if (z == null || z[r] == zValue) {
                t[x[r]][y[r]]++;
            }
        }
        return t;
    }

    /** G of an r × c table with Commons Math: observed cells against margins-product expectations. */
    static double commonsG(long[][] t) {
        int rows = t.length;
        int cols = t[0].length;
        long n = 0;
        long[] rs = new long[rows];
        long[] cs = new long[cols];
        for (int i = 0; i < rows; i++) {
            for (int j = 0; j < cols; j++) {
                rs[i] += t[i][j];
                cs[j] += t[i][j];
                n += t[i][j];
            }
        }
        double[] expected = new double[rows * cols];
        long[] observed = new long[rows * cols];
        for (int i = 0; i < rows; i++) {
            for (int j = 0; j < cols; j++) {
                expected[i * cols + j] = (double) rs[i] * cs[j] / n;
                observed[i * cols + j] = t[i][j];
            }
        }
        return new GTest().g(expected, observed);
    }

    @Test
    @DisplayName("unconditional G² equals Commons Math GTest: r × c via g(expected, observed), 2 × c with p-value")
    void unconditionalGSquareMatchesCommonsMath() {
        int[] cards = {3, 4, 2};
        int[][] codes = TestData.discrete(cards, 500, 0.3, 21);
        DataSet data = TestData.discreteData(codes, cards);
        ContingencyTest g2 = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05);
        long[][] t = table(codes[0], codes[1], 3, 4, null, 0);
        ContingencyTest.Result r = g2.evaluate(0, 1, new int[0]);
        assertEquals(commonsG(t), r.statistic(), 1e-9);
        assertEquals(1 - new org.apache.commons.math3.distribution.ChiSquaredDistribution(6).cumulativeProbability(
                commonsG(t)), r.pValue(), 1e-9);
        assertEquals(6, r.degreesOfFreedom());
        // A 2 × 4 table: GTest's two-sample comparison is the independence test with 3 df.
        long[][] two = table(codes[2], codes[1], 2, 4, null, 0);
        ContingencyTest.Result r2 = g2.evaluate(2, 1, new int[0]);
        assertEquals(new GTest().gDataSetsComparison(two[0], two[1]), r2.statistic(), 1e-9);
        assertEquals(new GTest().gTestDataSetsComparison(two[0], two[1]), r2.pValue(), 1e-9);
    }

    @Test
    @DisplayName("unconditional χ² statistic and p-value equal Commons Math ChiSquareTest")
    void unconditionalChiSquareMatchesCommonsMath() {
        int[] cards = {3, 4, 2};
        int[][] codes = TestData.discrete(cards, 500, 0.2, 22);
        DataSet data = TestData.discreteData(codes, cards);
        ContingencyTest chi = new ContingencyTest(data, ContingencyTest.Statistic.CHI_SQUARE, 0.05);
        long[][] t = table(codes[1], codes[2], 4, 2, null, 0);
        ContingencyTest.Result r = chi.evaluate(1, 2, new int[0]);
        assertEquals(new ChiSquareTest().chiSquare(t), r.statistic(), 1e-9);
        assertEquals(new ChiSquareTest().chiSquareTest(t), r.pValue(), 1e-9);
    }

    @Test
    @DisplayName("conditional G² is the sum of Commons Math GTest statistics over strata; df per stratum")
    void conditionalGSquareIsSumOverStrata() {
        int[] cards = {3, 3, 3};
        int[][] codes = TestData.discrete(cards, 900, 0.5, 23);
        DataSet data = TestData.discreteData(codes, cards);
        ContingencyTest g2 = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05);
        double expected = 0;
        for (int s = 0; s < 3; s++) {
            expected += commonsG(table(codes[1], codes[2], 3, 3, codes[0], s));
        }
        ContingencyTest.Result r = g2.evaluate(1, 2, new int[] {0});
        assertEquals(expected, r.statistic(), 1e-9);
        assertEquals(12, r.degreesOfFreedom(), "(3−1)(3−1) per stratum, 3 strata");
        assertEquals(1 - new org.apache.commons.math3.distribution.ChiSquaredDistribution(12)
                .cumulativeProbability(expected), r.pValue(), 1e-9);
    }

    @Test
    @DisplayName("empty rows and columns of a stratum's table reduce its degrees of freedom (declared rule)")
    void emptyCellsReduceDegreesOfFreedom() {
        // Stratum z=0: x takes only values 0 and 1 of 3, y all 3 → (2−1)(3−1) = 2.
        // Stratum z=1: x takes all 3, y only 0 → (3−1)(1−1) = 0. Stratum z=2: no rows.
        List<int[]> rows = new ArrayList<>();
        for (int i = 0; i < 60; i++) {
            rows.add(new int[] {i % 2, (i / 2) % 3, 0});
            rows.add(new int[] {i % 3, 0, 1});
        }
        int n = rows.size();
        int[][] codes = new int[3][n];
        for (int r = 0; r < n; r++) {
            for (int j = 0; j < 3; j++) {
                codes[j][r] = rows.get(r)[j];
            }
        }
        DataSet data = TestData.discreteData(codes, new int[] {3, 3, 3});
        ContingencyTest.Result r = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05)
                .evaluate(0, 1, new int[] {2});
        assertEquals(2, r.degreesOfFreedom());
        // A table with nothing to test accepts independence.
        ContingencyTest.Result none = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05)
                .evaluate(0, 1, new int[] {1});
        assertEquals(0, none.degreesOfFreedom());
        assertEquals(1.0, none.pValue());
    }

    @Test
    @DisplayName("textbook degrees of freedom (|X|−1)(|Y|−1)·|strata| against a hand-computed table: G² = 120 ln 1.5 − 40 ln 2,"
            + " χ²₂ and χ²₄ tails in closed form (Agresti 2002, §3.2 and §6.3)")
    void textbookDegreesOfFreedomByHand() {
        // x has 3 categories but only 0 and 1 occur; y has 2; z has 2 but only z = 0 occurs.
        // Table (x by y): [[30, 10], [10, 30], [0, 0]]; all expected counts are 20, so
        // G² = 2 (30 ln 1.5 + 10 ln 0.5 + 10 ln 0.5 + 30 ln 1.5) = 120 ln 1.5 − 40 ln 2.
        int[][] counts = {{30, 10}, {10, 30}};
        List<int[]> rows = new ArrayList<>();
        for (int x = 0; x < 2; x++) {
            for (int y = 0; y < 2; y++) {
                for (int k = 0; k < counts[x][y]; k++) {
                    rows.add(new int[] {x, y, 0});
                }
            }
        }
        int[][] codes = new int[3][rows.size()];
        for (int r = 0; r < rows.size(); r++) {
            for (int j = 0; j < 3; j++) {
                codes[j][r] = rows.get(r)[j];
            }
        }
        DataSet data = TestData.discreteData(codes, new int[] {3, 2, 2});
        double g = 120 * Math.log(1.5) - 40 * Math.log(2);
        ContingencyTest textbook = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05,
                ContingencyTest.DegreesOfFreedom.TEXTBOOK);
        ContingencyTest reduced = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05);
        ContingencyTest.Result t0 = textbook.evaluate(0, 1, new int[0]);
        assertEquals(g, t0.statistic(), 1e-9);
        assertEquals(2, t0.degreesOfFreedom(), "(3 − 1)(2 − 1)");
        assertEquals(Math.exp(-g / 2), t0.pValue(), 1e-12, "χ²₂ tail: exp(−x/2)");
        ContingencyTest.Result t1 = textbook.evaluate(0, 1, new int[] {2});
        assertEquals(4, t1.degreesOfFreedom(), "(3 − 1)(2 − 1) · 2 strata, the empty one included");
        assertEquals(Math.exp(-g / 2) * (1 + g / 2), t1.pValue(), 1e-12, "χ²₄ tail: exp(−x/2)(1 + x/2)");
        ContingencyTest.Result r1 = reduced.evaluate(0, 1, new int[] {2});
        assertEquals(g, r1.statistic(), 1e-9);
        assertEquals(1, r1.degreesOfFreedom(), "reduced: (2 − 1)(2 − 1) in the one stratum with data");
        assertEquals(org.apache.commons.math3.special.Erf.erfc(Math.sqrt(g / 2)), r1.pValue(), 1e-12,
                "χ²₁ tail: erfc(√(x/2))");
        assertEquals(4, new ContingencyTest(data, ContingencyTest.Statistic.CHI_SQUARE, 0.05,
                ContingencyTest.DegreesOfFreedom.TEXTBOOK).evaluate(0, 1, new int[] {2}).degreesOfFreedom());
    }

    @Test
    @DisplayName("missing codes are left out test by test (test-wise deletion)")
    void missingCodesAreSkipped() {
        int[] cards = {2, 2, 2};
        int[][] codes = TestData.discrete(cards, 400, 0.4, 24);
        int[][] holed = {codes[0].clone(), codes[1].clone(), codes[2].clone()};
        for (int r = 0; r < 400; r += 7) {
            holed[2][r] = DataSet.MISSING_CODE;
        }
        DataSet data = TestData.discreteData(holed, cards);
        ContingencyTest g2 = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05);
        assertEquals(400, g2.evaluate(0, 1, new int[0]).rowsUsed());
        assertEquals(400 - 58, g2.evaluate(0, 1, new int[] {2}).rowsUsed());
        assertEquals(commonsG(table(codes[0], codes[1], 2, 2, null, 0)), g2.evaluate(0, 1, new int[0]).statistic(),
                1e-9);
    }

    @Test
    @DisplayName("many strata (sparse keys) give the same statistic as the direct index")
    void sparseStrataPath() {
        int[] cards = {2, 2, 5, 5, 5, 5, 5};
        int[][] codes = TestData.discrete(cards, 120, 0.5, 25);
        DataSet data = TestData.discreteData(codes, cards);
        ContingencyTest g2 = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05);
        ContingencyTest.Result sparse = g2.evaluate(0, 1, new int[] {2, 3, 4, 5, 6});
        // Re-code the five strata variables into one column of observed configurations.
        int[] combined = new int[120];
        java.util.Map<Integer, Integer> ids = new java.util.HashMap<>();
        for (int r = 0; r < 120; r++) {
            int key = 0;
            for (int j = 2; j < 7; j++) {
                key = key * 5 + codes[j][r];
            }
            combined[r] = ids.computeIfAbsent(key, k -> ids.size());
        }
        DataSet direct = TestData.discreteData(new int[][] {codes[0], codes[1], combined},
                new int[] {2, 2, ids.size()});
        ContingencyTest.Result dense = new ContingencyTest(direct, ContingencyTest.Statistic.G_SQUARE, 0.05)
                .evaluate(0, 1, new int[] {2});
        assertEquals(dense.statistic(), sparse.statistic(), 1e-9);
        assertEquals(dense.degreesOfFreedom(), sparse.degreesOfFreedom());
        assertTrue(sparse.rowsUsed() == 120);
    }
}
