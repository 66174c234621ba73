package dev.touchstone.metrics.compare;

import org.apache.commons.statistics.distribution.NormalDistribution;
import org.apache.commons.statistics.ranking.NaNStrategy;
import org.apache.commons.statistics.ranking.NaturalRanking;
import org.apache.commons.statistics.ranking.TiesStrategy;

/**
 * The two-sided Wilcoxon signed-rank test (Wilcoxon 1945, "Individual comparisons by ranking
 * methods", Biometrics Bulletin 1) of paired differences, with zero differences and ties
 * handled as Pratt (1959, "Remarks on zeros and ties in the Wilcoxon signed rank procedures",
 * JASA 54) proposes: all n absolute differences, zeros included, are ranked with midranks for
 * ties; the zeros' ranks are then left out, and the statistic W⁺ is the sum of the ranks of the
 * positive differences.
 *
 * <p>The p-value comes from the null distribution of W⁺ conditional on the observed ranks: each
 * nonzero rank carries a plus or minus sign with probability ½, independently. For n ≤
 * {@value #EXACT_LIMIT} that distribution is computed exactly (midranks are multiples of ½, so
 * doubled ranks are integers and a convolution over their sums gives every probability), which
 * stays correct with any number of zeros and ties; above, the normal approximation with the
 * conditional mean Σr/2, variance Σr²/4 and a continuity correction of ½ is used. The two-sided
 * p-value is P(|W⁺ − Σr/2| ≥ |w⁺ − Σr/2|).
 *
 * <p>Why not Commons Statistics' test alone: version 1.1 subtracts the tie term of the group of
 * zeros from the variance of its normal approximation although the zeros' ranks are not in the
 * statistic; with one nonzero difference among fifteen the variance turns negative and the
 * p-value NaN. The exact conditional distribution has no such case. Cost O(n log n) for the ranks
 * plus O(m · n²) for the exact distribution of m nonzero differences.
 */
public final class SignedRankTest {

    /** The largest number of pairs for which the exact null distribution is computed. */
    public static final int EXACT_LIMIT = 200;

    private static final NaturalRanking RANKING = new NaturalRanking(NaNStrategy.FAILED, TiesStrategy.AVERAGE);

    private SignedRankTest() {
    }

    /**
     * The outcome of one test.
     *
     * @param pairs     n, all differences including zeros
     * @param zeros     how many differences are zero
     * @param statistic W⁺, the sum of the (Pratt) ranks of the positive differences
     * @param pValue    the two-sided p-value; null when every difference is zero (nothing to test)
     * @param exact     whether the p-value is from the exact distribution (else the normal approximation)
     */
    public record Result(int pairs, int zeros, double statistic, Double pValue, boolean exact) {
    }

    /**
     * Tests whether the differences are symmetric about zero.
     *
     * @throws IllegalArgumentException for NaN or infinite differences
     */
    public static Result test(double[] differences) {
        return test(differences, differences.length <= EXACT_LIMIT);
    }

    /** The test with the choice of exact or approximate p-value made by the caller (package-private for checks). */
    static Result test(double[] differences, boolean exact) {
        int n = differences.length;
        double[] abs = new double[n];
        for (int i = 0; i < n; i++) {
            double v = differences[i];
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("a paired difference must be finite, got " + v);
            }
            abs[i] = Math.abs(v);
        }
        double[] ranks = n == 0 ? new double[0] : RANKING.apply(abs);
        int zeros = 0;
        int m = 0;
        int[] doubled = new int[n];
        long total = 0;
        long observed = 0;
        for (int i = 0; i < n; i++) {
            if (differences[i] == 0) {
                zeros++;
                continue;
            }
            int r2 = (int) Math.round(2 * ranks[i]);
            doubled[m++] = r2;
            total += r2;
            observed += differences[i] > 0 ? r2 : 0;
        }
        double statistic = observed / 2.0;
        if (m == 0) {
            return new Result(n, zeros, statistic, null, exact);
        }
        double p = exact ? exactP(doubled, m, total, observed) : normalP(doubled, m, total, observed);
        return new Result(n, zeros, statistic, Math.min(1.0, p), exact);
    }

    /** P(|2W⁺ − T| ≥ |2w⁺ − T|) in doubled units, by convolving the m independent ± signs. */
    private static double exactP(int[] doubled, int m, long total, long observed) {
        int t = (int) total;
        double[] dist = new double[t + 1];
        dist[0] = 1;
        int reach = 0;
        for (int k = 0; k < m; k++) {
            int r = doubled[k];
            for (int s = reach; s >= 0; s--) {
                double half = dist[s] / 2;
                dist[s] = half;
                dist[s + r] += half;
            }
            reach += r;
        }
        long distance = Math.abs(2 * observed - total);
        double p = 0;
        for (int s = 0; s <= t; s++) {
            if (Math.abs(2L * s - total) >= distance) {
                p += dist[s];
            }
        }
        return p;
    }

    /** The normal approximation with the conditional mean and variance and a continuity correction of ½. */
    private static double normalP(int[] doubled, int m, long total, long observed) {
        double mean = total / 4.0;
        double variance = 0;
        for (int k = 0; k < m; k++) {
            double r = doubled[k] / 2.0;
            variance += r * r / 4;
        }
        double distance = Math.max(0, Math.abs(observed / 2.0 - mean) - 0.5);
        return 2 * NormalDistribution.of(0, 1).survivalProbability(distance / Math.sqrt(variance));
    }
}
