package dev.touchstone.learners.functional;

import java.util.List;

/**
 * Additive regression y = c + Σ_j f_j(x_j) + e by backfitting (Hastie and Tibshirani 1990,
 * "Generalized Additive Models", Chapman and Hall, §4.3), each f_j a P-spline
 * ({@link PSplineSmoother}) whose penalty is re-chosen by GCV on its partial residual at every
 * sweep. Sweeps stop when the fitted terms change by less than {@value #TOLERANCE} of the
 * response's sum of squares, or after {@value #MAX_SWEEPS}.
 *
 * <p>The effective degrees of freedom of the fit are 1 for the constant plus, for each term,
 * its smoother's trace minus the constant it also contains: the usual approximation for
 * backfitted models (Hastie and Tibshirani 1990, §5.4.5). Cost per sweep O(k (n + grid · m²))
 * for k terms.
 */
final class AdditiveRegression {

    static final double TOLERANCE = 1e-6;
    static final int MAX_SWEEPS = 30;

    private AdditiveRegression() {
    }

    /** {@code y} minus its mean: the start of every additive fit, whose constant is the mean. */
    static double[] centred(double[] y) {
        double mean = 0;
        for (double v : y) {
            mean += v;
        }
        mean /= y.length;
        double[] out = new double[y.length];
        for (int i = 0; i < y.length; i++) {
            out[i] = y[i] - mean;
        }
        return out;
    }

    /** The fit of {@code y} on the predictors of {@code terms} (none: the constant alone). */
    static Fit fit(double[] y, List<PSplineSmoother> terms) {
        int n = y.length;
        double[] residual = centred(y);
        double total = 0;
        for (double r : residual) {
            total += r * r;
        }
        int k = terms.size();
        double[] termEdf = new double[k];
        if (k > 0 && total > 0) {
            double[][] f = new double[k][n];
            double[] partial = new double[n];
            double[] next = new double[n];
            int sweeps = k == 1 ? 1 : MAX_SWEEPS;
            for (int sweep = 0; sweep < sweeps; sweep++) {
                double change = 0;
                for (int j = 0; j < k; j++) {
                    for (int i = 0; i < n; i++) {
                        partial[i] = residual[i] + f[j][i];
                    }
                    termEdf[j] = terms.get(j).smooth(partial, next).edf() - 1;
                    for (int i = 0; i < n; i++) {
                        double d = next[i] - f[j][i];
                        change += d * d;
                        residual[i] = partial[i] - next[i];
                    }
                    double[] t = f[j];
                    f[j] = next;
                    next = t;
                }
                if (change <= TOLERANCE * total) {
                    break;
                }
            }
        }
        double rss = 0;
        for (double r : residual) {
            rss += r * r;
        }
        double edf = 1;
        for (double e : termEdf) {
            edf += e;
        }
        return new Fit(rss, edf, termEdf);
    }

    /**
     * One additive fit: residual sum of squares, effective degrees of freedom of the whole fit
     * (constant included) and of each term (constant excluded), in the order of the terms.
     */
    record Fit(double rss, double edf, double[] termEdf) {
        Fit {
            termEdf = termEdf.clone();
        }

        @Override
        public double[] termEdf() {
            return termEdf.clone();
        }

        double termEdf(int j) {
            return termEdf[j];
        }
    }
}
