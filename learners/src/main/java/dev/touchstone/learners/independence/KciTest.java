package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.random.Shuffles;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.Arrays;

/**
 * The kernel-based conditional independence test KCI (Zhang, Peters, Janzing and Schölkopf
 * 2011, "Kernel-based conditional independence test and application in causal discovery",
 * UAI), with the gamma approximation of its null distribution, for continuous data.
 *
 * <p><b>Statistic</b> (theorem numbers as recalled from memory). With Gaussian kernels (widths by the median heuristic stated in
 * {@link KernelAlgebra}, on standardised columns) and centred Gram matrices K̃ = HKH:
 * <ul>
 *   <li>S = ∅: T = tr(K̃_x K̃_y)/n, null ≈ gamma with mean tr(K̃_x) tr(K̃_y)/n² and variance
 *       2 tr(K̃_x²) tr(K̃_y²)/n⁴ (the paper's Theorem 4 and Section 3.4);</li>
 *   <li>S ≠ ∅: ẍ = (x, S); R_S = ε(K̃_S + εI)⁻¹; K̃_ẍ|S = R_S K̃_ẍ R_S and K̃_y|S = R_S K̃_y R_S;
 *       T = tr(K̃_ẍ|S K̃_y|S)/n. The null is ≈ Σ_k λ̆_k z_k²/n with λ̆ the eigenvalues of
 *       w wᵀ, w the n products ψ_t ⊗ φ_t of the eigenvector features of the two residual
 *       kernels (Theorem 3, Proposition 5); the gamma has mean tr(w wᵀ)/n and variance
 *       2 tr((w wᵀ)²)/n². Since w wᵀ = K̃_ẍ|S ∘ K̃_y|S (entrywise product: (ψ_s ⊗ φ_s)·(ψ_t ⊗ φ_t)
 *       = (ψ_s·ψ_t)(φ_s·φ_t)), these moments are computed without eigendecompositions:
 *       mean = Σ_t (K̃_ẍ|S)_tt (K̃_y|S)_tt / n, variance = 2 Σ_st ((K̃_ẍ|S)_st (K̃_y|S)_st)² / n².</li>
 * </ul>
 * The pair is put in canonical order (smaller position as x) first, which makes the test
 * symmetric to the bit although ẍ is built from x; the conditioning set is sorted likewise.
 *
 * <p><b>Bounded cost (declared).</b> Every kernel matrix is replaced by a pivoted incomplete
 * Cholesky factor G (K ≈ GGᵀ) of rank at most {@code maxRank} (see {@link KernelAlgebra}),
 * and R_S is applied by the Woodbury identity, R_S G = G − G_S(G_SᵀG_S + εI)⁻¹G_SᵀG. A test
 * then costs O(n r²) for the factors and O(n² r) for the null variance instead of the
 * O(n³) of the full matrices; with more than {@code maxRows} usable rows a seeded random
 * subset of {@code maxRows} rows is used (the same subset for every test with the same
 * usable rows). Rows with a missing cell in x, y or S are left out per test.
 *
 * <p>Thread-safe and immutable.
 */
public final class KciTest implements IndependenceTest {

    /**
     * The test's settings: largest rank of each incomplete Cholesky factor, the ridge ε of
     * the conditional residuals, the largest number of rows used, and the seed of the row
     * subset.
     */
    public record Settings(int maxRank, double ridge, int maxRows, long seed) {
        public Settings {
            if (maxRank < 1 || maxRows < 6 || !(ridge > 0)) {
                throw new IllegalArgumentException("bad KCI settings " + maxRank + ", " + ridge + ", " + maxRows);
            }
        }

        /** The defaults of the {@code test} parameters: rank 100, ε = 10⁻³, at most 2,000 rows. */
        public static Settings defaults(long seed) {
            return new Settings(100, 1e-3, 2000, seed);
        }
    }

    /** The statistic, the moments of its gamma approximation and the p-value of one test. */
    public record Result(double statistic, double nullMean, double nullVariance, double pValue, int rows) {
    }

    private final DataSet data;
    private final double alpha;
    private final Settings settings;

