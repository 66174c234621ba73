package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The randomized conditional independence test RCIT (Strobl, Zhang and Visweswaran 2019,
 * "Approximate kernel-based conditional independence tests for fast non-parametric causal
 * discovery", Journal of Causal Inference 7), for continuous data and large n.
 *
 * <p>Kernels are replaced by random Fourier features of the Gaussian kernel (Rahimi and
 * Recht 2007, NIPS): f_k(u) = √2 cos(ω_kᵀu/σ + b_k), ω_k ~ N(0, I), b_k ~ U[0, 2π), σ by
 * the median heuristic of {@link KernelAlgebra} on standardised columns. With ẍ = (x, S)
 * (RCIT, as opposed to the paper's RCoT, which uses x alone; as recalled from memory),
 * {@code features} features for ẍ and for y and {@code conditioningFeatures} for S, all
 * centred:
 * <ol>
 *   <li>the features of ẍ and y are residualised on those of S by ridge regression,
 *       r = f − f_S (C_SS + λI)⁻¹ C_S·, λ = {@value #RIDGE} (C the feature covariances);
 *       with S = ∅ nothing is removed;</li>
 *   <li>the statistic is n‖Ĉ‖²_F, Ĉ the cross-covariance of the residual features of ẍ
 *       and y;</li>
 *   <li>its null is Σ_k λ_k z_k², λ the eigenvalues of the covariance Σ_w of the products
 *       w_t = r_ẍ,t ⊗ r_y,t; this uses the gamma approximation with the same mean tr(Σ_w)
 *       and variance 2 tr(Σ_w²) (the paper's Satterthwaite–Welch option; its default, the
 *       Lindsay–Pilla–Basak moment method, is not implemented).</li>
 * </ol>
 * The features are drawn from the test's seed and the variables they describe (S sorted),
 * so a test is a pure function of its arguments, and the pair is put in canonical order first
 * (symmetric to the bit). Rows with a missing cell in x, y or S are left out per test.
 *
 * <p>Cost O(n (m_S² + m_S m + m⁴)) for m = {@code features}, m_S = {@code conditioningFeatures}:
 * linear in n. Thread-safe and immutable.
 */
public final class RcitTest implements IndependenceTest {

    /** The ridge of the regression of features on the conditioning set's features. */
    static final double RIDGE = 1e-10;
    /** At most this many doubles (32 MB) of conditioning-set Cholesky factors are kept per test object. */
    private static final long CACHED_FACTOR_DOUBLES = 1L << 22;

    /** The number of random features for ẍ and y, for S, and the seed they are drawn from. */
    public record Settings(int features, int conditioningFeatures, long seed) {
        public Settings {
            if (features < 1 || conditioningFeatures < 1) {
                throw new IllegalArgumentException("RCIT needs at least one feature, got " + features + ", "
                        + conditioningFeatures);
            }
        }

        /** The defaults of the {@code test} parameters: 5 features for x and y, 100 for S (the paper's defaults, from memory). */
        public static Settings defaults(long seed) {
            return new Settings(5, 100, seed);
        }
    }

    private final DataSet data;
    private final double alpha;
    private final Settings settings;
    /**
     * The Cholesky factors of (f_Sᵀf_S + λnI) of recent conditioning sets, for tests on every
     * row: PC asks about the same set for many pairs, and the O(n m_S²) products of f_S with
     * itself are the largest part of a test. The features themselves are cheaper to draw again
     * (n m_S cosines) than to keep (n m_S doubles per set).
     */
    private final Map<String, double[]> factors = Collections.synchronizedMap(new LinkedHashMap<>(16, 0.75f, true) {
        @Override
        protected boolean removeEldestEntry(Map.Entry<String, double[]> eldest) {
            return size() * (long) settings.conditioningFeatures() * settings.conditioningFeatures() > CACHED_FACTOR_DOUBLES;
        }
    });

    private RcitTest(DataSet data, double alpha, Settings settings) {
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("alpha must be in (0, 1), got " + alpha);
        }
        this.data = data;
        this.alpha = alpha;
        this.settings = settings;
    }

    /** The test on the continuous columns of {@code data}. */
    public static RcitTest of(DataSet data, double alpha, Settings settings) {
        return new RcitTest(data, alpha, settings);
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
        return IndependenceTests.RCIT;
    }

    @Override
    public double pValue(int x, int y, int[] z) {
        return compute(x, y, z).pValue();
    }

    /** The whole test of x and y given z (same record as KCI's: statistic, gamma moments, p-value, rows). */
    public KciTest.Result compute(int x, int y, int[] z) {
        int a = Math.min(x, y);
        int b = Math.max(x, y);
        int[] s = z.clone();
        Arrays.sort(s);
        int[] rows = KciTest.usableRows(data, a, b, s, Integer.MAX_VALUE, settings.seed());
        int n = rows.length;
        if (n < 6) {
            return new KciTest.Result(Double.NaN, Double.NaN, Double.NaN, 1.0, n);
        }
        int[] xs = new int[s.length + 1];
        xs[0] = a;
        System.arraycopy(s, 0, xs, 1, s.length);
        boolean allRows = n == data.rows();
        double[][] fx = features(rows, allRows, settings.features(), "x", xs);
        double[][] fy = features(rows, allRows, settings.features(), "y", new int[] {b});
        if (s.length > 0) {
            double[][] fz = features(rows, allRows, settings.conditioningFeatures(), "z", s);
            double[] chol = allRows ? factors.get(Arrays.toString(s)) : null;
            if (chol == null) {
                chol = conditioningFactor(fz, n);
                if (allRows) {
                    factors.put(Arrays.toString(s), chol);
                }
            }
            // x's and y's features are regressed together: each column of f_S is read once.
            int cx = fx.length;
            double[][] both = residuals(concat(fx, fy), fz, chol);
            fx = Arrays.copyOfRange(both, 0, cx);
            fy = Arrays.copyOfRange(both, cx, both.length);
        }
        return statistic(fx, fy, n);
    }

    /** The lower Cholesky factor of f_Sᵀf_S + λnI. */
    private static double[] conditioningFactor(double[][] fz, int n) {
        double[] czz = KernelAlgebra.symmetricCrossProduct(fz);
        int q = fz.length;
        for (int i = 0; i < q; i++) {
            czz[i * q + i] += RIDGE * n;
        }
        return KernelAlgebra.cholesky(czz, q);
    }

    private static double[][] concat(double[][] a, double[][] b) {
        double[][] out = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }

    /** The centred random Fourier features (columns) of standardised points u, drawn from the seed and the variables. */
    private double[][] features(int[] rows, boolean allRows, int m, String role, int[] vars) {
        double[][] u = KernelAlgebra.standardised(data, rows, vars);
        int d = u.length;
        int n = u[0].length;
        double sigma = allRows ? KernelAlgebra.sharedWidth(data, vars, u) : KernelAlgebra.medianWidth(u);
        UniformRandomProvider rng = Seeds.random(Seeds.derive(settings.seed(), "rcit-features", role,
                Arrays.toString(vars), m));
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double[][] f = new double[m][n];
        double[] w = new double[d];
        double root2 = Math.sqrt(2);
        for (int k = 0; k < m; k++) {
            for (int j = 0; j < d; j++) {
                w[j] = g.sample() / sigma;
            }
            double phase = 2 * Math.PI * rng.nextDouble();
            double[] fk = f[k];
            for (int i = 0; i < n; i++) {
                double t = phase;
                for (int j = 0; j < d; j++) {
                    t += w[j] * u[j][i];
                }
                fk[i] = root2 * Math.cos(t);
            }
        }
        return KernelAlgebra.centreColumns(f);
    }

    /** f − f_S β with β solving (f_Sᵀf_S + λnI) β = f_Sᵀ f, given the Cholesky factor of the left side. */
    private static double[][] residuals(double[][] f, double[][] fz, double[] chol) {
        int q = fz.length;
        int c = f.length;
        double[] beta = KernelAlgebra.crossProduct(fz, f);
        KernelAlgebra.choleskySolve(chol, q, beta, c);
        double[][] out = new double[c][];
        for (int j = 0; j < c; j++) {
            out[j] = f[j].clone();
        }
        int n = f[0].length;
        // Each column of f_S is read once for all c outputs; every output still subtracts the
        // terms in the order k = 0, 1, …, so the bits are those of one column at a time.
        for (int k = 0; k < q; k++) {
            double[] zk = fz[k];
            for (int j = 0; j < c; j++) {
                double bk = beta[k * c + j];
                double[] oj = out[j];
                for (int i = 0; i < n; i++) {
                    oj[i] -= bk * zk[i];
                }
            }
        }
        return out;
    }

    /** n‖Ĉ_xy‖² and its gamma approximation from the covariance of the products r_x,t ⊗ r_y,t. */
    static KciTest.Result statistic(double[][] rx, double[][] ry, int n) {
        double dn = n;
        int cx = rx.length;
        int cy = ry.length;
        int m = cx * cy;
        double[][] w = new double[m][n];
        for (int a = 0; a < cx; a++) {
            for (int b = 0; b < cy; b++) {
                double[] wab = w[a * cy + b];
                double[] xa = rx[a];
                double[] yb = ry[b];
                for (int i = 0; i < n; i++) {
                    wab[i] = xa[i] * yb[i];
                }
            }
        }
        double t = 0;
        double[] means = new double[m];
        for (int k = 0; k < m; k++) {
            double s = 0;
            for (double v : w[k]) {
                s += v;
            }
            means[k] = s / dn;
            t += s * s;
        }
        t /= dn; // n ‖(1/n) Σ_t w_t‖²
        for (int k = 0; k < m; k++) {
            double[] wk = w[k];
            for (int i = 0; i < n; i++) {
                wk[i] -= means[k];
            }
        }
        double[] cov = KernelAlgebra.symmetricCrossProduct(w);
        double mean = 0;
        double squares = 0;
        for (int k = 0; k < m; k++) {
            mean += cov[k * m + k] / dn;
            for (int l = 0; l < m; l++) {
                double v = cov[k * m + l] / dn;
                squares += v * v;
            }
        }
        double variance = 2 * squares;
        return new KciTest.Result(t, mean, variance, KernelAlgebra.gammaSurvival(t, mean, variance), n);
    }
}
