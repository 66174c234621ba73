package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/**
 * Seeded samples (invented, for checks only) for the calibration and power checks of the
 * kernel tests: columns V0 = x, V1 = y, V2 = z.
 */
final class KernelNullData {

    enum Case {
        /** x, y, z mutually independent (x Gaussian, y uniform, z Gaussian). */
        INDEPENDENT,
        /** x = sin(z) + e, y = z² / 2 + e': conditionally independent given the nonlinear common cause z. */
        COMMON_CAUSE,
        /** y = sin(2x) + 0.5 e. */
        SINE,
        /**
         * y = x² + 0.2 e with x uniform on [−1, 1]: uncorrelated with x, so Fisher z has no power
         * beyond the slight excess its heteroscedasticity causes (the sampling variance of √n·r is
         * E[x²ỹ²]/(E[x²]E[ỹ²]) ≈ 1.4 rather than 1, a rejection rate near 10% at α = 0.05).
         */
        SQUARE
    }

    private KernelNullData() {
    }

    static DataSet sample(Case c, int n, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] x = new double[n];
        double[] y = new double[n];
        double[] z = new double[n];
        for (int i = 0; i < n; i++) {
            z[i] = g.sample();
            switch (c) {
                case INDEPENDENT -> {
                    x[i] = g.sample();
                    y[i] = 2 * rng.nextDouble() - 1;
                }
                case COMMON_CAUSE -> {
                    x[i] = Math.sin(z[i]) + 0.3 * g.sample();
                    y[i] = 0.5 * z[i] * z[i] + 0.3 * g.sample();
                }
                case SINE -> {
                    x[i] = g.sample();
                    y[i] = Math.sin(2 * x[i]) + 0.5 * g.sample();
                }
                case SQUARE -> {
                    x[i] = 2 * rng.nextDouble() - 1;
                    y[i] = x[i] * x[i] + 0.2 * g.sample();
                }
            }
        }
        return TestData.continuous(new double[][] {x, y, z});
    }
}
