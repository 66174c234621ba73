package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * KCI (Zhang, Peters, Janzing and Schölkopf 2011, UAI) against the paper's formulas computed
 * here with full Commons Math 3.6.1 matrices (inverse by LU, eigendecompositions, explicit
 * products of eigenvector features). Its calibration and power over 300 seeded cases are in
 * {@link KernelCalibrationTest}.
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
}
