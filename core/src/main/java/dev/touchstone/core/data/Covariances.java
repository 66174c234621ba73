package dev.touchstone.core.data;

/**
 * Computing covariance matrices from data sets.
 *
 * <p>The sample covariance is the textbook unbiased estimator (divisor n − 1) of the
 * centred columns over the rows complete in every column (list-wise deletion; common
 * practice). The centred data are laid out row-major and X'X is formed by the blocked,
 * register-tiled kernel of {@link CrossProduct}; see {@code docs/dev/data-io.md} for the
 * measured speed. Cost O(n p²) time, O(n p + p²) memory. The result is bitwise the same for
 * every thread count.
 */
public final class Covariances {

    /** Rows per block when transposing columns into rows, so that the rows being written stay in cache. */
    private static final int TRANSPOSE_ROWS = 64;

    private Covariances() {
    }

    /** The sample covariance of all columns over the rows complete in every column, on the calling thread. */
    public static CovarianceMatrix sample(DataSet data) {
        return sample(data, 1);
    }

    /**
     * The sample covariance of all columns over the rows complete in every column, using up
     * to {@code threads} threads (the result does not depend on the number).
     *
     * @throws IllegalArgumentException if {@code threads} is less than 1
     */
    public static CovarianceMatrix sample(DataSet data, int threads) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1, got " + threads);
        }
        int p = data.columns();
        double[][] rows = centredRows(data);
        int complete = rows.length;
        double[][] upper = CrossProduct.upper(rows, p, threads);
        double[] out = new double[p * p];
        double div = complete > 1 ? complete - 1 : 1;
        for (int i = 0; i < p; i++) {
            double[] ui = upper[i];
            for (int j = i; j < p; j++) {
                double v = ui[j] / div;
                out[i * p + j] = v;
                out[j * p + i] = v;
            }
        }
        return CovarianceMatrix.wrap(data.names(), out, complete);
    }

    /**
     * The rows complete in every column, each centred by its column's mean over those rows
     * (two passes: the mean first, then the deviations, for accuracy). Discrete columns
     * enter with their codes.
     */
    static double[][] centredRows(DataSet data) {
        int p = data.columns();
        int n = data.rows();
        int[] keep = data.completeRows();
        int m = keep.length;
        double[][] values = new double[p][];
        double[] mean = new double[p];
        for (int j = 0; j < p; j++) {
            values[j] = asDoubles(data, j);
            mean[j] = mean(values[j], keep);
        }
        double[][] rows = new double[m][p];
        boolean all = m == n;
        for (int r0 = 0; r0 < m; r0 += TRANSPOSE_ROWS) {
            int r1 = Math.min(m, r0 + TRANSPOSE_ROWS);
            for (int j = 0; j < p; j++) {
                double[] col = values[j];
                double mu = mean[j];
                for (int k = r0; k < r1; k++) {
                    rows[k][j] = col[all ? k : keep[k]] - mu;
                }
            }
        }
        return rows;
    }

    /** The mean of {@code values} over the rows {@code keep}, summed in their order (0 when there are none). */
    static double mean(double[] values, int[] keep) {
        double sum = 0;
        for (int r : keep) {
            sum += values[r];
        }
        return keep.length == 0 ? 0 : sum / keep.length;
    }

    static double[] asDoubles(DataSet data, int column) {
        if (!data.isDiscrete(column)) {
            return data.continuous(column);
        }
        int[] codes = data.discrete(column);
        double[] out = new double[codes.length];
        for (int r = 0; r < codes.length; r++) {
            out[r] = codes[r] == DataSet.MISSING_CODE ? Double.NaN : codes[r];
        }
        return out;
    }
}
