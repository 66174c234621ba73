package dev.touchstone.learners.functional;

import dev.touchstone.learners.independence.KernelAlgebra;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;

/**
 * Nonparametric regression residuals for the functional learners: kernel ridge regression
 * with a Gaussian kernel, low rank, and the ridge chosen by generalised cross-validation.
 *
 * <p><b>Rule.</b> Predictors are standardised (mean 0, sd 1); the kernel width is the median
 * heuristic of {@link KernelAlgebra}; the Gram matrix is replaced by its pivoted incomplete
 * Cholesky factor G (rank at most {@code maxRank}), centred, so the fit is ridge regression
 * of the centred response on the columns of G: ŷ = G(GᵀG + λI)⁻¹Gᵀy. The ridge λ minimises
 * the generalised cross-validation criterion n‖y − ŷ‖² / (n − tr H)², H the hat matrix
 * (Golub, Heath and Wahba 1979, Technometrics 21), over the grid λ = n·10^k, k = −6, −5.5,
 * …, 0. Through the eigendecomposition GᵀG = V diag(s²) Vᵀ every λ of the grid costs O(r):
 * with c = diag(1/s)VᵀGᵀy, ‖y − ŷ‖² = ‖y‖² − ‖c‖² + Σ (λ/(s² + λ))² c² and
 * tr H = Σ s²/(s² + λ).
 *
 * <p>Cost O(n r² + r³) per regression. Kernel ridge regression is the standard
 * reproducing-kernel estimator behind the Gaussian-process regression of the RESIT paper
 * (Peters et al. 2014, JMLR 15, Section 4.1, use GP regression): its mean is the same
 * estimator with λ the noise variance; GCV stands in for marginal-likelihood tuning.
 */
final class KernelRidgeRegression {

    private KernelRidgeRegression() {
    }

    /**
     * The residuals y − ŷ of the regression of {@code y} on the predictors {@code x}
     * (column-major, {@code double[d][n]}); with no predictors, y minus its mean.
     */
    static double[] residuals(double[][] x, double[] y, int maxRank) {
        return residuals(x, y, maxRank, Double.NaN);
    }

    /** As {@link #residuals(double[][], double[], int)} with the ridge fixed at {@code lambda} (NaN: by GCV). */
    static double[] residuals(double[][] x, double[] y, int maxRank, double lambda) {
        int n = y.length;
        double mean = 0;
        for (double v : y) {
            mean += v;
        }
        mean /= n;
        double[] yc = new double[n];
        double yy = 0;
        for (int i = 0; i < n; i++) {
            yc[i] = y[i] - mean;
            yy += yc[i] * yc[i];
        }
        if (x.length == 0) {
            return yc;
        }
        double[][] u = KernelAlgebra.standardised(x);
        double[][] g = KernelAlgebra.centreColumns(
                KernelAlgebra.incompleteCholesky(u, KernelAlgebra.medianWidth(u), maxRank));
        int r = g.length;
        if (r == 0) {
            return yc;
        }
        double[] gtg = KernelAlgebra.symmetricCrossProduct(g);
        double[][] m = new double[r][r];
        for (int a = 0; a < r; a++) {
            System.arraycopy(gtg, a * r, m[a], 0, r);
        }
        EigenDecomposition eig = new EigenDecomposition(new Array2DRowRealMatrix(m, false));
        double[] gty = KernelAlgebra.crossProduct(g, new double[][] {yc});
        double[] s2 = new double[r];
        double[] c = new double[r];
        double[][] v = new double[r][];
        double top = 0;
        for (int k = 0; k < r; k++) {
            top = Math.max(top, eig.getRealEigenvalue(k));
        }
        double cc = 0;
        for (int k = 0; k < r; k++) {
            double e = eig.getRealEigenvalue(k);
            v[k] = eig.getEigenvector(k).toArray();
            if (e <= 1e-12 * top) {
                continue; // a direction G does not span
            }
            s2[k] = e;
            double proj = 0;
            for (int a = 0; a < r; a++) {
                proj += v[k][a] * gty[a];
            }
            c[k] = proj / Math.sqrt(e);
            cc += c[k] * c[k];
        }
        double bestLambda = lambda;
        double bestScore = Double.POSITIVE_INFINITY;
        for (int step = -12; step <= 0 && Double.isNaN(lambda); step++) {
            double candidate = n * Math.pow(10, step / 2.0);
            double rss = yy - cc;
            double trace = 0;
            for (int k = 0; k < r; k++) {
                if (s2[k] > 0) {
                    double shrink = candidate / (s2[k] + candidate);
                    rss += shrink * shrink * c[k] * c[k];
                    trace += s2[k] / (s2[k] + candidate);
                }
            }
            double score = n * Math.max(rss, 0) / ((n - trace) * (n - trace));
            if (score < bestScore) {
                bestScore = score;
                bestLambda = candidate;
            }
        }
        // ŷ = G V diag(s²/(s² + λ) / s) c, as G V diag(1/s) are the left singular vectors.
        double[] coef = new double[r];
        for (int k = 0; k < r; k++) {
            if (s2[k] > 0) {
                double w = s2[k] / (s2[k] + bestLambda) * c[k] / Math.sqrt(s2[k]);
                for (int a = 0; a < r; a++) {
                    coef[a] += v[k][a] * w;
                }
            }
        }
        double[] res = yc;
        for (int a = 0; a < r; a++) {
            double[] ga = g[a];
            double w = coef[a];
            for (int i = 0; i < n; i++) {
                res[i] -= w * ga[i];
            }
        }
        return res;
    }
}
