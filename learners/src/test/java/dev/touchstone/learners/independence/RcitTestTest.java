package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.stat.correlation.Covariance;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * RCIT (Strobl, Zhang and Visweswaran 2019, Journal of Causal Inference 7): its statistic
 * and gamma null checked against the eigenvalues of the product covariance computed with
 * Commons Math 3.6.1 (Σ λ_k z_k² has mean Σ λ_k and variance 2 Σ λ_k², a property of
 * weighted sums of independent χ²₁ variables). Its calibration and power over 300 seeded
 * cases are in {@link KernelCalibrationTest}.
 */
class RcitTestTest {

    @Test
    @DisplayName("statistic n‖Ĉ_xy‖² and gamma moments Σλ, 2Σλ² from Commons Math's Covariance and EigenDecomposition of the products r_x ⊗ r_y")
    void statisticMatchesEigenvalueRoute() {
        int n = 200;
        java.util.Random random = new java.util.Random(9); // test-only data, not the implementation's stream
        double[][] rx = new double[3][n];
        double[][] ry = new double[2][n];
        for (int i = 0; i < n; i++) {
            for (double[] c : rx) {
                c[i] = random.nextGaussian();
            }
            ry[0][i] = random.nextGaussian() + 0.3 * rx[0][i] * rx[1][i];
            ry[1][i] = random.nextGaussian();
        }
        KernelAlgebra.centreColumns(rx);
        KernelAlgebra.centreColumns(ry);
        double[][] w = new double[n][6];
        for (int i = 0; i < n; i++) {
            for (int a = 0; a < 3; a++) {
                for (int b = 0; b < 2; b++) {
                    w[i][a * 2 + b] = rx[a][i] * ry[b][i];
                }
            }
        }
        RealMatrix wm = MatrixUtils.createRealMatrix(w);
        double stat = 0;
        for (int k = 0; k < 6; k++) {
            double s = Arrays.stream(wm.getColumn(k)).sum() / n;
            stat += n * s * s;
        }
        // Covariance with divisor n (bias-corrected = false), as the implementation uses.
        RealMatrix cov = new Covariance(w, false).getCovarianceMatrix();
        double[] lambda = new EigenDecomposition(cov).getRealEigenvalues();
        double mean = Arrays.stream(lambda).sum();
        double var = 2 * Arrays.stream(lambda).map(l -> l * l).sum();
        KciTest.Result r = RcitTest.statistic(rx, ry, n);
        assertEquals(stat, r.statistic(), 1e-9 * stat);
        assertEquals(mean, r.nullMean(), 1e-9 * mean);
        assertEquals(var, r.nullVariance(), 1e-9 * var);
        assertEquals(1 - new GammaDistribution(mean * mean / var, var / mean).cumulativeProbability(stat), r.pValue(), 1e-9);
    }

    @Test
    @DisplayName("the same seed gives the same p-value; the conditioning set's order does not matter")
    void deterministic() {
        DataSet d = KernelNullData.sample(KernelNullData.Case.COMMON_CAUSE, 300, 5);
        DataSet wider = TestData.continuous(new double[][] {d.continuous(0), d.continuous(1), d.continuous(2),
                d.continuous(0).clone()});
        RcitTest a = RcitTest.of(wider, 0.05, RcitTest.Settings.defaults(8));
        RcitTest b = RcitTest.of(wider, 0.05, RcitTest.Settings.defaults(8));
        assertEquals(a.pValue(0, 1, new int[] {2, 3}), b.pValue(0, 1, new int[] {3, 2}), 0.0);
        assertEquals(a.pValue(0, 1, new int[] {2}), a.pValue(1, 0, new int[] {2}), 0.0);
    }
}
