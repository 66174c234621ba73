package dev.touchstone.learners.functional;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * A penalised regression spline of one predictor, the P-spline of Eilers and Marx (1996),
 * "Flexible smoothing with B-splines and penalties", Statistical Science 11: a cubic B-spline
 * basis on equally spaced knots over the predictor's range and a second-difference penalty
 * λ‖Dβ‖² on neighbouring coefficients, with λ chosen by generalised cross-validation (Craven and
 * Wahba 1979) over a fixed grid.
 *
 * <p>Everything that depends on the predictor alone — the basis rows, the Gram matrix BᵀB and,
 * for each λ of the grid, (BᵀB + λDᵀD)⁻¹ and the effective degrees of freedom
 * tr((BᵀB + λDᵀD)⁻¹BᵀB) — is computed once, so that smoothing any response against this
 * predictor costs O(4n + grid · m²) for m basis functions. That is what makes the many fits of
 * CAM's search cheap. The penalty leaves constant and linear functions unpenalised, so a fit
 * keeps the response's mean and reproduces an exactly linear response at every λ. The
 * effective degrees of freedom include the constant.
 */
final class PSplineSmoother {

    /** Exponents k of the relative penalties 10^k, from nearly unpenalised to nearly linear. */
    private static final double LOWEST_EXPONENT = -6;
    private static final double HIGHEST_EXPONENT = 4;
    private static final double EXPONENT_STEP = 0.5;

    private final int n;
    private final int m;
    /** Index of the first of the four basis functions non-zero at each row. */
    private final int[] first;
    /** The four non-zero basis values of each row, row-major. */
    private final double[] values;
    private final double[][] gram;
    private final double[] lambdas;
    private final double[][][] inverses;
    private final double[] edf;

    private PSplineSmoother(int n, int m, int[] first, double[] values, double[][] gram, double[] lambdas,
            double[][][] inverses, double[] edf) {
        this.n = n;
        this.m = m;
        this.first = first;
        this.values = values;
        this.gram = gram;
        this.lambdas = lambdas;
        this.inverses = inverses;
        this.edf = edf;
    }

