package dev.touchstone.core.data;

import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.stat.correlation.Covariance;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import dev.touchstone.core.random.Seeds;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class CovariancesTest {

    /** n × p data with correlated columns and a non-zero mean, so that centring matters. */
    private static double[][] randomColumns(UniformRandomProvider rng, int n, int p) {
        double[][] cols = new double[p][n];
        for (int r = 0; r < n; r++) {
            double shared = rng.nextDouble() * 2 - 1;
            for (int j = 0; j < p; j++) {
                cols[j][r] = 100 + j + shared * (j % 3) + (rng.nextDouble() - 0.5) * (1 + j % 5);
            }
        }
        return cols;
    }

    private static DataSet dataSet(double[][] cols) {
        DataSet.Builder b = DataSet.builder(cols.length == 0 ? 0 : cols[0].length);
        for (int j = 0; j < cols.length; j++) {
            b.continuous("x" + j, cols[j]);
        }
        return b.build();
    }

    private static void assertMatchesCommonsMath(double[][] cols, CovarianceMatrix c) {
        int p = cols.length;
        int n = cols[0].length;
        double[][] rowMajor = new double[n][p];
        for (int j = 0; j < p; j++) {
            for (int r = 0; r < n; r++) {
                rowMajor[r][j] = cols[j][r];
            }
        }
        RealMatrix ref = new Covariance(rowMajor, true).getCovarianceMatrix();
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                double expected = ref.getEntry(i, j);
                double scale = Math.sqrt(ref.getEntry(i, i) * ref.getEntry(j, j));
                assertEquals(expected, c.get(i, j), 1e-12 * scale, "entry " + i + "," + j);
                assertEquals(c.get(i, j), c.get(j, i), 0.0, "symmetric at " + i + "," + j);
            }
        }
    }

    @Test
    @DisplayName("sample covariance matches Commons Math 3.6.1 Covariance (bias-corrected) on random data of awkward shapes")
    void matchesCommonsMath() {
        UniformRandomProvider rng = Seeds.random(7);
        // shapes straddle the kernel's 4-row/4-column tiles, its 256-column blocks and 256-row panels
        int[][] shapes = {{2, 1}, {3, 2}, {5, 3}, {17, 5}, {257, 7}, {300, 258}, {513, 131}, {1031, 9}};
        for (int[] shape : shapes) {
            double[][] cols = randomColumns(rng, shape[0], shape[1]);
            CovarianceMatrix c = Covariances.sample(dataSet(cols));
            assertEquals(shape[0], c.sampleSize());
            assertEquals(shape[1], c.dimension());
            assertMatchesCommonsMath(cols, c);
        }
    }

    @Test
    @DisplayName("results are bitwise identical for 1, 2, 3 and 8 threads")
    void deterministicForAnyThreadCount() {
        double[][] cols = randomColumns(Seeds.random(11), 301, 300);
        DataSet d = dataSet(cols);
        double[] one = Covariances.sample(d, 1).toArray();
        for (int threads : new int[] {2, 3, 8}) {
            assertArrayEquals(one, Covariances.sample(d, threads).toArray(), 0.0, threads + " threads");
        }
    }

    @Test
    @DisplayName("missing cells: rows with any missing cell are left out (list-wise deletion), checked against Commons Math on the complete rows")
    void listWiseDeletion() {
        UniformRandomProvider rng = Seeds.random(13);
        int n = 120;
        double[][] cols = randomColumns(rng, n, 4);
        int[] codes = new int[n];
        List<Integer> completeRows = new ArrayList<>();
        for (int r = 0; r < n; r++) {
            codes[r] = rng.nextInt(3);
            if (r % 7 == 3) {
                cols[r % 4][r] = Double.NaN;
            } else if (r % 11 == 5) {
                codes[r] = DataSet.MISSING_CODE;
            } else {
                completeRows.add(r);
            }
        }
        DataSet d = DataSet.builder(n)
                .continuous("a", cols[0]).continuous("b", cols[1]).continuous("c", cols[2]).continuous("d", cols[3])
                .discrete(Variable.discrete("k", 3), codes)
                .build();
        CovarianceMatrix c = d.covariance();
        assertEquals(completeRows.size(), c.sampleSize());
        double[][] kept = new double[5][completeRows.size()];
        for (int k = 0; k < completeRows.size(); k++) {
            int r = completeRows.get(k);
            for (int j = 0; j < 4; j++) {
                kept[j][k] = cols[j][r];
            }
            kept[4][k] = codes[r];
        }
        assertMatchesCommonsMath(kept, c);
        assertEquals(List.of("a", "b", "c", "d", "k"), c.names());
    }

    @Test
    void smallCasesAndArguments() {
        CovarianceMatrix one = Covariances.sample(DataSet.builder(1).continuous("x", new double[] {3}).build());
        assertEquals(0.0, one.get(0, 0));
        assertEquals(1, one.sampleSize());
        CovarianceMatrix none = Covariances.sample(DataSet.builder(0).continuous("x", new double[0]).build());
        assertEquals(0, none.sampleSize());
        assertEquals("threads must be at least 1, got 0", assertThrows(IllegalArgumentException.class,
                () -> Covariances.sample(dataSet(new double[][] {{1, 2}}), 0)).getMessage());
        // exact small case by hand: x = (1, 2, 3), y = (2, 4, 7): var x = 1, cov = 2.5, var y = 6.333…
        CovarianceMatrix c = Covariances.sample(dataSet(new double[][] {{1, 2, 3}, {2, 4, 7}}));
        assertEquals(1.0, c.get(0, 0), 1e-15);
        assertEquals(2.5, c.get(0, 1), 1e-15);
        assertEquals(19.0 / 3, c.get(1, 1), 1e-14);
        assertEquals(2.5 / Math.sqrt(19.0 / 3), c.correlation().get(0, 1), 1e-15);
    }
}
