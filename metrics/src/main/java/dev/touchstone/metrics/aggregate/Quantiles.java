package dev.touchstone.metrics.aggregate;

/**
 * Sample quantiles by linear interpolation between order statistics: definition 7 of Hyndman and
 * Fan (1996, "Sample quantiles in statistical packages", The American Statistician 50), the
 * default of R and NumPy, so that figures match what users compute themselves.
 */
public final class Quantiles {

    private Quantiles() {
    }

    /**
     * The {@code prob}-quantile of values already sorted ascending: with h = (n − 1)·prob,
     * x[⌊h⌋] + (h − ⌊h⌋)(x[⌊h⌋ + 1] − x[⌊h⌋]). Cost O(1).
     *
     * @throws IllegalArgumentException for no values or prob outside [0, 1]
     */
    public static double ofSorted(double[] sorted, double prob) {
        if (sorted.length == 0) {
            throw new IllegalArgumentException("a quantile needs at least one value");
        }
        if (!(prob >= 0 && prob <= 1)) {
            throw new IllegalArgumentException("quantile probability must be in [0, 1], got " + prob);
        }
        double h = (sorted.length - 1) * prob;
        int lo = (int) Math.floor(h);
        int hi = Math.min(lo + 1, sorted.length - 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }
}
