package dev.touchstone.core.data;

import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

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
    @DisplayName("pairwise and tiled correlations are bitwise those of the correlation matrix: n below, at and above a 256-row panel, n mod 4 = 0…3, missing cells, a discrete column")
    void bitwiseEqualToTheMatrix() {
        int[] sizes = {3, 7, 64, 255, 256, 257, 530, 1001};
        int checked = 0;
        for (int t = 0; t < sizes.length; t++) {
            int p = 5 + 7 * t;
            DataSet d = data(sizes[t], p, 900 + t, t % 2 == 1);
            CovarianceMatrix corr = d.covariance().correlation();
            CentredColumns c = CentredColumns.of(d);
            assertEquals(corr.sampleSize(), c.sampleSize());
            int i0 = 1;
            int i1 = p - 1;
            int j0 = 2;
            int j1 = p;
            double[][] panel = new double[256][j1 - j0];
            double[] sums = new double[(i1 - i0) * (j1 - j0)];
            double[] tile = new double[sums.length];
            c.correlationTile(i0, i1, j0, j1, panel, sums, tile);
            for (int i = 0; i < p; i++) {
                for (int j = 0; j < p; j++) {
                    long expected = Double.doubleToRawLongBits(corr.get(i, j));
                    assertEquals(expected, Double.doubleToRawLongBits(c.correlation(i, j)), "n " + sizes[t] + " pair " + i + "," + j);
                    if (i >= i0 && i < i1 && j >= j0 && j < j1) {
                        assertEquals(expected, Double.doubleToRawLongBits(tile[(i - i0) * (j1 - j0) + j - j0]),
                                "tile, n " + sizes[t] + " pair " + i + "," + j);
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