    /**
     * The smoother of predictor {@code x} with {@code segments} equal knot intervals over its
     * range (segments + 3 cubic basis functions).
     *
     * @throws IllegalArgumentException if {@code x} has fewer than 4 values or {@code segments} &lt; 1
     */
    static PSplineSmoother of(double[] x, int segments) {
        if (x.length < 4 || segments < 1) {
            throw new IllegalArgumentException("a P-spline needs at least 4 values and 1 segment");
        }
        int n = x.length;
        int m = segments + 3;
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double v : x) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        // A constant predictor gets an arbitrary unit range: every row then falls in the first
        // segment and the fit is the response's mean, as it should be.
        double width = hi > lo ? (hi - lo) / segments : 1.0;
        int[] first = new int[n];
        double[] values = new double[4 * n];
        for (int i = 0; i < n; i++) {
            double t = (x[i] - lo) / width;
            int s = Math.min(segments - 1, Math.max(0, (int) Math.floor(t)));
            double u = t - s;
            first[i] = s;
            uniformCubic(u, values, 4 * i);
        }
        double[][] gram = new double[m][m];
        for (int i = 0; i < n; i++) {
            int s = first[i];
            for (int a = 0; a < 4; a++) {
                for (int b = 0; b < 4; b++) {
                    gram[s + a][s + b] += values[4 * i + a] * values[4 * i + b];
                }
            }
        }
        double[][] penalty = secondDifferencePenalty(m);
        double scale = 0;
        for (int a = 0; a < m; a++) {
            scale += gram[a][a];
        }
        scale /= m;
        int grid = (int) Math.round((HIGHEST_EXPONENT - LOWEST_EXPONENT) / EXPONENT_STEP) + 1;
        double[] lambdas = new double[grid];
        double[][][] inverses = new double[grid][][];
        double[] edf = new double[grid];
        RealMatrix g = new Array2DRowRealMatrix(gram, false);
        for (int k = 0; k < grid; k++) {
            lambdas[k] = scale * Math.pow(10, LOWEST_EXPONENT + k * EXPONENT_STEP);
            double[][] a = new double[m][m];
            for (int r = 0; r < m; r++) {
                for (int c = 0; c < m; c++) {
                    a[r][c] = gram[r][c] + lambdas[k] * penalty[r][c];
                }
            }
            RealMatrix inv = new CholeskyDecomposition(new Array2DRowRealMatrix(a, false),
                    1e-12, 1e-14).getSolver().getInverse();
            inverses[k] = inv.getData();
            edf[k] = inv.multiply(g).getTrace();
        }
        return new PSplineSmoother(n, m, first, values, gram, lambdas, inverses, edf);
    }

    /**
     * The four non-zero uniform cubic B-spline values at local position u ∈ [0, 1] of a segment
     * (de Boor 1978, the uniform case), written to {@code out} from {@code at}. They sum to 1.
     */
    static void uniformCubic(double u, double[] out, int at) {
        double v = 1 - u;
        out[at] = v * v * v / 6;
        out[at + 1] = (3 * u * u * u - 6 * u * u + 4) / 6;
        out[at + 2] = (-3 * u * u * u + 3 * u * u + 3 * u + 1) / 6;
        out[at + 3] = u * u * u / 6;
    }

    /** DᵀD for the m × (m − 2) second-difference matrix D. */
    private static double[][] secondDifferencePenalty(int m) {
        double[][] p = new double[m][m];
        double[] d = {1, -2, 1};
        for (int r = 0; r + 2 < m; r++) {
            for (int a = 0; a < 3; a++) {
                for (int b = 0; b < 3; b++) {
                    p[r + a][r + b] += d[a] * d[b];
                }
            }
        }
        return p;
    }

    /** The grid index whose effective degrees of freedom are nearest {@code df} (ties to the larger penalty). */
    int indexNearestEdf(double df) {
        int best = 0;
        for (int k = 1; k < edf.length; k++) {
            if (Math.abs(edf[k] - df) <= Math.abs(edf[best] - df)) {
                best = k;
            }
        }
        return best;
    }

    /** Number of penalties tried by generalised cross-validation. */
    int gridSize() {
        return lambdas.length;
    }

    /** The fit of {@code y} with the GCV-chosen penalty: fitted values in {@code fittedOut}. */
    Smooth smooth(double[] y, double[] fittedOut) {
        double[] bty = crossProduct(y);
        double yy = 0;
        for (double v : y) {
            yy += v * v;
        }
        int best = 0;
        double bestGcv = Double.POSITIVE_INFINITY;
        for (int k = 0; k < lambdas.length; k++) {
            double rss = rss(inverses[k], bty, yy);
            double df = n - edf[k];
            double gcv = df > 0 ? n * rss / (df * df) : Double.POSITIVE_INFINITY;
            if (gcv < bestGcv) {
                bestGcv = gcv;
                best = k;
            }
        }
        fit(best, bty, fittedOut);
        return new Smooth(best, lambdas[best], edf[best]);
    }

    /** The fit of {@code y} at grid penalty {@code index}: fitted values in {@code fittedOut}. */
    Smooth smoothAt(int index, double[] y, double[] fittedOut) {
        fit(index, crossProduct(y), fittedOut);
        return new Smooth(index, lambdas[index], edf[index]);
    }

    /** Bᵀy, from the four non-zero basis values of each row. */
    private double[] crossProduct(double[] y) {
        double[] bty = new double[m];
        for (int i = 0; i < n; i++) {
            int s = first[i];
            for (int a = 0; a < 4; a++) {
                bty[s + a] += values[4 * i + a] * y[i];
            }
        }
        return bty;
    }

    private void fit(int k, double[] bty, double[] fittedOut) {
        double[] beta = multiply(inverses[k], bty);
        for (int i = 0; i < n; i++) {
            int s = first[i];
            double f = 0;
            for (int a = 0; a < 4; a++) {
                f += values[4 * i + a] * beta[s + a];
            }
            fittedOut[i] = f;
        }
    }

    /** ‖y − Bβ‖² = yᵀy − 2βᵀBᵀy + βᵀBᵀBβ for β = A⁻¹Bᵀy, without touching the rows. */
    private double rss(double[][] inverse, double[] bty, double yy) {
        double[] beta = multiply(inverse, bty);
        double[] gb = multiply(gram, beta);
        double cross = 0;
        double quad = 0;
        for (int a = 0; a < m; a++) {
            cross += beta[a] * bty[a];
            quad += beta[a] * gb[a];
        }
        return Math.max(0, yy - 2 * cross + quad);
    }

    private double[] multiply(double[][] a, double[] v) {
        double[] out = new double[m];
        for (int r = 0; r < m; r++) {
            double s = 0;
            double[] row = a[r];
            for (int c = 0; c < m; c++) {
                s += row[c] * v[c];
            }
            out[r] = s;
        }
        return out;
    }

    /** The chosen penalty of one fit: its grid index, λ and the effective degrees of freedom (constant included). */
    record Smooth(int index, double lambda, double edf) {
    }
}
