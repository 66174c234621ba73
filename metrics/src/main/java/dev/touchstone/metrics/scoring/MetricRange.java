package dev.touchstone.metrics.scoring;

/**
 * The values a metric can take.
 *
 * @param lower the smallest value
 * @param upper the largest value when it is a constant; null when it grows with the graph
 *              (then {@code text} says how) or is unbounded
 * @param text  a readable form such as {@code 0 … 1} or {@code 0 … p(p−1)/2}
 */
public record MetricRange(double lower, Double upper, String text) {

    /** The unit interval, for proportions. */
    public static final MetricRange UNIT = new MetricRange(0, 1.0, "0 … 1");

    /** Zero or one. */
    public static final MetricRange ZERO_ONE = new MetricRange(0, 1.0, "0 or 1");

    /** Non-negative and unbounded, for measurements. */
    public static final MetricRange NON_NEGATIVE = new MetricRange(0, null, "≥ 0");

    /** From 0 to a bound that depends on the number of variables p, written in {@code text}. */
    public static MetricRange upTo(String bound) {
        return new MetricRange(0, null, "0 … " + bound);
    }

    /** Whether {@code v} lies in the range (the upper end is checked only when constant). */
    public boolean contains(double v) {
        return v >= lower && (upper == null || v <= upper);
    }
}
