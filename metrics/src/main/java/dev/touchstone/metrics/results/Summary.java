package dev.touchstone.metrics.results;

/**
 * Descriptive statistics of one metric over the ok runs of a group, with a seeded percentile
 * bootstrap 95% interval for the mean. Any statistic is null when it cannot be computed from
 * the values present (no values; one value for the standard deviation and the interval).
 *
 * @param count  number of defined values summarised
 * @param mean   arithmetic mean
 * @param sd     sample standard deviation (n − 1 denominator)
 * @param low    lower end of the bootstrap 95% interval of the mean
 * @param high   upper end of the bootstrap 95% interval of the mean
 * @param median median (mean of the two middle values for an even count)
 * @param q1     first quartile
 * @param q3     third quartile
 */
public record Summary(int count, Double mean, Double sd, Double low, Double high, Double median, Double q1, Double q3) {

    /** The summary of no values. */
    public static final Summary EMPTY = new Summary(0, null, null, null, null, null, null, null);

    public Summary {
        Records.nonNegative(count, "count");
        Records.finiteOrNull(mean, "mean");
        Records.finiteOrNull(sd, "sd");
        Records.finiteOrNull(low, "low");
        Records.finiteOrNull(high, "high");
        Records.finiteOrNull(median, "median");
        Records.finiteOrNull(q1, "q1");
        Records.finiteOrNull(q3, "q3");
    }
}
