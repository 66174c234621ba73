package dev.touchstone.learners.continuous;

/**
 * The smooth acyclicity function of Zheng et al. (2018, "DAGs with NO TEARS: continuous
 * optimization for structure learning", NeurIPS), h(W) = tr(e^{W∘W}) − d, which is zero
 * exactly when the weighted graph of W has no directed cycle (their Theorem 1), with its
 * gradient ∇h(W) = (e^{W∘W})ᵀ ∘ 2W.
 *
 * <p>The exponential is computed by scaling and squaring with a Taylor series. Because
 * W∘W has no negative entry, every Taylor term is non-negative and nothing cancels, so
 * the series is accurate to rounding; and for a DAG every diagonal term beyond the
 * identity is a sum of products each containing an exact zero, so h is exactly 0.0 in
 * floating point, not merely small.
 *
 * <p>Cost: O(s d³ + m · nnz · d) for s squarings and m Taylor terms (about 18 for dense W,
 * up to 45 for sparse W), s ≈ log₂ of the row-sum norm of W∘W.
 */
final class Acyclicity {

    private static final int MAX_TERMS = 60;
    /**
     * Scale a dense matrix until its row-sum norm is at most this, so the series converges in
     * about 18 terms. A sparse one (as W becomes under the L1 penalty) is scaled less: its
     * Taylor terms cost O(nnz · d) each, the squarings O(d³).
     */
    private static final double SCALED_NORM_DENSE = 0.5;
    private static final double SCALED_NORM_SPARSE = 8;
    private static final double SPARSE_DENSITY = 0.2;

    private Acyclicity() {
    }

    /** h(W) for a row-major d × d matrix. */
    static double value(double[] w, int d) {
        return trace(expOfSquares(w, d), d) - d;
    }

    /** h(W), writing ∇h(W) into {@code gradient} (row-major, length d²). */
    static double valueAndGradient(double[] w, int d, double[] gradient) {
        double[] e = expOfSquares(w, d);
        for (int i = 0; i < d; i++) {
            for (int j = 0; j < d; j++) {
                gradient[i * d + j] = e[j * d + i] * 2 * w[i * d + j];
            }
        }
        return trace(e, d) - d;
    }

    /** e^{W∘W}, row-major. */
    static double[] expOfSquares(double[] w, int d) {
        double[] a = new double[d * d];
        for (int k = 0; k < a.length; k++) {
            a[k] = w[k] * w[k];
        }
        return expNonNegative(a, d);
    }

    /** The matrix exponential of a matrix without negative entries (row-major). */
    static double[] expNonNegative(double[] a, int d) {
        double norm = 0;
        int nonZero = 0;
        for (int i = 0; i < d; i++) {
            double row = 0;
            for (int j = 0; j < d; j++) {
                row += a[i * d + j];
                nonZero += a[i * d + j] != 0 ? 1 : 0;
            }
            norm = Math.max(norm, row);
        }
        double target = nonZero <= SPARSE_DENSITY * d * d ? SCALED_NORM_SPARSE : SCALED_NORM_DENSE;
        int squarings = 0;
        if (norm > target) {
            squarings = (int) Math.ceil(Math.log(norm / target) / Math.log(2));
        }
        double scale = Math.scalb(1.0, -squarings);
        double scaledNorm = norm * scale;
        double[] b = new double[d * d];
        for (int k = 0; k < b.length; k++) {
            b[k] = a[k] * scale;
        }
        double[] result = new double[d * d];
        for (int i = 0; i < d; i++) {
            result[i * d + i] = 1;
        }
        double[] term = result.clone();
        double[] next = new double[d * d];
        for (int k = 1; k <= MAX_TERMS; k++) {
            multiply(b, term, next, d); // b on the left: its zeros are skipped
            double inv = 1.0 / k;
            double largestTerm = 0;
            double largestResult = 0;
            for (int x = 0; x < next.length; x++) {
                next[x] *= inv;
                result[x] += next[x];
                largestTerm = Math.max(largestTerm, next[x]);
                largestResult = Math.max(largestResult, result[x]);
            }
            double[] t = term;
            term = next;
            next = t;
            // Past k ≥ ‖B‖ each further term is at most ‖B‖/(k+1) < 1 times the last, entry-wise.
            if (largestTerm == 0 || (k >= scaledNorm && largestTerm <= 1e-17 * largestResult)) {
                break;
            }
        }
        for (int s = 0; s < squarings; s++) {
            multiply(result, result, next, d);
            double[] t = result;
            result = next;
            next = t;
        }
        return result;
    }

    /** out = x · y for row-major d × d matrices (i-k-j order, skipping zeros of x). */
    static void multiply(double[] x, double[] y, double[] out, int d) {
        java.util.Arrays.fill(out, 0);
        for (int i = 0; i < d; i++) {
            int row = i * d;
            for (int k = 0; k < d; k++) {
                double xik = x[row + k];
                if (xik == 0) {
                    continue;
                }
                int yRow = k * d;
                for (int j = 0; j < d; j++) {
                    out[row + j] += xik * y[yRow + j];
                }
            }
        }
    }

    private static double trace(double[] m, int d) {
        double t = 0;
        for (int i = 0; i < d; i++) {
            t += m[i * d + i];
        }
        return t;
    }
}
