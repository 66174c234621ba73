package dev.touchstone.generators.models;

import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.distribution.ExponentialDistribution;
import org.apache.commons.math3.distribution.GumbelDistribution;
import org.apache.commons.math3.distribution.LaplaceDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.RealDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.apache.commons.math3.distribution.UniformRealDistribution;
import org.apache.commons.math3.special.Gamma;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.apache.commons.rng.sampling.distribution.ContinuousSampler;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class NoiseDistributionTest {

    private static final double DF = 5;

    /** The raw distribution in Commons Math 3.6.1, and how a standardised draw maps back to it. */
    private static RealDistribution reference(NoiseDistribution d) {
        switch (d) {
            case GAUSSIAN:
                return new NormalDistribution(0, 1);
            case UNIFORM:
                return new UniformRealDistribution(-Math.sqrt(3), Math.sqrt(3));
            case EXPONENTIAL:
                return new ExponentialDistribution(1.0);
            case LAPLACE:
                return new LaplaceDistribution(0, Math.sqrt(0.5));
            case GUMBEL:
                return new GumbelDistribution(NoiseDistribution.GUMBEL_LOCATION, NoiseDistribution.GUMBEL_SCALE);
            case STUDENT_T:
                return new TDistribution(DF);
            default:
                throw new AssertionError(d);
        }
    }

    private static double toRaw(NoiseDistribution d, double x) {
        switch (d) {
            case EXPONENTIAL:
                return x + 1;
            case STUDENT_T:
                return x / Math.sqrt((DF - 2) / DF);
            default:
                return x;
        }
    }

    @ParameterizedTest(name = "{0}: mean 0, variance 1, Kolmogorov–Smirnov against Commons Math's distribution")
    @EnumSource(NoiseDistribution.class)
    void matchesReference(NoiseDistribution d) {
        int n = 40_000;
        ContinuousSampler s = d.standardSampler(Seeds.random(Seeds.derive(99, d.word())), DF);
        double[] x = new double[n];
        double sum = 0;
        for (int i = 0; i < n; i++) {
            x[i] = s.sample();
            sum += x[i];
        }
        double mean = sum / n;
        double ss = 0;
        double fourth = 0;
        for (double v : x) {
            ss += (v - mean) * (v - mean);
            fourth += Math.pow(v - mean, 4);
        }
        double var = ss / (n - 1);
        double kurt = fourth / n;
        assertEquals(0.0, mean, 5 * Math.sqrt(1.0 / n), "mean");
        // SE of the sample variance is sqrt((μ4 − σ⁴)/n); 6 SE for the heavy-tailed t.
        assertEquals(1.0, var, 6 * Math.sqrt((kurt - 1) / n), "variance");
        double[] raw = new double[n];
        for (int i = 0; i < n; i++) {
            raw[i] = toRaw(d, x[i]);
        }
        double pValue = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(reference(d), raw);
        assertTrue(pValue > 0.001, d + ": KS p-value " + pValue);
        // The documented standardisation turns Commons Math's mean and variance into 0 and 1.
        RealDistribution ref = reference(d);
        double factor = d == NoiseDistribution.STUDENT_T ? (DF - 2) / DF : 1.0;
        // Commons Math 3.6.1's GumbelDistribution.getNumericalMean uses π/(2e) ≈ 0.57786 for the
        // Euler–Mascheroni constant (its cdf is right), so the Gumbel mean is checked with Gamma.GAMMA.
        double refMean = d == NoiseDistribution.GUMBEL
                ? NoiseDistribution.GUMBEL_LOCATION + Gamma.GAMMA * NoiseDistribution.GUMBEL_SCALE
                : ref.getNumericalMean();
        assertEquals(0.0, toRaw(d, 0) - refMean, 1e-12, "mean of the reference");
        assertEquals(1.0, ref.getNumericalVariance() * factor, 1e-12, "variance of the reference");
    }
}
