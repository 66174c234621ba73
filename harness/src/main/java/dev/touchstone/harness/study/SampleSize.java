package dev.touchstone.harness.study;

/**
 * A sample size of a study: a number of rows, or the oracle (an infinite sample: learners
 * get d-separation answers or the population covariance instead of data).
 */
public record SampleSize(long rows) implements Comparable<SampleSize> {

    private static final long ORACLE_ROWS = Long.MAX_VALUE;

    /** The word used in files for the infinite sample size. */
    public static final String ORACLE_WORD = "oracle";

    public SampleSize {
        if (rows < 1) {
            throw new IllegalArgumentException("a sample size must be at least 1, got " + rows);
        }
    }

    public static SampleSize of(long rows) {
        return new SampleSize(rows);
    }

    public static SampleSize oracle() {
        return new SampleSize(ORACLE_ROWS);
    }

    public boolean isOracle() {
        return rows == ORACLE_ROWS;
    }

    /** The number of rows as an int (data sets are int-indexed). */
    public int intRows() {
        if (isOracle()) {
            throw new IllegalStateException("the oracle has no rows");
        }
        return Math.toIntExact(rows);
    }

    /** As written in files and CSV: the number, or {@code oracle}. */
    public String word() {
        return isOracle() ? ORACLE_WORD : Long.toString(rows);
    }

    @Override
    public int compareTo(SampleSize o) {
        return Long.compare(rows, o.rows);
    }

    @Override
    public String toString() {
        return word();
    }
}
