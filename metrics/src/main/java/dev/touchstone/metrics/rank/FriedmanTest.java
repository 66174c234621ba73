package dev.touchstone.metrics.rank;

import org.apache.commons.statistics.distribution.ChiSquaredDistribution;
import org.apache.commons.statistics.ranking.NaNStrategy;
import org.apache.commons.statistics.ranking.NaturalRanking;
import org.apache.commons.statistics.ranking.TiesStrategy;

/**
 * The Friedman test (Friedman 1937, "The use of ranks to avoid the assumption of normality
 * implicit in the analysis of variance", JASA 32) for k treatments over N blocks, with the
 * correction for ties of Hollander and Wolfe (1973, §7.1):
 *
 * <pre>
 *   χ²_F = 12 Σ_j (R_j − N(k+1)/2)² / ( N k (k+1) − Σ_blocks Σ_ties (t³ − t) / (k − 1) )
 * </pre>
 *
 * where R_j is the rank sum of treatment j and t the sizes of the groups of tied values within a
 * block (midranks). The p-value is the χ² survival probability on k − 1 degrees of freedom. Ranks
 * come from Commons Statistics' {@link NaturalRanking} with averaged ties. Cost O(N k log k).
 */
public final class FriedmanTest {

    private static final NaturalRanking RANKING = new NaturalRanking(NaNStrategy.FAILED, TiesStrategy.AVERAGE);

    private FriedmanTest() {
    }

    /**
     * The result of the test.
     *
     * @param meanRanks  mean rank of each treatment (rank 1 for the smallest value of a block)
     * @param chiSquare  the tie-corrected statistic; NaN when every block is one complete tie
     * @param df         k − 1
     * @param pValue     the χ² survival probability; NaN with the statistic
     */
    public record Result(double[] meanRanks, double chiSquare, int df, double pValue) {
    }

    /**
     * Tests {@code blocks[b][j]}: the value of treatment j in block b. Smaller values get smaller
     * ranks; negate the values to rank larger ones first.
     *
     * @throws IllegalArgumentException with fewer than 2 blocks or 2 treatments, ragged rows or NaN
     */
    public static Result test(double[][] blocks) {
        int n = blocks.length;
        if (n < 2) {
            throw new IllegalArgumentException("the Friedman test needs at least 2 blocks, got " + n);
        }
        int k = blocks[0].length;
        if (k < 2) {
            throw new IllegalArgumentException("the Friedman test needs at least 2 treatments, got " + k);
        }
        double[] rankSums = new double[k];
        double ties = 0;
        for (int b = 0; b < n; b++) {
            if (blocks[b].length != k) {
                throw new IllegalArgumentException("block " + (b + 1) + " has " + blocks[b].length
                        + " values, expected " + k);
            }
            double[] ranks = RANKING.apply(blocks[b]);
            for (int j = 0; j < k; j++) {
                rankSums[j] += ranks[j];
            }
            ties += tieTerm(ranks);
        }
        double centre = n * (k + 1) / 2.0;
        double ss = 0;
        for (double r : rankSums) {
            ss += (r - centre) * (r - centre);
        }
        double denominator = n * k * (k + 1.0) - ties / (k - 1);
        double chi = denominator > 0 ? 12 * ss / denominator : Double.NaN;
        double p = Double.isNaN(chi) ? Double.NaN : ChiSquaredDistribution.of(k - 1).survivalProbability(chi);
        double[] mean = new double[k];
        for (int j = 0; j < k; j++) {
            mean[j] = rankSums[j] / n;
        }
        return new Result(mean, chi, k - 1, p);
    }

    /** Σ (t³ − t) over the groups of equal midranks in one block. */
    private static double tieTerm(double[] ranks) {
        double[] sorted = ranks.clone();
        java.util.Arrays.sort(sorted);
        double sum = 0;
        int i = 0;
        while (i < sorted.length) {
            int j = i;
            while (j + 1 < sorted.length && sorted[j + 1] == sorted[i]) {
                j++;
            }
            double t = j - i + 1;
            sum += t * t * t - t;
            i = j + 1;
        }
        return sum;
    }
}
