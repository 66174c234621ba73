package dev.touchstone.core.data;

import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * The pairwise and tiled correlations of {@link CentredColumns} against the matrix of
 * {@link DataSet#covariance()} and {@link CovarianceMatrix#correlation()}: bitwise equal (so that
 * a test decision taken from either is the same decision), and close to Commons Math's
 * Pearson correlation (the outside check of the values themselves).
 */
class CentredColumnsTest {

    /** n × p data with a shared factor, a mean far from 0 and, when asked, a discrete column and missing cells. */
    private static DataSet data(int n, int p, long seed, boolean missing) {
        UniformRandomProvider rng = Seeds.random(seed);
        double[][] cols = new double[p][n];
        for (int r = 0; r < n; r++) {
            double shared = rng.nextDouble() * 2 - 1;
            for (int j = 0; j < p; j++) {
                cols[j][r] = 50 + j + shared * (j % 4) + (rng.nextDouble() - 0.5) * (1 + j % 3);
            }
        }
        if (missing) {
            for (int k = 0; k < n / 10; k++) {
                cols[rng.nextInt(p)][rng.nextInt(n)] = Double.NaN;
            }
        }
        DataSet.Builder b = DataSet.builder(n);
        for (int j = 0; j < p - 1; j++) {
            b.continuous("x" + j, cols[j]);
        }
        int[] codes = new int[n];
        for (int r = 0; r < n; r++) {
            codes[r] = rng.nextInt(3);
        }
        b.discrete(Variable.discrete("d", 3), codes);
        return b.build();
    }

    @Test
    @DisplayName("plain blocked kernel: pairwise and tiled correlations are bitwise those of the correlation matrix: n below, at and above a 256-row panel, n mod 4 = 0…3, missing cells, a discrete column")
    void blockedKernelBitwiseEqualToTheMatrix() {
        bitwiseEqualToTheMatrix(new BlockedTileKernel());
    }

    @Test
    @DisplayName("Vector API kernel: the same bitwise equality, tiles with full strips, partial strips and row counts not a multiple of 4")
    void vectorKernelBitwiseEqualToTheMatrix() {
        assumeTrue(TileKernel.vectorAvailable(), "vector kernel skipped: the JVM runs without --add-modules jdk.incubator.vector");
        bitwiseEqualToTheMatrix(new VectorTileKernel());
    }

    @Test
    @DisplayName("one worker of each kernel reused over tiles of different shapes in one block of 256 columns gives the matrix's bits (scratch reuse)")
    void workersReusedOverTiles() {
        DataSet d = data(530, 300, 41, true);
        CovarianceMatrix corr = d.covariance().correlation();
        CentredColumns c = CentredColumns.of(d);
        java.util.List<TileKernel> kernels = new java.util.ArrayList<>(java.util.List.of(new BlockedTileKernel()));
        if (TileKernel.vectorAvailable()) {
            kernels.add(new VectorTileKernel());
        }
        int[][] tiles = {{0, 128, 0, 256}, {128, 256, 0, 256}, {5, 38, 256, 300}, {0, 3, 17, 18}, {250, 299, 40, 296}};
        for (TileKernel kernel : kernels) {
            CentredColumns.TileWorker w = c.tileWorker(kernel);
            for (int[] t : tiles) {
                double[] out = new double[(t[1] - t[0]) * (t[3] - t[2])];
                w.correlations(t[0], t[1], t[2], t[3], out);
                for (int i = t[0]; i < t[1]; i++) {
                    for (int j = t[2]; j < t[3]; j++) {
                        assertEquals(Double.doubleToRawLongBits(corr.get(i, j)),
                                Double.doubleToRawLongBits(out[(i - t[0]) * (t[3] - t[2]) + j - t[2]]),
                                kernel.getClass().getSimpleName() + " pair " + i + "," + j);
                    }
                }
            }
        }
    }

    private static void bitwiseEqualToTheMatrix(TileKernel kernel) {
        int[] sizes = {3, 7, 64, 255, 256, 257, 530, 1001};
        int checked = 0;
        for (int t = 0; t < sizes.length; t++) {
            // p up to 54: with i0 = 1 and j0 = 2 the tiles have 4-row blocks and left-over rows, and
            // (for 512- or 256-bit vectors) full strips of 16 or 8 columns and left-over columns.
            int p = 5 + 7 * t;
            DataSet d = data(sizes[t], p, 900 + t, t % 2 == 1);
            CovarianceMatrix corr = d.covariance().correlation();
            CentredColumns c = CentredColumns.of(d);
            assertEquals(corr.sampleSize(), c.sampleSize());
            int i0 = 1;
            int i1 = p - 1;
            int j0 = 2;
            int j1 = p;
            double[] tile = new double[(i1 - i0) * (j1 - j0)];
            c.tileWorker(kernel).correlations(i0, i1, j0, j1, tile);
            for (int i = 0; i < p; i++) {
                for (int j = 0; j < p; j++) {
                    long expected = Double.doubleToRawLongBits(corr.get(i, j));
                    assertEquals(expected, Double.doubleToRawLongBits(c.correlation(i, j)), "n " + sizes[t] + " pair " + i + "," + j);
                    if (i >= i0 && i < i1 && j >= j0 && j < j1) {
                        assertEquals(expected, Double.doubleToRawLongBits(tile[(i - i0) * (j1 - j0) + j - j0]),
                                kernel.getClass().getSimpleName() + " tile, n " + sizes[t] + " pair " + i + "," + j);
                        checked++;
                    }
                }
            }
        }
        assertEquals(true, checked > 2000, checked + " tile entries");
    }

    @Test
    @DisplayName("the correlations agree with Commons Math's PearsonsCorrelation to 1e-12")
    void closeToCommonsMath() {
        DataSet d = data(700, 12, 77, false);
        CentredColumns c = CentredColumns.of(d);
        double[][] rows = new double[700][12];
        for (int j = 0; j < 12; j++) {
            double[] v = Covariances.asDoubles(d, j);
            for (int r = 0; r < 700; r++) {
                rows[r][j] = v[r];
            }
        }
        org.apache.commons.math3.linear.RealMatrix ref = new PearsonsCorrelation(rows).getCorrelationMatrix();
        for (int i = 0; i < 12; i++) {
            for (int j = 0; j < 12; j++) {
                assertEquals(ref.getEntry(i, j), c.correlation(i, j), 1e-12, i + "," + j);
            }
        }
    }
}
