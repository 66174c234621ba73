package dev.touchstone.metrics.results;

import java.util.Objects;

/**
 * A paired comparison of one learner configuration with the reference configuration on one
 * setting and one metric, over the replicates where both runs are ok and the metric is defined
 * for both (identical data sets: a paired design).
 *
 * <p>Differences are {@code configuration − reference}. Wins, ties and losses respect the
 * metric's direction: a win is a replicate where the configuration is strictly better than the
 * reference. For metrics without a direction ({@code edges}) wins, ties and losses are null.
 *
 * @param setting         the grid point
 * @param metric          the metric name
 * @param configurationId the configuration compared
 * @param referenceId     the reference configuration
 * @param pairs           number of paired replicates used
 * @param meanDifference  mean of the differences; null without pairs
 * @param low             lower end of the seeded bootstrap 95% interval of the mean difference
 * @param high            upper end of that interval
 * @param pValue          two-sided Wilcoxon signed-rank p-value; null when not computable
 *                        (fewer than one non-zero difference)
 * @param pHolm           Holm-adjusted p-value across the configurations compared on this
 *                        setting and metric
 * @param wins            replicates where the configuration is better
 * @param ties            replicates with equal values
 * @param losses          replicates where the reference is better
 */
public record ComparisonRow(Setting setting, String metric, String configurationId, String referenceId, int pairs,
                            Double meanDifference, Double low, Double high, Double pValue, Double pHolm,
                            Integer wins, Integer ties, Integer losses) {

    public ComparisonRow {
        Objects.requireNonNull(setting, "setting");
        Records.requireName(metric, "metric");
        Records.requireName(configurationId, "learner configuration id");
        Records.requireName(referenceId, "reference configuration id");
        Records.nonNegative(pairs, "pairs");
        Records.finiteOrNull(meanDifference, "mean difference");
        Records.finiteOrNull(low, "low");
        Records.finiteOrNull(high, "high");
        Records.finiteOrNull(pValue, "p-value");
        Records.finiteOrNull(pHolm, "Holm p-value");
        if (wins != null && ties != null && losses != null && wins + ties + losses != pairs) {
            throw new IllegalArgumentException("wins + ties + losses must equal pairs (" + pairs + "), got "
                    + wins + " + " + ties + " + " + losses);
        }
    }

    /** This row with its Holm-adjusted p-value set. */
    public ComparisonRow withHolm(Double adjusted) {
        return new ComparisonRow(setting, metric, configurationId, referenceId, pairs, meanDifference, low, high,
                pValue, adjusted, wins, ties, losses);
    }
}
