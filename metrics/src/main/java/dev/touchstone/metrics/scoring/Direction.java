package dev.touchstone.metrics.scoring;

/** Which way a metric improves; decides wins and losses in comparisons and the order of ranks. */
public enum Direction {
    /** Larger values are better (precision, recall, F1, TPR, exact). */
    HIGHER_IS_BETTER,
    /** Smaller values are better (SHD, SID, FDR, FPR, time). */
    LOWER_IS_BETTER,
    /** Neither (an edge count describes, it does not judge). */
    NONE;

    /**
     * Positive when {@code a} is better than {@code b}, negative when worse, 0 when equal or
     * when the metric has no direction.
     */
    public int compare(double a, double b) {
        switch (this) {
            case HIGHER_IS_BETTER: return Double.compare(a, b);
            case LOWER_IS_BETTER: return Double.compare(b, a);
            default: return 0;
        }
    }

    /** The word written in listings: {@code higher}, {@code lower} or {@code none}. */
    public String word() {
        switch (this) {
            case HIGHER_IS_BETTER: return "higher";
            case LOWER_IS_BETTER: return "lower";
            default: return "none";
        }
    }
}
