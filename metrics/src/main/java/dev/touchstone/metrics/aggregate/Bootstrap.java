package dev.touchstone.metrics.aggregate;

import org.apache.commons.rng.UniformRandomProvider;

import java.util.Arrays;

/**
 * The percentile bootstrap interval of a mean (Efron and Tibshirani 1993, "An Introduction to the
 * Bootstrap", ch. 13): resample the values with replacement, take the mean of each resample, and
 * report the empirical (1 − level)/2 and (1 + level)/2 quantiles of those means.
 *
 * <p>The random source is passed in, so an interval is reproducible from its seed. Cost:
 * O(resamples · n) time, O(resamples) memory.
 */
public final class Bootstrap {

    /** Resamples used by the study summaries: enough for stable 2.5% and 97.5% quantiles. */
    public static final int DEFAULT_RESAMPLES = 2000;

    private Bootstrap() {
    }

    /**
     * The percentile interval of the mean of {@code values} at {@code level} (e.g. 0.95).
     *
     * @return {low, high}
     * @throws IllegalArgumentException for fewer than two values, a level outside (0, 1) or too few resamples
     */
    public static double[] meanInterval(double[] values, double level, int resamples, UniformRandomProvider rng) {
        if (values.length < 2) {
            throw new IllegalArgumentException("a bootstrap interval needs at least two values, got " + values.length);
        }
        if (!(level > 0 && level < 1)) {
            throw new IllegalArgumentException("interval level must be in (0, 1), got " + level);
        }
        if (resamples < 10) {
            throw new IllegalArgumentException("at least 10 bootstrap resamples are needed, got " + resamples);
        }
        int n = values.length;
        double[] means = new double[resamples];
        for (int b = 0; b < resamples; b++) {
            double sum = 0;
            for (int k = 0; k < n; k++) {
                sum += values[rng.nextInt(n)];
            }
            means[b] = sum / n;
        }
        Arrays.sort(means);
        double tail = (1 - level) / 2;
        return new double[] {Quantiles.ofSorted(means, tail), Quantiles.ofSorted(means, 1 - tail)};
    }
}
