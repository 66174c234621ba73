package dev.touchstone.metrics.results;

import java.util.Objects;

/**
 * One row of a study's summary: one setting × learner configuration × metric.
 *
 * <p>Built with {@link #builder()}: three run counts and four names side by side are easy to
 * swap by position. Immutable; equal when every field is equal.
 */
public final class AggregateRow {

    private final Setting setting;
    private final String configurationId;
    private final String learnerId;
    private final String metric;
    private final int okRuns;
    private final int failedRuns;
    private final int skippedRuns;
    private final Summary summary;

    private AggregateRow(Builder b) {
        setting = Objects.requireNonNull(b.setting, "setting");
        configurationId = Records.requireName(b.configurationId, "learner configuration id");
        learnerId = Records.requireName(b.learnerId, "learner id");
        metric = Records.requireName(b.metric, "metric");
        okRuns = Records.nonNegative(b.okRuns, "ok runs");
        failedRuns = Records.nonNegative(b.failedRuns, "failed runs");
        skippedRuns = Records.nonNegative(b.skippedRuns, "skipped runs");
        summary = Objects.requireNonNull(b.summary, "summary");
        if (summary.count() > okRuns) {
            throw new IllegalArgumentException("summary of " + metric + " counts " + summary.count()
                    + " values but only " + okRuns + " runs are ok");
        }
    }

    /** A builder with no runs; setting, ids, metric and summary must be set. */
    public static Builder builder() {
        return new Builder();
    }

    /** The grid point. */
    public Setting setting() {
        return setting;
    }

    /** The learner configuration. */
    public String configurationId() {
        return configurationId;
    }

    /** The learner it uses. */
    public String learnerId() {
        return learnerId;
    }

    /** The metric name. */
    public String metric() {
        return metric;
    }

    /** Runs of this group that finished ok. */
    public int okRuns() {
        return okRuns;
    }

    /** Runs that failed or timed out. */
    public int failedRuns() {
        return failedRuns;
    }

    /** Runs not attempted. */
    public int skippedRuns() {
        return skippedRuns;
    }

    /**
     * Statistics of the metric's defined values over the ok runs ({@code summary().count()} may be
     * below {@link #okRuns()} when some values are undefined).
     */
    public Summary summary() {
        return summary;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof AggregateRow r && setting.equals(r.setting) && configurationId.equals(r.configurationId)
                && learnerId.equals(r.learnerId) && metric.equals(r.metric) && okRuns == r.okRuns
                && failedRuns == r.failedRuns && skippedRuns == r.skippedRuns && summary.equals(r.summary);
    }

    @Override
    public int hashCode() {
        return Objects.hash(setting, configurationId, learnerId, metric, okRuns, failedRuns, skippedRuns, summary);
    }

    @Override
    public String toString() {
        return "AggregateRow[setting=" + setting + ", configurationId=" + configurationId + ", learnerId=" + learnerId
                + ", metric=" + metric + ", okRuns=" + okRuns + ", failedRuns=" + failedRuns
                + ", skippedRuns=" + skippedRuns + ", summary=" + summary + "]";
    }

    /** Collects the values of an {@link AggregateRow}; {@link #build()} checks them. */
    public static final class Builder {
        private Setting setting;
        private String configurationId;
        private String learnerId;
        private String metric;
        private int okRuns;
        private int failedRuns;
        private int skippedRuns;
        private Summary summary;

        private Builder() {
        }

        /** The grid point. */
        public Builder setting(Setting s) {
            setting = s;
            return this;
        }

        /** The learner configuration. */
        public Builder configurationId(String id) {
            configurationId = id;
            return this;
        }

        /** The learner it uses. */
        public Builder learnerId(String id) {
            learnerId = id;
            return this;
        }

        /** The metric name. */
        public Builder metric(String m) {
            metric = m;
            return this;
        }

        /** Runs that finished ok. */
        public Builder okRuns(int n) {
            okRuns = n;
            return this;
        }

        /** Runs that failed or timed out. */
        public Builder failedRuns(int n) {
            failedRuns = n;
            return this;
        }

        /** Runs not attempted. */
        public Builder skippedRuns(int n) {
            skippedRuns = n;
            return this;
        }

        /** Statistics of the metric over the ok runs. */
        public Builder summary(Summary s) {
            summary = s;
            return this;
        }

        /** The row; refuses missing names, negative counts and a summary of more values than ok runs. */
        public AggregateRow build() {
            return new AggregateRow(this);
        }
    }
}
