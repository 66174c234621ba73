package dev.touchstone.metrics.rank;

/**
 * The critical difference of the Nemenyi post-hoc test (Nemenyi 1963) as presented by Demšar
 * (2006, "Statistical comparisons of classifiers over multiple data sets", JMLR 7, §3.2.2):
 * two of k methods ranked over N data sets differ when their mean ranks differ by at least
 * CD = q_α √(k(k+1)/(6N)), where q_α is the studentized range quantile at infinite degrees of
 * freedom divided by √2 (Demšar 2006, Table 5a, k = 2 … 10). Cost O(1).
 */
public final class Nemenyi {

    /** q at α = 0.05 for k = 2 … 10 (Demšar 2006, Table 5a). */
    private static final double[] Q_05 = {1.960, 2.343, 2.569, 2.728, 2.850, 2.949, 3.031, 3.102, 3.164};
    /** q at α = 0.10 for k = 2 … 10 (Demšar 2006, Table 5a; from memory, checked in the tests by integration). */
    private static final double[] Q_10 = {1.645, 2.052, 2.291, 2.459, 2.589, 2.693, 2.780, 2.855, 2.920};

    private Nemenyi() {
    }

    /** q_α for k methods, or null when the table has no entry (α other than 0.05 or 0.10, or k outside 2 … 10). */
    public static Double q(int k, double alpha) {
        double[] row = alpha == 0.05 ? Q_05 : alpha == 0.10 ? Q_10 : null;
        if (row == null || k < 2 || k > 10) {
            return null;
        }
        return row[k - 2];
    }

    /** The critical difference of mean ranks for k methods over n settings, or null when q is not tabled. */
    public static Double criticalDifference(int k, int n, double alpha) {
        if (n < 1) {
            throw new IllegalArgumentException("the critical difference needs at least one setting, got " + n);
        }
        Double q = q(k, alpha);
        return q == null ? null : q * Math.sqrt(k * (k + 1) / (6.0 * n));
    }
}
