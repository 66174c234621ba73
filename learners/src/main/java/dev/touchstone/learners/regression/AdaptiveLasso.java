package dev.touchstone.learners.regression;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * Sparse regression of one variable on candidate parents, computed from a covariance
 * matrix: ordinary least squares first, then a Lasso on the predictors scaled by the
 * absolute OLS coefficients (the adaptive Lasso of Zou 2006, "The adaptive lasso and its
 * oracle properties", JASA 101), its penalty chosen by BIC along a path. This is the
 * regression step of the sort-and-regress baselines of Reisach, Seiler and Weichwald
 * (2021), who use the same OLS-weighted Lasso with a BIC choice (from memory of their
 * published code; the path here is solved by coordinate descent rather than LARS).
 *
 * <p>Cost: one q × q solve plus O(path · sweeps · q²) for q candidates.
 */
public final class AdaptiveLasso {

    /** Penalties tried, from the smallest that zeroes every coefficient down to 10⁻⁴ of it. */
    static final int PATH_LENGTH = 40;
    private static final int MAX_SWEEPS = 500;
    private static final double TOLERANCE = 1e-10;

    private AdaptiveLasso() {
    }

    /**
     * The coefficients of {@code target} on {@code candidates} (zero = not a parent).
     *
     * @param cov        covariance matrix, row-major p × p
     * @param p          its dimension
     * @param rows       the number of rows it was estimated from (for BIC)
     */
    public static double[] fit(double[] cov, int p, long rows, int target, int[] candidates) {
        int q = candidates.length;
        double[] out = new double[q];
        if (q == 0) {
            return out;
        }
        double[][] sxx = new double[q][q];
        double[] sxy = new double[q];
        for (int a = 0; a < q; a++) {
            sxy[a] = cov[candidates[a] * p + target];
            for (int b = 0; b < q; b++) {
                sxx[a][b] = cov[candidates[a] * p + candidates[b]];
            }
        }
        double syy = cov[target * p + target];
        double[] ols = solve(sxx, sxy);
        double[] w = new double[q];
        for (int a = 0; a < q; a++) {
            w[a] = Math.abs(ols[a]);
        }
        // Scaled problem: predictors x̃_a = w_a x_a, so Σ̃ = W Σ W and c̃ = W c.
        double[][] g = new double[q][q];
        double[] c = new double[q];
        for (int a = 0; a < q; a++) {
            c[a] = w[a] * sxy[a];
            for (int b = 0; b < q; b++) {
                g[a][b] = w[a] * w[b] * sxx[a][b];
            }
        }
        double lambdaMax = 0;
        for (int a = 0; a < q; a++) {
            lambdaMax = Math.max(lambdaMax, Math.abs(c[a]));
        }
        double n = (double) rows;
        double[] beta = new double[q];
        double[] best = new double[q];
        double bestBic = bic(syy, 0, n, 0);
        if (lambdaMax <= 0) {
            return out;
        }
        for (int step = 1; step <= PATH_LENGTH; step++) {
            double lambda = lambdaMax * Math.pow(1e-4, step / (double) PATH_LENGTH);
            coordinateDescent(g, c, beta, lambda);
            int nonZero = 0;
            double fitTerm = 0;
            for (int a = 0; a < q; a++) {
                if (beta[a] != 0) {
                    nonZero++;
                }
                fitTerm += 2 * beta[a] * c[a];
                for (int b = 0; b < q; b++) {
                    fitTerm -= beta[a] * g[a][b] * beta[b];
                }
            }
            double criterion = bic(syy, fitTerm, n, nonZero);
            if (criterion < bestBic) {
                bestBic = criterion;
                System.arraycopy(beta, 0, best, 0, q);
            }
        }
        for (int a = 0; a < q; a++) {
            out[a] = best[a] * w[a];
        }
        return out;
    }

    /** BIC of a Gaussian regression with residual variance syy − fitTerm (common practice). */
    private static double bic(double syy, double fitTerm, double n, int parameters) {
        double rss = Math.max(syy - fitTerm, 1e-300);
        return n * Math.log(rss) + parameters * Math.log(n);
    }

    private static void coordinateDescent(double[][] g, double[] c, double[] beta, double lambda) {
        int q = c.length;
        for (int sweep = 0; sweep < MAX_SWEEPS; sweep++) {
            double change = 0;
            for (int a = 0; a < q; a++) {
                if (g[a][a] <= 0) {
                    beta[a] = 0;
                    continue;
                }
                double r = c[a];
                for (int b = 0; b < q; b++) {
                    if (b != a) {
                        r -= g[a][b] * beta[b];
                    }
                }
                double next = Math.signum(r) * Math.max(Math.abs(r) - lambda, 0) / g[a][a];
                change = Math.max(change, Math.abs(next - beta[a]));
                beta[a] = next;
            }
            if (change < TOLERANCE) {
                return;
            }
        }
    }

    private static double[] solve(double[][] a, double[] b) {
        RealMatrix m = new Array2DRowRealMatrix(a, false);
        RealVector v = new ArrayRealVector(b, false);
        LUDecomposition lu = new LUDecomposition(m);
        if (lu.getSolver().isNonSingular()) {
            return lu.getSolver().solve(v).toArray();
        }
        return new SingularValueDecomposition(m).getSolver().solve(v).toArray();
    }
}
