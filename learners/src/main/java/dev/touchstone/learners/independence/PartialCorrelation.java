package dev.touchstone.learners.independence;

/**
 * Partial correlation of two variables given a set, computed from a covariance (or
 * correlation) matrix stored row-major: the residual covariance of (x, y) after regressing
 * both on {@code z}, obtained through a Cholesky factor of the {@code z} block.
 *
 * <p>For |z| ≤ 3 the factor and the two triangular solves are written out with local
 * variables, so that a call allocates nothing (this is the hot path of PC). Larger sets use
 * a per-thread scratch array. A {@code z} variable that is (numerically) a linear function
 * of earlier ones gets a zero pivot and is skipped, which is what regression on the rest
 * would do. Cost O(|z|³) arithmetic per call with O(|z|²) matrix reads.
 *
 * <p>The result is the sample partial correlation of Kalisch and Bühlmann (2007, "Estimating
 * high-dimensional directed acyclic graphs with the PC-algorithm", JMLR 8), equal to the
 * correlation of the least-squares residuals of x and y on z.
 */
final class PartialCorrelation {

    /** Pivots below this fraction of their diagonal entry count as zero. */
    static final double RELATIVE_PIVOT = 1e-10;

    private static final ThreadLocal<double[]> SCRATCH = ThreadLocal.withInitial(() -> new double[64]);

    private PartialCorrelation() {
    }

    /**
     * The partial correlation of x and y given z, or {@code NaN} when x or y is (numerically)
     * determined by z, so that its residual has no variance.
     *
     * @param m row-major p × p covariance or correlation matrix
     * @param p its dimension
     */
    static double of(double[] m, int p, int x, int y, int[] z) {
        return of(m, p, x, y, z, z.length);
    }

    /** As {@link #of(double[], int, int, int, int[])} for the first {@code k} entries of {@code z}. */
    static double of(double[] m, int p, int x, int y, int[] z, int k) {
        int xr = x * p;
        int yr = y * p;
        double sxx = m[xr + x];
        double syy = m[yr + y];
        double sxy = m[xr + y];
        switch (k) {
            case 0:
                return finish(sxx, syy, sxy, sxx, syy);
            case 1: {
                int a = z[0];
                double d = m[a * p + a];
                if (!(d > 0)) {
                    return finish(sxx, syy, sxy, sxx, syy);
                }
                double inv = 1.0 / d;
                double xa = m[xr + a];
                double ya = m[yr + a];
                return finish(sxx - xa * xa * inv, syy - ya * ya * inv, sxy - xa * ya * inv, sxx, syy);
            }
            case 2:
                return two(m, p, xr, yr, z[0], z[1], sxx, syy, sxy);
            case 3:
                return three(m, p, xr, yr, z[0], z[1], z[2], sxx, syy, sxy);
            default:
                return general(m, p, x, y, z, k, sxx, syy, sxy);
        }
    }

    /**
     * The partial correlation given the empty set of two variables with correlation r on a unit
     * diagonal: what {@link #of} returns for k = 0 on a correlation matrix (r clamped to [−1, 1]).
     */
    static double unconditional(double r) {
        return finish(1.0, 1.0, r, 1.0, 1.0);
    }

    private static double two(double[] m, int p, int xr, int yr, int a, int b,
                              double sxx, double syy, double sxy) {
        double saa = m[a * p + a];
        double sbb = m[b * p + b];
        double sba = m[b * p + a];
        // Cholesky of [[saa, sba], [sba, sbb]]; a zero pivot drops that variable.
        double l11 = pivot(saa, saa);
        double l21 = l11 > 0 ? sba / l11 : 0;
        double l22 = pivot(sbb - l21 * l21, sbb);
        double xa = m[xr + a];
        double xb = m[xr + b];
        double ya = m[yr + a];
        double yb = m[yr + b];
        double u1 = l11 > 0 ? xa / l11 : 0;
        double u2 = l22 > 0 ? (xb - l21 * u1) / l22 : 0;
        double v1 = l11 > 0 ? ya / l11 : 0;
        double v2 = l22 > 0 ? (yb - l21 * v1) / l22 : 0;
        return finish(sxx - u1 * u1 - u2 * u2, syy - v1 * v1 - v2 * v2, sxy - u1 * v1 - u2 * v2, sxx, syy);
    }

