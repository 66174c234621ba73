package dev.touchstone.metrics.results;

import java.util.Objects;

/**
 * One row of a study's summary: one setting × learner configuration × metric.
 *
 * @param setting         the grid point
 * @param configurationId the learner configuration
 * @param learnerId       the learner it uses
 * @param metric          the metric name
 * @param okRuns          runs of this group that finished ok
 * @param failedRuns      runs that failed or timed out
 * @param skippedRuns     runs not attempted
 * @param summary         statistics of the metric's defined values over the ok runs
 *                        ({@code summary.count()} may be below {@code okRuns} when some values are undefined)
 */
public record AggregateRow(Setting setting, String configurationId, String learnerId, String metric,
                           int okRuns, int failedRuns, int skippedRuns, Summary summary) {

    public AggregateRow {
        Objects.requireNonNull(setting, "setting");
        Records.requireName(configurationId, "learner configuration id");
        Records.requireName(learnerId, "learner id");
        Records.requireName(metric, "metric");
        Records.nonNegative(okRuns, "ok runs");
        Records.nonNegative(failedRuns, "failed runs");
        Records.nonNegative(skippedRuns, "skipped runs");
        Objects.requireNonNull(summary, "summary");
        if (summary.count() > okRuns) {
            throw new IllegalArgumentException("summary of " + metric + " counts " + summary.count()
                    + " values but only " + okRuns + " runs are ok");
        }
    }
}
