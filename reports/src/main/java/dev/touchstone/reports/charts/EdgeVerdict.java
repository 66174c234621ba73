package dev.touchstone.reports.charts;

/** How an edge of a truth/estimate picture compares with the other graph. */
public enum EdgeVerdict {
    /** Present in both with the same marks. */
    CORRECT,
    /** Adjacent in both, but some mark differs. */
    WRONG_MARKS,
    /** In the truth, not in the estimate. */
    MISSING,
    /** In the estimate, not in the truth. */
    EXTRA
}
