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
 * <p>Built with {@link #builder()} (thirteen values, most of them nullable numbers, are easy to
 * swap by position). Immutable; equal when every field is equal.
 */
public final class ComparisonRow {

    private final Setting setting;
    private final String metric;
    private final String configurationId;
    private final String referenceId;
    private final int pairs;
    private final Double meanDifference;
    private final Double low;
    private final Double high;
    private final Double pValue;
    private final Double pHolm;
    private final Integer wins;
    private final Integer ties;
    private final Integer losses;

    private ComparisonRow(Builder b) {
        setting = Objects.requireNonNull(b.setting, "setting");
        metric = Records.requireName(b.metric, "metric");
        configurationId = Records.requireName(b.configurationId, "learner configuration id");
        referenceId = Records.requireName(b.referenceId, "reference configuration id");
        pairs = Records.nonNegative(b.pairs, "pairs");
        meanDifference = Records.finiteOrNull(b.meanDifference, "mean difference");
        low = Records.finiteOrNull(b.low, "low");
        high = Records.finiteOrNull(b.high, "high");
        pValue = Records.finiteOrNull(b.pValue, "p-value");
        pHolm = Records.finiteOrNull(b.pHolm, "Holm p-value");
        wins = b.wins;
        ties = b.ties;
        losses = b.losses;
        if (wins != null && ties != null && losses != null && wins + ties + losses != pairs) {
            throw new IllegalArgumentException("wins + ties + losses must equal pairs (" + pairs + "), got "
                    + wins + " + " + ties + " + " + losses);
        }
    }

    /** A builder with no pairs and every statistic undefined; setting, metric and both ids must be set. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder holding every value of this row, to change some of them. */
    public Builder toBuilder() {
        return new Builder().setting(setting).metric(metric).configurationId(configurationId).referenceId(referenceId)
                .pairs(pairs).meanDifference(meanDifference).low(low).high(high).pValue(pValue).pHolm(pHolm)
                .wins(wins).ties(ties).losses(losses);
    }

    /** This row with its Holm-adjusted p-value set. */
    public ComparisonRow withHolm(Double adjusted) {
        return toBuilder().pHolm(adjusted).build();
    }

    /** The grid point. */
    public Setting setting() {
        return setting;
    }

    /** The metric name. */
    public String metric() {
        return metric;
    }

    /** The configuration compared. */
    public String configurationId() {
        return configurationId;
    }

    /** The reference configuration. */
    public String referenceId() {
        return referenceId;
    }

    /** Number of paired replicates used. */
    public int pairs() {
        return pairs;
    }

    /** Mean of the differences; null without pairs. */
    public Double meanDifference() {
        return meanDifference;
    }

    /** Lower end of the seeded bootstrap 95% interval of the mean difference. */
    public Double low() {
        return low;
    }

    /** Upper end of that interval. */
    public Double high() {
        return high;
    }

    /** Two-sided Wilcoxon signed-rank p-value; null when not computable (no non-zero difference). */
    public Double pValue() {
        return pValue;
    }

    /** Holm-adjusted p-value across the configurations compared on this setting and metric. */
    public Double pHolm() {
        return pHolm;
    }

    /** Replicates where the configuration is better; null for a metric without a direction. */
    public Integer wins() {
        return wins;
    }

    /** Replicates with equal values; null for a metric without a direction. */
    public Integer ties() {
        return ties;
    }

    /** Replicates where the reference is better; null for a metric without a direction. */
    public Integer losses() {
        return losses;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ComparisonRow r && setting.equals(r.setting) && metric.equals(r.metric)
                && configurationId.equals(r.configurationId) && referenceId.equals(r.referenceId) && pairs == r.pairs
                && Objects.equals(meanDifference, r.meanDifference) && Objects.equals(low, r.low)
                && Objects.equals(high, r.high) && Objects.equals(pValue, r.pValue) && Objects.equals(pHolm, r.pHolm)
                && Objects.equals(wins, r.wins) && Objects.equals(ties, r.ties) && Objects.equals(losses, r.losses);
    }

    @Override
    public int hashCode() {
        return Objects.hash(setting, metric, configurationId, referenceId, pairs, meanDifference, low, high, pValue,
                pHolm, wins, ties, losses);
    }

    @Override
    public String toString() {
        return "ComparisonRow[setting=" + setting + ", metric=" + metric + ", configurationId=" + configurationId
                + ", referenceId=" + referenceId + ", pairs=" + pairs + ", meanDifference=" + meanDifference
                + ", low=" + low + ", high=" + high + ", pValue=" + pValue + ", pHolm=" + pHolm
                + ", wins=" + wins + ", ties=" + ties + ", losses=" + losses + "]";
    }

    /** Collects the values of a {@link ComparisonRow}; {@link #build()} checks them. */
    public static final class Builder {
        private Setting setting;
        private String metric;
        private String configurationId;
        private String referenceId;
        private int pairs;
        private Double meanDifference;
        private Double low;
        private Double high;
        private Double pValue;
        private Double pHolm;
        private Integer wins;
        private Integer ties;
        private Integer losses;

        private Builder() {
        }

        /** The grid point. */
        public Builder setting(Setting s) {
            setting = s;
            return this;
        }

        /** The metric name. */
        public Builder metric(String m) {
            metric = m;
            return this;
        }

        /** The configuration compared. */
        public Builder configurationId(String id) {
            configurationId = id;
            return this;
        }

        /** The reference configuration. */
        public Builder referenceId(String id) {
            referenceId = id;
            return this;
        }

        /** Number of paired replicates used. */
        public Builder pairs(int n) {
            pairs = n;
            return this;
        }

        /** Mean of the differences. */
        public Builder meanDifference(Double d) {
            meanDifference = d;
            return this;
        }

        /** Lower end of the bootstrap interval of the mean difference. */
        public Builder low(Double v) {
            low = v;
            return this;
        }

        /** Upper end of the bootstrap interval of the mean difference. */
        public Builder high(Double v) {
            high = v;
            return this;
        }

        /** The signed-rank p-value. */
        public Builder pValue(Double p) {
            pValue = p;
            return this;
        }

        /** The Holm-adjusted p-value. */
        public Builder pHolm(Double p) {
            pHolm = p;
            return this;
        }

        /** Replicates where the configuration is better. */
        public Builder wins(Integer n) {
            wins = n;
            return this;
        }

        /** Replicates with equal values. */
        public Builder ties(Integer n) {
            ties = n;
            return this;
        }

        /** Replicates where the reference is better. */
        public Builder losses(Integer n) {
            losses = n;
            return this;
        }

        /** The row; refuses missing names, negative pairs, non-finite numbers and tallies that do not add up. */
        public ComparisonRow build() {
            return new ComparisonRow(this);
        }
    }
}
