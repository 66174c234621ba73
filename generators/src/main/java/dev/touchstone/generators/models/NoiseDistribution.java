package dev.touchstone.generators.models;

import dev.touchstone.core.param.Worded;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ContinuousSampler;
import org.apache.commons.rng.sampling.distribution.TSampler;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

import java.util.List;
import java.util.Locale;

/**
 * Noise distributions for structural equations, each shifted and scaled to mean 0 and
 * variance 1 so that a noise scale means a standard deviation whatever the shape. The raw
 * distributions (before standardisation) are stated per constant so tests can compare
 * with an independent implementation. Non-Gaussian noise makes a linear model's full DAG
 * identifiable (Shimizu et al. 2006, "A linear non-Gaussian acyclic model for causal
 * discovery", JMLR 7). Cost O(1) per draw.
 */
public enum NoiseDistribution implements Worded {
    /** Standard normal, by the ziggurat method of Marsaglia and Tsang (2000), Commons RNG. */
    GAUSSIAN,
    /** Uniform on (−√3, √3). */
    UNIFORM,
    /** Exponential with rate 1, minus 1 (right-skewed). */
    EXPONENTIAL,
    /** Laplace with location 0 and scale 1/√2 (heavy tails, symmetric). */
    LAPLACE,
    /** Gumbel (maximum) with scale β = √6/π and location −γβ (γ the Euler–Mascheroni constant). */
    GUMBEL,
    /** Student t with ν degrees of freedom (ν &gt; 2) times √((ν − 2)/ν). */
    STUDENT_T;

    private static final double SQRT3 = Math.sqrt(3.0);
    private static final double EULER_GAMMA = 0.5772156649015329;
    /** The Gumbel scale β with variance π²β²/6 = 1. */
    public static final double GUMBEL_SCALE = Math.sqrt(6.0) / Math.PI;
    /** The Gumbel location with mean location + γβ = 0. */
    public static final double GUMBEL_LOCATION = -EULER_GAMMA * GUMBEL_SCALE;
    /** The Laplace scale b with variance 2b² = 1. */
    public static final double LAPLACE_SCALE = Math.sqrt(0.5);

    /** All words, in declaration order. */
    public static List<String> words() {
        return Worded.words(NoiseDistribution.class);
    }

    /** The distribution for a word. */
    public static NoiseDistribution parse(String word) {
        return Worded.parse(NoiseDistribution.class, word, "noise");
    }

    /**
     * A sampler of standardised draws (mean 0, variance 1) from {@code random}.
     *
     * @param degreesOfFreedom ν for {@link #STUDENT_T} (must exceed 2), ignored otherwise
     */
    public ContinuousSampler standardSampler(UniformRandomProvider random, double degreesOfFreedom) {
        switch (this) {
            case GAUSSIAN:
                return ZigguratSampler.NormalizedGaussian.of(random);
            case UNIFORM:
                return () -> SQRT3 * (2.0 * random.nextDouble() - 1.0);
            case EXPONENTIAL: {
                ZigguratSampler.Exponential e = ZigguratSampler.Exponential.of(random);
                return () -> e.sample() - 1.0;
            }
            case LAPLACE: {
                ZigguratSampler.Exponential e = ZigguratSampler.Exponential.of(random);
                return () -> {
                    double x = LAPLACE_SCALE * e.sample();
                    return random.nextBoolean() ? x : -x;
                };
            }
            case GUMBEL:
                return () -> {
                    double u = random.nextDouble();
                    while (u == 0.0) {
                        u = random.nextDouble();
                    }
                    return GUMBEL_LOCATION - GUMBEL_SCALE * Math.log(-Math.log(u));
                };
            case STUDENT_T: {
                if (!(degreesOfFreedom > 2)) {
                    throw new IllegalArgumentException(String.format(Locale.ROOT,
                            "student-t noise needs more than 2 degrees of freedom for a finite variance, got %s",
                            degreesOfFreedom));
                }
                TSampler t = TSampler.of(random, degreesOfFreedom);
                double scale = Math.sqrt((degreesOfFreedom - 2) / degreesOfFreedom);
                return () -> scale * t.sample();
            }
            default:
                throw new AssertionError(this);
        }
    }
}
