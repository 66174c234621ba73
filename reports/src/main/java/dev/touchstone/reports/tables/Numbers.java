package dev.touchstone.reports.tables;

import java.util.Locale;

/**
 * Number formatting for tables: undefined values (null or NaN) print as "n/a", never as
 * 0 or 1 (a ratio with a zero denominator is undefined); fixed significant digits otherwise.
 */
public final class Numbers {

    /** What an undefined value prints as in tables. */
    public static final String UNDEFINED = "n/a";

    private Numbers() {
    }

    /** A value with three significant digits (plain notation between 0.001 and 10⁶). */
    public static String format(Double v) {
        if (v == null || v.isNaN()) {
            return UNDEFINED;
        }
        if (v.isInfinite()) {
            return v > 0 ? "inf" : "-inf";
        }
        double a = Math.abs(v);
        if (a == 0) {
            return "0";
        }
        if (a >= 1e6 || a < 1e-3) {
            return String.format(Locale.ROOT, "%.2e", v);
        }
        if (v == Math.rint(v) && a < 1e6) {
            return Long.toString(Math.round(v));
        }
        int digits = Math.max(0, 2 - (int) Math.floor(Math.log10(a)));
        return String.format(Locale.ROOT, "%." + digits + "f", v);
    }

    /** "mean [low, high]", or just the mean when the interval is undefined. */
    public static String withInterval(Double mean, Double low, Double high) {
        if (mean == null || mean.isNaN()) {
            return UNDEFINED;
        }
        if (low == null || high == null || low.isNaN() || high.isNaN()) {
            return format(mean);
        }
        return format(mean) + " [" + format(low) + ", " + format(high) + "]";
    }
}
