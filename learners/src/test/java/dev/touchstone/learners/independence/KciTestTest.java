package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.statistics.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * KCI (Zhang, Peters, Janzing and Schölkopf 2011, UAI) against the paper's formulas computed
 * here with full Commons Math 3.6.1 matrices (inverse by LU, eigendecompositions, explicit
 * products of eigenvector features), and its calibration and power on seeded samples.
 */
class KciTestTest {

    private static final int N = 40;

    /** Standardised columns (divisor n, Commons Math descriptive statistics), rows = points. */
    private static double[][] points(DataSet data, int... vars) {
        int n = data.rows();
        double[][] p = new double[n][vars.length];
        for (int k = 0; k < vars.length; k++) {
            DescriptiveStatistics s = new DescriptiveStatistics(data.continuous(vars[k]));
            double sd = Math.sqrt(s.getPopulationVariance());
            for (int i = 0; i < n; i++) {
                p[i][k] = (data.continuous(vars[k])[i] - s.getMean()) / sd;
            }
        }
        return p;
    }

    /** The centred Gaussian Gram matrix HKH with width the median of all pairwise distances. */
    private static RealMatrix centredGram(double[][] pts) {
        int n = pts.length;
        double[] d = new double[n * (n - 1) / 2];
        int k = 0;
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                d[k++] = distance(pts[i], pts[j]);
            }
        }
        Arrays.sort(d);
        double sigma = (d[k / 2 - 1] + d[k / 2]) / 2; // k = 780 is even
        RealMatrix g = MatrixUtils.createRealMatrix(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double e = distance(pts[i], pts[j]);
                g.setEntry(i, j, Math.exp(-e * e / (2 * sigma * sigma)));
            }
        }
        RealMatrix h = MatrixUtils.createRealIdentityMatrix(n).subtract(MatrixUtils.createRealMatrix(n, n).scalarAdd(1.0 / n));
        return h.multiply(g).multiply(h);
    }

    private static double distance(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += (a[i] - b[i]) * (a[i] - b[i]);
        }
        return Math.sqrt(s);
    }

    /** ψ = V Λ^½ (eigenvalues below 0 from round-off set to 0), rows = points. */
    private static double[][] eigenFeatures(RealMatrix k) {
        // Symmetrised, so that Commons Math takes its symmetric (tridiagonal QL) path.
        EigenDecomposition e = new EigenDecomposition(k.add(k.transpose()).scalarMultiply(0.5));
        int n = k.getRowDimension();
        double[][] psi = new double[n][n];
        for (int c = 0; c < n; c++) {
            double root = Math.sqrt(Math.max(0, e.getRealEigenvalue(c)));
            for (int i = 0; i < n; i++) {
                psi[i][c] = e.getEigenvector(c).getEntry(i) * root;
            }
        }
        return psi;
    }

    @Test
    @DisplayName("conditional statistic and gamma moments equal the paper's (Theorem 3, Proposition 5) from full matrices, eigenvector features ψ⊗φ")
    void conditionalMatchesFullMatrixFormulas() {
        DataSet data = KernelNullData.sample(KernelNullData.Case.COMMON_CAUSE, N, 5);
        double eps = 1e-3;
        KciTest test = KciTest.of(data, 0.05, new KciTest.Settings(N, eps, 10_000, 1));
        RealMatrix kx = centredGram(points(data, 0, 2));
        RealMatrix ky = centredGram(points(data, 1));
        RealMatrix kz = centredGram(points(data, 2));
        RealMatrix rz = new LUDecomposition(kz.add(MatrixUtils.createRealIdentityMatrix(N).scalarMultiply(eps)))
                .getSolver().getInverse().scalarMultiply(eps);
        RealMatrix kxz = rz.multiply(kx).multiply(rz);
        RealMatrix kyz = rz.multiply(ky).multiply(rz);
        double t = kxz.multiply(kyz).getTrace() / N;
        double[][] psi = eigenFeatures(kxz);
        double[][] phi = eigenFeatures(kyz);
        // w_t = ψ_t ⊗ φ_t; the paper's moments are tr(w wᵀ)/n and 2 tr((w wᵀ)²)/n².
        RealMatrix w = MatrixUtils.createRealMatrix(N, N * N);
        for (int s = 0; s < N; s++) {
            for (int a = 0; a < N; a++) {
                for (int b = 0; b < N; b++) {
                    w.setEntry(s, a * N + b, psi[s][a] * phi[s][b]);
                }
            }
        }
        RealMatrix wwt = w.multiply(w.transpose());
        double mean = wwt.getTrace() / N;
        double var = 2 * wwt.multiply(wwt).getTrace() / ((double) N * N);
        double p = 1 - new GammaDistribution(mean * mean / var, var / mean).cumulativeProbability(t);

        KciTest.Result r = test.compute(0, 1, new int[] {2});
        assertEquals(t, r.statistic(), 1e-3 * t);
        assertEquals(mean, r.nullMean(), 1e-3 * mean);
        assertEquals(var, r.nullVariance(), 1e-3 * var);
        assertEquals(p, r.pValue(), 1e-3);
        assertEquals(r.pValue(), test.compute(1, 0, new int[] {2}).pValue(), 0.0);
    }

    @Test
    @DisplayName("unconditional statistic tr(K̃xK̃y)/n and moments tr(K̃x)tr(K̃y)/n², 2tr(K̃x²)tr(K̃y²)/n⁴ (Theorem 4) from full matrices")
    void unconditionalMatchesFullMatrixFormulas() {
        DataSet data = KernelNullData.sample(KernelNullData.Case.SINE, N, 6);
        KciTest test = KciTest.of(data, 0.05, new KciTest.Settings(N, 1e-3, 10_000, 1));
        RealMatrix kx = centredGram(points(data, 0));
        RealMatrix ky = centredGram(points(data, 1));
        double t = kx.multiply(ky).getTrace() / N;
        double mean = kx.getTrace() * ky.getTrace() / ((double) N * N);
        double var = 2 * kx.multiply(kx).getTrace() * ky.multiply(ky).getTrace() / Math.pow(N, 4);
        KciTest.Result r = test.compute(0, 1, new int[0]);
        assertEquals(t, r.statistic(), 1e-4 * t);
        assertEquals(mean, r.nullMean(), 1e-4 * mean);
        assertEquals(var, r.nullVariance(), 1e-4 * var);
        double p = 1 - new GammaDistribution(mean * mean / var, var / mean).cumulativeProbability(t);
        assertEquals(p, r.pValue(), 1e-4);
        assertTrue(r.pValue() < 0.05, "y = sin(2x) + noise is dependent, p = " + r.pValue());
    }

    /** p-values of x ⟂ y | z (or given ∅) over seeded samples. */
    static double[] pValues(IndependenceTestFactory factory, KernelNullData.Case c, int[] z, int cases, int n, long seed) {
        double[] p = new double[cases];
        for (int k = 0; k < cases; k++) {
            DataSet data = KernelNullData.sample(c, n, Seeds.derive(seed, c, k));
            p[k] = factory.of(data).pValue(0, 1, z);
        }
        return p;
    }

    /** Builds a test on a data set. */
    interface IndependenceTestFactory {
        IndependenceTest of(DataSet data);
    }

    static double uniformity(double[] p) {
        return KolmogorovSmirnovTest.withDefaults().test(p, v -> Math.min(1, Math.max(0, v))).getPValue();
    }

    static int rejections(double[] p, double alpha) {
        return (int) Arrays.stream(p).filter(v -> v < alpha).count();
    }

    private static final IndependenceTestFactory KCI = d -> KciTest.of(d, 0.05, KciTest.Settings.defaults(3));

    @Test
    @DisplayName("null calibration at n = 500: p-values uniform by KS (p > 0.01), independent (100 cases) and given a nonlinear common cause (60 cases)")
    void calibration() {
        double[] independent = pValues(KCI, KernelNullData.Case.INDEPENDENT, new int[0], 100, 500, 11);
        assertTrue(uniformity(independent) > 0.01, "KS p = " + uniformity(independent));
        double[] conditional = pValues(KCI, KernelNullData.Case.COMMON_CAUSE, new int[] {2}, 60, 500, 12);
        assertTrue(uniformity(conditional) > 0.01, "KS p = " + uniformity(conditional)
                + ", p-values " + Arrays.toString(conditional));
        // The common cause makes x and y dependent marginally: the test must see that too.
        double[] marginal = pValues(KCI, KernelNullData.Case.COMMON_CAUSE, new int[0], 20, 500, 13);
        assertTrue(rejections(marginal, 0.05) >= 18, Arrays.toString(marginal));
    }

    @Test
    @DisplayName("power at n = 500, α = 0.05: y = sin(2x) + e and y = x² + e rejected in ≥ 90% of 30 cases each; Fisher z rejects y = x² in ≤ 20%")
    void power() {
        double[] sine = pValues(KCI, KernelNullData.Case.SINE, new int[0], 30, 500, 21);
        double[] square = pValues(KCI, KernelNullData.Case.SQUARE, new int[0], 30, 500, 22);
        double[] fisher = pValues(d -> FisherZTest.of(d, 0.05), KernelNullData.Case.SQUARE, new int[0], 30, 500, 22);
        assertTrue(rejections(sine, 0.05) >= 27, Arrays.toString(sine));
        assertTrue(rejections(square, 0.05) >= 27, Arrays.toString(square));
        assertTrue(rejections(fisher, 0.05) <= 6, Arrays.toString(fisher));
    }
}