    private static double three(double[] m, int p, int xr, int yr, int a, int b, int c,
                                double sxx, double syy, double sxy) {
        int ar = a * p;
        int br = b * p;
        int cr = c * p;
        double saa = m[ar + a];
        double sbb = m[br + b];
        double scc = m[cr + c];
        double sba = m[br + a];
        double sca = m[cr + a];
        double scb = m[cr + b];
        double l11 = pivot(saa, saa);
        double l21 = l11 > 0 ? sba / l11 : 0;
        double l31 = l11 > 0 ? sca / l11 : 0;
        double l22 = pivot(sbb - l21 * l21, sbb);
        double l32 = l22 > 0 ? (scb - l31 * l21) / l22 : 0;
        double l33 = pivot(scc - l31 * l31 - l32 * l32, scc);
        double xa = m[xr + a];
        double xb = m[xr + b];
        double xc = m[xr + c];
        double ya = m[yr + a];
        double yb = m[yr + b];
        double yc = m[yr + c];
        double u1 = l11 > 0 ? xa / l11 : 0;
        double u2 = l22 > 0 ? (xb - l21 * u1) / l22 : 0;
        double u3 = l33 > 0 ? (xc - l31 * u1 - l32 * u2) / l33 : 0;
        double v1 = l11 > 0 ? ya / l11 : 0;
        double v2 = l22 > 0 ? (yb - l21 * v1) / l22 : 0;
        double v3 = l33 > 0 ? (yc - l31 * v1 - l32 * v2) / l33 : 0;
        return finish(sxx - u1 * u1 - u2 * u2 - u3 * u3, syy - v1 * v1 - v2 * v2 - v3 * v3,
                sxy - u1 * v1 - u2 * v2 - u3 * v3, sxx, syy);
    }

    private static double general(double[] m, int p, int x, int y, int[] z, int k,
                                  double sxx, double syy, double sxy) {
        // Layout: L (k × k, lower triangle used), then u (k), then v (k).
        int need = k * k + 2 * k;
        double[] w = SCRATCH.get();
        if (w.length < need) {
            w = new double[Math.max(need, 2 * w.length)];
            SCRATCH.set(w);
        }
        int uo = k * k;
        int vo = uo + k;
        int xr = x * p;
        int yr = y * p;
        for (int i = 0; i < k; i++) {
            int zi = z[i];
            int zr = zi * p;
            for (int j = 0; j < i; j++) {
                double s = m[zr + z[j]];
                for (int t = 0; t < j; t++) {
                    s -= w[i * k + t] * w[j * k + t];
                }
                double ljj = w[j * k + j];
                w[i * k + j] = ljj > 0 ? s / ljj : 0;
            }
            double d = m[zr + zi];
            for (int t = 0; t < i; t++) {
                d -= w[i * k + t] * w[i * k + t];
            }
            double lii = pivot(d, m[zr + zi]);
            w[i * k + i] = lii;
            double su = m[xr + zi];
            double sv = m[yr + zi];
            for (int t = 0; t < i; t++) {
                su -= w[i * k + t] * w[uo + t];
                sv -= w[i * k + t] * w[vo + t];
            }
            w[uo + i] = lii > 0 ? su / lii : 0;
            w[vo + i] = lii > 0 ? sv / lii : 0;
        }
        double rxx = sxx;
        double ryy = syy;
        double rxy = sxy;
        for (int i = 0; i < k; i++) {
            double u = w[uo + i];
            double v = w[vo + i];
            rxx -= u * u;
            ryy -= v * v;
            rxy -= u * v;
        }
        return finish(rxx, ryy, rxy, sxx, syy);
    }

    /** The square root of a pivot, or 0 when it is not clearly positive relative to its diagonal entry. */
    private static double pivot(double d, double diagonal) {
        return d > RELATIVE_PIVOT * diagonal && d > 0 ? Math.sqrt(d) : 0;
    }

    private static double finish(double rxx, double ryy, double rxy, double sxx, double syy) {
        if (!(rxx > RELATIVE_PIVOT * sxx) || !(ryy > RELATIVE_PIVOT * syy)) {
            return Double.NaN;
        }
        double r = rxy / Math.sqrt(rxx * ryy);
        return r > 1 ? 1 : r < -1 ? -1 : r;
    }
}
