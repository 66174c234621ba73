package dev.touchstone.metrics.results;

import dev.touchstone.core.graph.GraphClass;

import java.util.Map;
import java.util.Objects;

/**
 * The result of one run: one learner configuration applied to one replicate's data set.
 *
 * <p>Tidy by construction: every field is one plain value or an ordered map of plain names to
 * plain values, so a writer can lay a run out as one CSV row. Metric values are null when
 * undefined (a ratio with a zero denominator, a metric that does not apply to the estimate's
 * class) and for runs that did not finish.
 *
 * @param key             stable run key: a hash of everything that defines the run
 * @param setting         the grid point
 * @param replicate       the replicate number within the setting (0-based)
 * @param configurationId the learner configuration id as named in the study (unique per configuration)
 * @param learnerId       the id of the learner the configuration uses
 * @param parameters      the configuration's resolved parameter values, as text, in declaration order
 * @param seed            the seed the run's context was given
 * @param status          how the run ended
 * @param message         why it failed, timed out or was skipped; null for ok runs
 * @param estimateClass   the class of graph the learner returned; null when it returned none
 * @param scoredAgainst   the class of truth the estimate was scored against; null when not scored
 * @param metrics         structural metric values by metric name (values may be null)
 * @param timings         what the run cost
 */
public record RunResult(
        String key,
        Setting setting,
        int replicate,
        String configurationId,
        String learnerId,
        Map<String, String> parameters,
        long seed,
        RunStatus status,
        String message,
        GraphClass estimateClass,
        GraphClass scoredAgainst,
        Map<String, Double> metrics,
        Timings timings) {

    public RunResult {
        Records.requireName(key, "run key");
        Objects.requireNonNull(setting, "setting");
        Records.nonNegative(replicate, "replicate");
        Records.requireName(configurationId, "learner configuration id");
        Records.requireName(learnerId, "learner id");
        parameters = Records.textMap(parameters, "parameter");
        Objects.requireNonNull(status, "status");
        metrics = Records.valueMap(metrics, "metric");
        timings = timings == null ? Timings.NONE : timings;
        if (status != RunStatus.OK && metrics.values().stream().anyMatch(Objects::nonNull)) {
            throw new IllegalArgumentException("run " + key + " is " + status.word() + " but carries metric values");
        }
        if (status != RunStatus.OK && (message == null || message.isBlank())) {
            throw new IllegalArgumentException("run " + key + " is " + status.word() + " and needs a message saying why");
        }
    }

    /** Whether the run finished and was scored. */
    public boolean isOk() {
        return status == RunStatus.OK;
    }

    /**
     * The value of a metric for this run: a structural metric from {@link #metrics()}, or a
     * measurement ({@code seconds}, {@code cpu_seconds}, {@code allocated_mb}, {@code tests},
     * {@code scores}) from {@link #timings()}. Null when undefined, not measured, or the run is
     * not ok.
     */
    public Double value(String metric) {
        if (!isOk()) {
            return null;
        }
        if (metrics.containsKey(metric)) {
            return metrics.get(metric);
        }
        return timings.value(metric);
    }
}
