package dev.touchstone.learners.independence;

/**
 * The Hilbert–Schmidt independence criterion with Gaussian kernels and the gamma
 * approximation of its null distribution (Gretton, Fukumizu, Teo, Song, Schölkopf and Smola
 * 2008, "A kernel statistical test of independence", NIPS 20).
 *
 * <p>For samples u and v of n points, with Gram matrices K and L of Gaussian kernels
 * (widths by the median heuristic of {@link KernelAlgebra}, on standardised coordinates) and
 * the centring matrix H = I − 11ᵀ/n, the biased statistic is HSIC_b = tr(K H L H) / n², and
 * the test statistic n·HSIC_b. Under independence n·HSIC_b is approximated by a gamma
 * distribution with the moments of the paper's Section 3:
 * <ul>
 *   <li>E(HSIC_b) = (1 + μ_K μ_L − μ_K − μ_L) / n, with μ_K = Σ_{i≠j} K_ij / (n(n − 1)) and
 *       likewise μ_L;</li>
 *   <li>var(HSIC_b) = 2(n − 4)(n − 5) / (n(n − 1)(n − 2)(n − 3)) · Σ_{i≠j} B_ij / (n(n − 1)),
 *       with B = ((HKH) ∘ (HLH))^∘2 (entrywise);</li>
 *   <li>shape E²/var and scale n·var/E, so that the gamma has the mean and variance of
 *       n·HSIC_b; the p-value is its survival function at n·HSIC_b.</li>
 * </ul>
 *
 * <p>Cost O(n²(d_u + d_v)) time and O(n²) memory (two full Gram matrices): meant for the
 * residual tests of functional learners at moderate n; the conditional tests for large n
 * are {@link KciTest} (low-rank) and {@link RcitTest}. Needs n ≥ 6 (the variance formula
 * vanishes below); smaller samples get p = 1.
 */
public final class Hsic {

    private Hsic() {
    }

    /**
     * The statistic n·HSIC_b, its gamma moments, the p-value, and the two kernel widths used.
     *
     * @param widths the Gaussian kernel widths of the two samples (median heuristic)
     */
    public record Result(double statistic, double nullMean, double nullVariance, double pValue, Widths widths) {
    }

    /**
     * The kernel widths the test used.
     *
     * @param u the width for the first sample
     * @param v the width for the second sample
     */
    public record Widths(double u, double v) {
    }

    /**
     * One sample's part of the test: its centred Gram matrix HKH (row-major n × n), the mean
     * μ of the off-diagonal entries of K before centring, and the kernel width. Built once, it
     * serves every test against the same sample (RESIT tests many residuals against the same
     * predecessors); it is never modified after construction.
     */
    public static final class Sample {
        private final double[] centred;
        private final double offDiagonalMean;
        private final double width;
        private final int n;

        private Sample(double[] gram, int n, double width) {
            this.offDiagonalMean = offDiagonalMean(gram, n);
            centre(gram, n);
            this.centred = gram;
            this.n = n;
            this.width = width;
        }

        /** The number of points. */
        public int size() {
            return n;
        }
    }

    /**
     * The sample {@code u}, column-major ({@code double[d][n]}, d coordinates of n points),
     * prepared for tests: its coordinates standardised, the width by the median heuristic, the
     * Gram matrix centred. The array is not modified.
     */
    public static Sample sample(double[][] u) {
        double[][] su = KernelAlgebra.standardised(u);
        double w = KernelAlgebra.medianWidth(su);
        return new Sample(KernelAlgebra.gram(su, w), su[0].length, w);
    }

    /**
     * The test on samples {@code u} and {@code v}, given column-major ({@code double[d][n]},
     * d coordinates of n points; both with the same n). The coordinates are standardised
     * first; the arrays are not modified.
     */
    public static Result test(double[][] u, double[][] v) {
        if (v[0].length != u[0].length) {
            throw new IllegalArgumentException("samples of different sizes: " + u[0].length + " and " + v[0].length);
        }
        return test(sample(u), sample(v));
    }

    /** The test on two prepared samples of the same size (the same result as from their columns). */
    public static Result test(Sample u, Sample v) {
        int n = u.n;
        if (v.n != n) {
            throw new IllegalArgumentException("samples of different sizes: " + n + " and " + v.n);
        }
        double[] k = u.centred;
        double[] l = v.centred;
        double trace = 0;
        double b = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double prod = k[i * n + j] * l[i * n + j];
                trace += prod;
                if (i != j) {
                    b += prod * prod;
                }
            }
        }
        double statistic = trace / n; // n · tr(KHLH)/n², as tr(KHLH) = Σ (HKH)∘(HLH) for symmetric K, L
        if (n < 6) {
            return new Result(statistic, Double.NaN, Double.NaN, 1.0, new Widths(u.width, v.width));
        }
        double muK = u.offDiagonalMean;
        double muL = v.offDiagonalMean;
        double dn = n;
        double mean = (1 + muK * muL - muK - muL) / dn;
        double variance = 2 * (dn - 4) * (dn - 5) / (dn * (dn - 1) * (dn - 2) * (dn - 3)) * b / (dn * (dn - 1));
        // The gamma for n·HSIC_b: mean n·E, variance n²·var, i.e. shape E²/var and scale n·var/E.
        double p = KernelAlgebra.gammaSurvival(statistic, dn * mean, dn * dn * variance);
        return new Result(statistic, mean, variance, p, new Widths(u.width, v.width));
    }

    private static double offDiagonalMean(double[] k, int n) {
        double s = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (i != j) {
                    s += k[i * n + j];
                }
            }
        }
        return s / ((double) n * (n - 1));
    }

    /** K ← HKH in place: subtract row and column means, add back the grand mean. */
    private static void centre(double[] k, int n) {
        double[] rowMean = new double[n];
        double grand = 0;
        for (int i = 0; i < n; i++) {
            double s = 0;
            for (int j = 0; j < n; j++) {
                s += k[i * n + j];
            }
            rowMean[i] = s / n;
            grand += s;
        }
        grand /= (double) n * n;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                // K is symmetric, so the column means are the row means.
                k[i * n + j] += grand - rowMean[i] - rowMean[j];
            }
        }
    }
}
