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
 * <p>Built with {@link #builder()}, since thirteen values given by position are easy to swap;
 * {@link #toBuilder()} gives a copy to change a few of them. Immutable; equal when every field
 * is equal.
 */
public final class RunResult {

    private final String key;
    private final Setting setting;
    private final int replicate;
    private final String configurationId;
    private final String learnerId;
    private final Map<String, String> parameters;
    private final long seed;
    private final RunStatus status;
    private final String message;
    private final GraphClass estimateClass;
    private final GraphClass scoredAgainst;
    private final Map<String, Double> metrics;
    private final Timings timings;

    private RunResult(Builder b) {
        key = Records.requireName(b.key, "run key");
        setting = Objects.requireNonNull(b.setting, "setting");
        replicate = Records.nonNegative(b.replicate, "replicate");
        configurationId = Records.requireName(b.configurationId, "learner configuration id");
        learnerId = Records.requireName(b.learnerId, "learner id");
        parameters = Records.textMap(b.parameters, "parameter");
        seed = b.seed;
        status = Objects.requireNonNull(b.status, "status");
        message = b.message;
        estimateClass = b.estimateClass;
        scoredAgainst = b.scoredAgainst;
        metrics = Records.valueMap(b.metrics, "metric");
        timings = b.timings == null ? Timings.NONE : b.timings;
        if (status != RunStatus.OK && metrics.values().stream().anyMatch(Objects::nonNull)) {
            throw new IllegalArgumentException("run " + key + " is " + status.word() + " but carries metric values");
        }
        if (status != RunStatus.OK && (message == null || message.isBlank())) {
            throw new IllegalArgumentException("run " + key + " is " + status.word() + " and needs a message saying why");
        }
    }

    /** A builder with no parameters, no metrics and no timings; key, setting, ids and status must be set. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder holding every value of this result, to change some of them. */
    public Builder toBuilder() {
        return new Builder().key(key).setting(setting).replicate(replicate).configurationId(configurationId)
                .learnerId(learnerId).parameters(parameters).seed(seed).status(status).message(message)
                .estimateClass(estimateClass).scoredAgainst(scoredAgainst).metrics(metrics).timings(timings);
    }

    /** Stable run key: a hash of everything that defines the run. */
    public String key() {
        return key;
    }

    /** The grid point. */
    public Setting setting() {
        return setting;
    }

    /** The replicate number within the setting (0-based). */
    public int replicate() {
        return replicate;
    }

    /** The learner configuration id as named in the study (unique per configuration). */
    public String configurationId() {
        return configurationId;
    }

    /** The id of the learner the configuration uses. */
    public String learnerId() {
        return learnerId;
    }

    /** The configuration's resolved parameter values, as text, in declaration order. */
    public Map<String, String> parameters() {
        return parameters;
    }

    /** The seed the run's context was given. */
    public long seed() {
        return seed;
    }

    /** How the run ended. */
    public RunStatus status() {
        return status;
    }

    /** Why it failed, timed out or was skipped; null for ok runs. */
    public String message() {
        return message;
    }

    /** The class of graph the learner returned; null when it returned none. */
    public GraphClass estimateClass() {
        return estimateClass;
    }

    /** The class of truth the estimate was scored against; null when not scored. */
    public GraphClass scoredAgainst() {
        return scoredAgainst;
    }

    /** Structural metric values by metric name (values may be null). */
    public Map<String, Double> metrics() {
        return metrics;
    }

    /** What the run cost. */
    public Timings timings() {
        return timings;
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

    @Override
    public boolean equals(Object o) {
        return o instanceof RunResult r && key.equals(r.key) && setting.equals(r.setting)
                && replicate == r.replicate && configurationId.equals(r.configurationId)
                && learnerId.equals(r.learnerId) && parameters.equals(r.parameters) && seed == r.seed
                && status == r.status && Objects.equals(message, r.message) && estimateClass == r.estimateClass
                && scoredAgainst == r.scoredAgainst && metrics.equals(r.metrics) && timings.equals(r.timings);
    }

    @Override
    public int hashCode() {
        return Objects.hash(key, setting, replicate, configurationId, learnerId, parameters, seed, status, message,
                estimateClass, scoredAgainst, metrics, timings);
    }

    @Override
    public String toString() {
        return "RunResult[key=" + key + ", setting=" + setting + ", replicate=" + replicate
                + ", configurationId=" + configurationId + ", learnerId=" + learnerId + ", parameters=" + parameters
                + ", seed=" + seed + ", status=" + status + ", message=" + message
                + ", estimateClass=" + estimateClass + ", scoredAgainst=" + scoredAgainst + ", metrics=" + metrics
                + ", timings=" + timings + "]";
    }

    /** Collects the values of a {@link RunResult}; {@link #build()} checks them. */
    public static final class Builder {
        private String key;
        private Setting setting;
        private int replicate;
        private String configurationId;
        private String learnerId;
        private Map<String, String> parameters = Map.of();
        private long seed;
        private RunStatus status;
        private String message;
        private GraphClass estimateClass;
        private GraphClass scoredAgainst;
        private Map<String, Double> metrics = Map.of();
        private Timings timings;

        private Builder() {
        }

        /** Stable run key. */
        public Builder key(String k) {
            key = k;
            return this;
        }

        /** The grid point. */
        public Builder setting(Setting s) {
            setting = s;
            return this;
        }

        /** The replicate number within the setting (0-based). */
        public Builder replicate(int r) {
            replicate = r;
            return this;
        }

        /** The learner configuration id. */
        public Builder configurationId(String id) {
            configurationId = id;
            return this;
        }

        /** The id of the learner the configuration uses. */
        public Builder learnerId(String id) {
            learnerId = id;
            return this;
        }

        /** The resolved parameter values, as text, in declaration order. */
        public Builder parameters(Map<String, String> p) {
            parameters = p;
            return this;
        }

        /** The seed the run's context was given. */
        public Builder seed(long s) {
            seed = s;
            return this;
        }

        /** How the run ended. */
        public Builder status(RunStatus s) {
            status = s;
            return this;
        }

        /** Why the run failed, timed out or was skipped. */
        public Builder message(String m) {
            message = m;
            return this;
        }

        /** The class of graph the learner returned. */
        public Builder estimateClass(GraphClass c) {
            estimateClass = c;
            return this;
        }

        /** The class of truth the estimate was scored against. */
        public Builder scoredAgainst(GraphClass c) {
            scoredAgainst = c;
            return this;
        }

        /** Structural metric values by name (values may be null). */
        public Builder metrics(Map<String, Double> m) {
            metrics = m;
            return this;
        }

        /** What the run cost; null means not measured. */
        public Builder timings(Timings t) {
            timings = t;
            return this;
        }

        /** The result; refuses missing names, negative replicates and unfinished runs with values or no reason. */
        public RunResult build() {
            return new RunResult(this);
        }
    }
}
