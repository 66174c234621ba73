package dev.touchstone.learners.functional;

import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Kernel ridge regression against its closed form ŷ = K̃(K̃ + λI)⁻¹y (centred Gaussian Gram
 * matrix K̃, e.g. Schölkopf and Smola 2002, "Learning with kernels", MIT Press, from memory; the
 * push-through identity makes the low-rank form equal to it at full rank), with GCV
 * (Golub, Heath and Wahba 1979) evaluated by explicit hat matrices in Commons Math 3.6.1.
 */
class KernelRidgeRegressionTest {

    private static final int N = 60;

    private static double[] sample(double[] x, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] y = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            x[i] = 3 * rng.nextDouble() - 1.5;
            y[i] = Math.sin(2 * x[i]) + 0.2 * g.sample();
        }
        return y;
    }

    /** HKH for the standardised x with width the median pairwise distance (all pairs; N(N−1)/2 is even). */
    private static RealMatrix centredGram(double[] x) {
        DescriptiveStatistics s = new DescriptiveStatistics(x);
        double sd = Math.sqrt(s.getPopulationVariance());
        double[] u = Arrays.stream(x).map(v -> (v - s.getMean()) / sd).toArray();
        double[] d = new double[N * (N - 1) / 2];
        int k = 0;
        for (int i = 0; i < N; i++) {
            for (int j = i + 1; j < N; j++) {
                d[k++] = Math.abs(u[i] - u[j]);
            }
        }
        Arrays.sort(d);
        double sigma = (d[k / 2 - 1] + d[k / 2]) / 2;
        RealMatrix kk = MatrixUtils.createRealMatrix(N, N);
        for (int i = 0; i < N; i++) {
            for (int j = 0; j < N; j++) {
                kk.setEntry(i, j, Math.exp(-(u[i] - u[j]) * (u[i] - u[j]) / (2 * sigma * sigma)));
            }
        }
        RealMatrix h = MatrixUtils.createRealIdentityMatrix(N).subtract(MatrixUtils.createRealMatrix(N, N).scalarAdd(1.0 / N));
        return h.multiply(kk).multiply(h);
    }

    private static RealVector centred(double[] y) {
        double m = Arrays.stream(y).average().orElse(0);
        return new ArrayRealVector(Arrays.stream(y).map(v -> v - m).toArray());
    }

    private static RealMatrix hat(RealMatrix k, double lambda) {
        return k.multiply(new LUDecomposition(k.add(MatrixUtils.createRealIdentityMatrix(N).scalarMultiply(lambda)))
                .getSolver().getInverse());
    }

    @Test
    @DisplayName("fixed λ: residuals equal y − K̃(K̃ + λI)⁻¹y at full rank")
    void fixedRidgeMatchesClosedForm() {
        double[] x = new double[N];
        double[] y = sample(x, 1);
        RealMatrix k = centredGram(x);
        RealVector yc = centred(y);
        for (double lambda : new double[] {0.01, 0.5, 6.0}) {
            RealVector expected = yc.subtract(hat(k, lambda).operate(yc));
            double[] actual = KernelRidgeRegression.residuals(new double[][] {x}, y, N, lambda);
            for (int i = 0; i < N; i++) {
                assertEquals(expected.getEntry(i), actual[i], 1e-4, "λ = " + lambda + ", row " + i);
            }
        }
    }

    @Test
    @DisplayName("GCV: the chosen fit equals the explicit-hat-matrix GCV minimiser over λ = n·10^k, k = −6, −5.5, …, 0")
    void gcvMatchesExplicitHatMatrices() {
        double[] x = new double[N];
        double[] y = sample(x, 2);
        RealMatrix k = centredGram(x);
        RealVector yc = centred(y);
        double bestScore = Double.POSITIVE_INFINITY;
        RealVector best = null;
        for (int step = -12; step <= 0; step++) {
            RealMatrix h = hat(k, N * Math.pow(10, step / 2.0));
            RealVector res = yc.subtract(h.operate(yc));
            double score = N * res.dotProduct(res) / Math.pow(N - h.getTrace(), 2);
            if (score < bestScore) {
                bestScore = score;
                best = res;
            }
        }
        double[] actual = KernelRidgeRegression.residuals(new double[][] {x}, y, N);
        for (int i = 0; i < N; i++) {
            assertEquals(best.getEntry(i), actual[i], 1e-4, "row " + i);
        }
        // The fit recovers sin(2x): the residual variance is near the noise variance 0.04 (common practice).
        double var = best.dotProduct(best) / N;
        assertTrue(var > 0.02 && var < 0.06, "residual variance " + var);
    }
}
