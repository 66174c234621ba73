package dev.touchstone.metrics.results;

import java.util.Objects;

/**
 * Descriptive statistics of one metric over the ok runs of a group, with a seeded percentile
 * bootstrap 95% interval for the mean. Any statistic is null when it cannot be computed from
 * the values present (no values; one value for the standard deviation and the interval).
 *
 * @param count     number of defined values summarised
 * @param mean      arithmetic mean
 * @param sd        sample standard deviation (n − 1 denominator)
 * @param interval  the bootstrap 95% interval of the mean
 * @param quartiles the median and the first and third quartiles
 */
public record Summary(int count, Double mean, Double sd, Interval interval, Quartiles quartiles) {

    /** The summary of no values. */
    public static final Summary EMPTY = new Summary(0, null, null, Interval.UNDEFINED, Quartiles.UNDEFINED);

    public Summary {
        Records.nonNegative(count, "count");
        Records.finiteOrNull(mean, "mean");
        Records.finiteOrNull(sd, "sd");
        Objects.requireNonNull(interval, "interval");
        Objects.requireNonNull(quartiles, "quartiles");
    }

    /** Lower end of the bootstrap 95% interval of the mean. */
    public Double low() {
        return interval.low();
    }

    /** Upper end of the bootstrap 95% interval of the mean. */
    public Double high() {
        return interval.high();
    }

    /** Median (mean of the two middle values for an even count). */
    public Double median() {
        return quartiles.median();
    }

    /** First quartile. */
    public Double q1() {
        return quartiles.q1();
    }

    /** Third quartile. */
    public Double q3() {
        return quartiles.q3();
    }

    /**
     * An interval of the mean; both ends null when undefined.
     *
     * @param low  lower end
     * @param high upper end
     */
    public record Interval(Double low, Double high) {

        /** No interval (fewer than two values). */
        public static final Interval UNDEFINED = new Interval(null, null);

        public Interval {
            Records.finiteOrNull(low, "low");
            Records.finiteOrNull(high, "high");
        }
    }

    /**
     * The quartiles of the values (Hyndman–Fan type 7); each null when there are no values.
     *
     * @param q1     first quartile
     * @param median median
     * @param q3     third quartile
     */
    public record Quartiles(Double q1, Double median, Double q3) {

        /** No quartiles (no values). */
        public static final Quartiles UNDEFINED = new Quartiles(null, null, null);

        public Quartiles {
            Records.finiteOrNull(q1, "q1");
            Records.finiteOrNull(median, "median");
            Records.finiteOrNull(q3, "q3");
        }
    }
}