    private KciTest(DataSet data, double alpha, Settings settings) {
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("alpha must be in (0, 1), got " + alpha);
        }
        this.data = data;
        this.alpha = alpha;
        this.settings = settings;
    }

    /** The test on the continuous columns of {@code data}. */
    public static KciTest of(DataSet data, double alpha, Settings settings) {
        return new KciTest(data, alpha, settings);
    }

    @Override
    public int variables() {
        return data.columns();
    }

    @Override
    public double alpha() {
        return alpha;
    }

    @Override
    public String name() {
        return IndependenceTests.KCI;
    }

    @Override
    public double pValue(int x, int y, int[] z) {
        return compute(x, y, z).pValue();
    }

    /** The whole test of x and y given z. */
    public Result compute(int x, int y, int[] given) {
        int[] z = given.clone();
        Arrays.sort(z); // the same bits whatever the order of the conditioning set
        int a = Math.min(x, y);
        int b = Math.max(x, y);
        int[] rows = usableRows(data, a, b, z, settings.maxRows(), settings.seed());
        int n = rows.length;
        if (n < 6) {
            return new Result(Double.NaN, Double.NaN, Double.NaN, 1.0, n);
        }
        boolean allRows = n == data.rows();
        double[][] gy = factor(new int[] {b}, rows, allRows);
        if (z.length == 0) {
            return unconditional(factor(new int[] {a}, rows, allRows), gy, n);
        }
        int[] xz = new int[z.length + 1];
        xz[0] = a;
        System.arraycopy(z, 0, xz, 1, z.length);
        double[][] gx = factor(xz, rows, allRows);
        Residualiser onZ = new Residualiser(factor(z, rows, allRows), settings.ridge());
        return conditional(onZ.apply(gx), onZ.apply(gy), n);
    }

    private double[][] factor(int[] vars, int[] rows, boolean allRows) {
        double[][] u = KernelAlgebra.standardised(data, rows, vars);
        double width = allRows ? KernelAlgebra.sharedWidth(data, vars, u) : KernelAlgebra.medianWidth(u);
        return KernelAlgebra.centreColumns(KernelAlgebra.incompleteCholesky(u, width, settings.maxRank()));
    }

    static Result unconditional(double[][] gx, double[][] gy, int n) {
        double dn = n;
        double t = KernelAlgebra.squaredNorm(KernelAlgebra.crossProduct(gx, gy)) / dn;
        double mean = KernelAlgebra.squaredNorm(gx) * KernelAlgebra.squaredNorm(gy) / (dn * dn);
        double variance = 2 * KernelAlgebra.squaredNorm(KernelAlgebra.crossProduct(gx, gx))
                * KernelAlgebra.squaredNorm(KernelAlgebra.crossProduct(gy, gy)) / (dn * dn * dn * dn);
        return new Result(t, mean, variance, KernelAlgebra.gammaSurvival(t, mean, variance), n);
    }

    /**
     * R_S G = G − G_S (G_SᵀG_S + εI)⁻¹ G_Sᵀ G (Woodbury) for centred factors G and G_S: the
     * q × q system of G_S is factorised once and serves both residual kernels of a test.
     */
    static final class Residualiser {
        private final double[][] gz;
        private final double[] chol;

        Residualiser(double[][] gz, double ridge) {
            this.gz = gz;
            int q = gz.length;
            double[] m = KernelAlgebra.crossProduct(gz, gz);
            for (int i = 0; i < q; i++) {
                m[i * q + i] += ridge;
            }
            this.chol = q == 0 ? m : KernelAlgebra.cholesky(m, q);
        }

        /** R_S G for a centred factor G (a new column set; G is not modified). */
        double[][] apply(double[][] g) {
            int q = gz.length;
            int c = g.length;
            double[][] out = new double[c][];
            for (int j = 0; j < c; j++) {
                out[j] = g[j].clone();
            }
            if (q == 0) {
                return out;
            }
            double[] coef = KernelAlgebra.crossProduct(gz, g); // q × c
            KernelAlgebra.choleskySolve(chol, q, coef, c);
            int n = g[0].length;
            for (int k = 0; k < q; k++) {
                double[] zk = gz[k];
                for (int j = 0; j < c; j++) {
                    double w = coef[k * c + j];
                    double[] oj = out[j];
                    for (int i = 0; i < n; i++) {
                        oj[i] -= w * zk[i];
                    }
                }
            }
            return out;
        }
    }

    static Result conditional(double[][] bx, double[][] by, int n) {
        double dn = n;
        double t = KernelAlgebra.squaredNorm(KernelAlgebra.crossProduct(bx, by)) / dn;
        double[] rx = rowMajor(bx, n);
        double[] ry = rowMajor(by, n);
        int cx = bx.length;
        int cy = by.length;
        double diagonal = 0;
        double offDiagonal = 0;
        double meanSum = 0;
        for (int s = 0; s < n; s++) {
            double kx = KernelAlgebra.dot(rx, s * cx, rx, s * cx, cx);
            double ky = KernelAlgebra.dot(ry, s * cy, ry, s * cy, cy);
            meanSum += kx * ky;
            diagonal += kx * kx * ky * ky;
            offDiagonal += squaredProducts(rx, ry, cx, cy, s, n);
        }
        double mean = meanSum / dn;
        double variance = 2 * (diagonal + 2 * offDiagonal) / (dn * dn);
        return new Result(t, mean, variance, KernelAlgebra.gammaSurvival(t, mean, variance), n);
    }

    /**
     * Σ_{u > s} ((K_x)_su (K_y)_su)² for row-major factors: four rows u at a time, so each
     * element of row s is loaded once for four products.
     */
    private static double squaredProducts(double[] rx, double[] ry, int cx, int cy, int s, int n) {
        double total = 0;
        int u = s + 1;
        for (; u + 3 < n; u += 4) {
            double x0 = 0;
            double x1 = 0;
            double x2 = 0;
            double x3 = 0;
            int base = s * cx;
            int o0 = u * cx;
            for (int k = 0; k < cx; k++) {
                double v = rx[base + k];
                x0 += v * rx[o0 + k];
                x1 += v * rx[o0 + cx + k];
                x2 += v * rx[o0 + 2 * cx + k];
                x3 += v * rx[o0 + 3 * cx + k];
            }
            double y0 = 0;
            double y1 = 0;
            double y2 = 0;
            double y3 = 0;
            base = s * cy;
            o0 = u * cy;
            for (int k = 0; k < cy; k++) {
                double v = ry[base + k];
                y0 += v * ry[o0 + k];
                y1 += v * ry[o0 + cy + k];
                y2 += v * ry[o0 + 2 * cy + k];
                y3 += v * ry[o0 + 3 * cy + k];
            }
            double e0 = x0 * y0;
            double e1 = x1 * y1;
            double e2 = x2 * y2;
            double e3 = x3 * y3;
            total += (e0 * e0 + e1 * e1) + (e2 * e2 + e3 * e3);
        }
        for (; u < n; u++) {
            double e = KernelAlgebra.dot(rx, s * cx, rx, u * cx, cx) * KernelAlgebra.dot(ry, s * cy, ry, u * cy, cy);
            total += e * e;
        }
        return total;
    }

    private static double[] rowMajor(double[][] cols, int n) {
        int c = cols.length;
        double[] out = new double[n * c];
        for (int j = 0; j < c; j++) {
            double[] col = cols[j];
            for (int i = 0; i < n; i++) {
                out[i * c + j] = col[i];
            }
        }
        return out;
    }

    /**
     * The rows complete in x, y and z, and, when there are more than {@code maxRows}, a
     * random subset of that many drawn from {@code seed} (sorted, so the data's order is kept).
     */
    static int[] usableRows(DataSet data, int x, int y, int[] z, int maxRows, long seed) {
        int[] rows;
        if (data.hasMissing()) {
            int[] vars = Arrays.copyOf(z, z.length + 2);
            vars[z.length] = x;
            vars[z.length + 1] = y;
            rows = data.rowsCompleteIn(vars);
        } else {
            rows = new int[data.rows()];
            for (int i = 0; i < rows.length; i++) {
                rows[i] = i;
            }
        }
        if (rows.length <= maxRows) {
            return rows;
        }
        // The first maxRows entries become a uniform random subset.
        UniformRandomProvider rng = Seeds.random(Seeds.derive(seed, "kernel-test-rows", rows.length));
        int[] subset = Arrays.copyOf(Shuffles.shuffleHead(rng, rows.clone(), maxRows), maxRows);
        Arrays.sort(subset);
        return subset;
    }
}
