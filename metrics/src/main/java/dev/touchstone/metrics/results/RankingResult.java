package dev.touchstone.metrics.results;

import java.util.List;
import java.util.Objects;

/**
 * The ranking of learner configurations over the settings of a study on one metric, as data a
 * report can draw as a critical-difference diagram (Demšar 2006, "Statistical comparisons of
 * classifiers over multiple data sets", JMLR 7).
 *
 * <p>Rank 1 is best, according to the metric's direction; tied configurations share the mean
 * of their ranks. Only settings where every configuration has a value take part.
 *
 * @param metric              the metric
 * @param configurations      the configurations ranked, in the order of {@code meanRanks}
 * @param meanRanks           mean rank of each configuration over the settings used
 * @param settingsUsed        N: settings where every configuration has a value
 * @param settingsDropped     settings left out because some configuration had no value
 * @param friedmanChiSquare   the tie-corrected Friedman statistic; null when N &lt; 2 or k &lt; 2,
 *                            or when every setting is a complete tie
 * @param degreesOfFreedom    k − 1
 * @param friedmanPValue      its χ² survival probability on k − 1 degrees of freedom
 * @param alpha               significance level of the critical difference
 * @param criticalDifference  the Nemenyi critical difference of mean ranks at {@code alpha};
 *                            null when the q table has no entry for k
 */
public record RankingResult(String metric, List<String> configurations, List<Double> meanRanks, int settingsUsed,
                            int settingsDropped, Double friedmanChiSquare, int degreesOfFreedom,
                            Double friedmanPValue, double alpha, Double criticalDifference) {

    public RankingResult {
        Records.requireName(metric, "metric");
        configurations = Records.list(configurations, "configurations");
        meanRanks = Records.values(meanRanks, "mean rank");
        if (configurations.size() != meanRanks.size()) {
            throw new IllegalArgumentException(configurations.size() + " configurations but "
                    + meanRanks.size() + " mean ranks");
        }
        Records.nonNegative(settingsUsed, "settings used");
        Records.nonNegative(settingsDropped, "settings dropped");
        Records.finiteOrNull(friedmanChiSquare, "Friedman statistic");
        Records.finiteOrNull(friedmanPValue, "Friedman p-value");
        Records.finiteOrNull(criticalDifference, "critical difference");
        Objects.requireNonNull(configurations);
    }

    /**
     * Whether the mean ranks of two configurations differ by at least the critical difference
     * (the Nemenyi test's verdict); false when there is no critical difference.
     */
    public boolean differ(String a, String b) {
        int i = configurations.indexOf(a);
        int j = configurations.indexOf(b);
        if (i < 0 || j < 0) {
            throw new IllegalArgumentException("unknown configuration '" + (i < 0 ? a : b) + "'");
        }
        Double ri = meanRanks.get(i);
        Double rj = meanRanks.get(j);
        return criticalDifference != null && ri != null && rj != null && Math.abs(ri - rj) >= criticalDifference;
    }
}
