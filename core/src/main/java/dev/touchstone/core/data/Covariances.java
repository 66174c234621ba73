package dev.touchstone.core.data;

/**
 * Computing covariance matrices from data sets.
 *
 * <p>The sample covariance is the textbook unbiased estimator (divisor n − 1) of the
 * centred columns (common practice). Cost O(n p²).
 */
public final class Covariances {

    private Covariances() {
    }

    /** The sample covariance of all columns over the rows complete in every column. */
    public static CovarianceMatrix sample(DataSet data) {
        int p = data.columns();
        int n = data.rows();
        boolean[] keep = new boolean[n];
        int complete = 0;
        for (int r = 0; r < n; r++) {
            boolean ok = true;
            for (int j = 0; j < p && ok; j++) {
                ok = !data.isMissing(r, j);
            }
            keep[r] = ok;
            if (ok) {
                complete++;
            }
        }
        double[][] centred = new double[p][complete];
        for (int j = 0; j < p; j++) {
            double sum = 0;
            int k = 0;
            for (int r = 0; r < n; r++) {
                if (keep[r]) {
                    double v = data.value(r, j);
                    centred[j][k++] = v;
                    sum += v;
                }
            }
            double mean = complete == 0 ? 0 : sum / complete;
            for (int i = 0; i < complete; i++) {
                centred[j][i] -= mean;
            }
        }
        return CovarianceMatrix.wrap(data.names(), crossProduct(centred, complete), complete);
    }

    /** X'X / (n − 1) for columns given as arrays of length n, upper triangle mirrored. */
    static double[] crossProduct(double[][] cols, int n) {
        int p = cols.length;
        double[] out = new double[p * p];
        double div = n > 1 ? n - 1 : 1;
        for (int i = 0; i < p; i++) {
            double[] ci = cols[i];
            for (int j = i; j < p; j++) {
                double[] cj = cols[j];
                double s = 0;
                for (int r = 0; r < n; r++) {
                    s += ci[r] * cj[r];
                }
                out[i * p + j] = s / div;
                out[j * p + i] = s / div;
            }
        }
        return out;
    }
}
