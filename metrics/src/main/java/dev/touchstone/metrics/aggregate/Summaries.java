package dev.touchstone.metrics.aggregate;

import dev.touchstone.metrics.results.Summary;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.Arrays;

/**
 * Descriptive statistics of one list of values: count, mean, sample standard deviation, seeded
 * percentile-bootstrap 95% interval of the mean, median and quartiles (Hyndman and Fan type 7).
 * Cost: O(n log n + resamples · n).
 */
public final class Summaries {

    /** The interval level of study summaries. */
    public static final double LEVEL = 0.95;

    private Summaries() {
    }

    /**
     * The summary of {@code values}; statistics that need more values than there are are null
     * (no values: all; one value: sd and interval).
     */
    public static Summary of(double[] values, UniformRandomProvider rng) {
        int n = values.length;
        if (n == 0) {
            return Summary.EMPTY;
        }
        for (double v : values) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("cannot summarise a non-finite value: " + v);
            }
        }
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        double mean = mean(values);
        Double sd = null;
        Summary.Interval interval = Summary.Interval.UNDEFINED;
        if (n >= 2) {
            double ss = 0;
            for (double v : values) {
                ss += (v - mean) * (v - mean);
            }
            sd = Math.sqrt(ss / (n - 1));
            double[] ci = Bootstrap.meanInterval(values, LEVEL, Bootstrap.DEFAULT_RESAMPLES, rng);
            interval = new Summary.Interval(ci[0], ci[1]);
        }
        return new Summary(n, mean, sd, interval, new Summary.Quartiles(Quantiles.ofSorted(sorted, 0.25),
                Quantiles.ofSorted(sorted, 0.5), Quantiles.ofSorted(sorted, 0.75)));
    }

    /** The arithmetic mean, summed in a second pass of corrections for accuracy (common practice). */
    static double mean(double[] values) {
        double sum = 0;
        for (double v : values) {
            sum += v;
        }
        double m = sum / values.length;
        double correction = 0;
        for (double v : values) {
            correction += v - m;
        }
        return m + correction / values.length;
    }
}
