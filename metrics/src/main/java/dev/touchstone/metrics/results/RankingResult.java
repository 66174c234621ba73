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
 * <p>Built with {@link #builder()}: ten values, several of them nullable numbers, are easy to
 * swap by position. Immutable; equal when every field is equal.
 */
public final class RankingResult {

    private final String metric;
    private final List<String> configurations;
    private final List<Double> meanRanks;
    private final int settingsUsed;
    private final int settingsDropped;
    private final Double friedmanChiSquare;
    private final int degreesOfFreedom;
    private final Double friedmanPValue;
    private final double alpha;
    private final Double criticalDifference;

    private RankingResult(Builder b) {
        metric = Records.requireName(b.metric, "metric");
        configurations = Records.list(b.configurations, "configurations");
        meanRanks = Records.values(b.meanRanks, "mean rank");
        if (configurations.size() != meanRanks.size()) {
            throw new IllegalArgumentException(configurations.size() + " configurations but "
                    + meanRanks.size() + " mean ranks");
        }
        settingsUsed = Records.nonNegative(b.settingsUsed, "settings used");
        settingsDropped = Records.nonNegative(b.settingsDropped, "settings dropped");
        friedmanChiSquare = Records.finiteOrNull(b.friedmanChiSquare, "Friedman statistic");
        degreesOfFreedom = b.degreesOfFreedom;
        friedmanPValue = Records.finiteOrNull(b.friedmanPValue, "Friedman p-value");
        alpha = b.alpha;
        criticalDifference = Records.finiteOrNull(b.criticalDifference, "critical difference");
    }

    /** A builder with no configurations and every statistic undefined; the metric must be set. */
    public static Builder builder() {
        return new Builder();
    }

    /** The metric. */
    public String metric() {
        return metric;
    }

    /** The configurations ranked, in the order of {@link #meanRanks()}. */
    public List<String> configurations() {
        return configurations;
    }

    /** Mean rank of each configuration over the settings used. */
    public List<Double> meanRanks() {
        return meanRanks;
    }

    /** N: settings where every configuration has a value. */
    public int settingsUsed() {
        return settingsUsed;
    }

    /** Settings left out because some configuration had no value. */
    public int settingsDropped() {
        return settingsDropped;
    }

    /**
     * The tie-corrected Friedman statistic; null when N &lt; 2 or k &lt; 2, or when every setting
     * is a complete tie.
     */
    public Double friedmanChiSquare() {
        return friedmanChiSquare;
    }

    /** k − 1. */
    public int degreesOfFreedom() {
        return degreesOfFreedom;
    }

    /** The statistic's χ² survival probability on k − 1 degrees of freedom. */
    public Double friedmanPValue() {
        return friedmanPValue;
    }

    /** Significance level of the critical difference. */
    public double alpha() {
        return alpha;
    }

    /** The Nemenyi critical difference of mean ranks at {@link #alpha()}; null when the q table has no entry for k. */
    public Double criticalDifference() {
        return criticalDifference;
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

    @Override
    public boolean equals(Object o) {
        return o instanceof RankingResult r && metric.equals(r.metric) && configurations.equals(r.configurations)
                && meanRanks.equals(r.meanRanks) && settingsUsed == r.settingsUsed
                && settingsDropped == r.settingsDropped && Objects.equals(friedmanChiSquare, r.friedmanChiSquare)
                && degreesOfFreedom == r.degreesOfFreedom && Objects.equals(friedmanPValue, r.friedmanPValue)
                && Double.compare(alpha, r.alpha) == 0 && Objects.equals(criticalDifference, r.criticalDifference);
    }

    @Override
    public int hashCode() {
        return Objects.hash(metric, configurations, meanRanks, settingsUsed, settingsDropped, friedmanChiSquare,
                degreesOfFreedom, friedmanPValue, alpha, criticalDifference);
    }

    @Override
    public String toString() {
        return "RankingResult[metric=" + metric + ", configurations=" + configurations + ", meanRanks=" + meanRanks
                + ", settingsUsed=" + settingsUsed + ", settingsDropped=" + settingsDropped
                + ", friedmanChiSquare=" + friedmanChiSquare + ", degreesOfFreedom=" + degreesOfFreedom
                + ", friedmanPValue=" + friedmanPValue + ", alpha=" + alpha
                + ", criticalDifference=" + criticalDifference + "]";
    }

    /** Collects the values of a {@link RankingResult}; {@link #build()} checks them. */
    public static final class Builder {
        private String metric;
        private List<String> configurations = List.of();
        private List<Double> meanRanks = List.of();
        private int settingsUsed;
        private int settingsDropped;
        private Double friedmanChiSquare;
        private int degreesOfFreedom;
        private Double friedmanPValue;
        private double alpha;
        private Double criticalDifference;

        private Builder() {
        }

        /** The metric. */
        public Builder metric(String m) {
            metric = m;
            return this;
        }

        /** The configurations ranked. */
        public Builder configurations(List<String> c) {
            configurations = c;
            return this;
        }

        /** Mean rank of each configuration, in the order of the configurations (null: undefined). */
        public Builder meanRanks(List<Double> r) {
            meanRanks = r;
            return this;
        }

        /** Settings where every configuration has a value. */
        public Builder settingsUsed(int n) {
            settingsUsed = n;
            return this;
        }

        /** Settings left out because some configuration had no value. */
        public Builder settingsDropped(int n) {
            settingsDropped = n;
            return this;
        }

        /** The tie-corrected Friedman statistic. */
        public Builder friedmanChiSquare(Double x) {
            friedmanChiSquare = x;
            return this;
        }

        /** k − 1. */
        public Builder degreesOfFreedom(int df) {
            degreesOfFreedom = df;
            return this;
        }

        /** The Friedman statistic's p-value. */
        public Builder friedmanPValue(Double p) {
            friedmanPValue = p;
            return this;
        }

        /** Significance level of the critical difference. */
        public Builder alpha(double a) {
            alpha = a;
            return this;
        }

        /** The Nemenyi critical difference at the significance level. */
        public Builder criticalDifference(Double cd) {
            criticalDifference = cd;
            return this;
        }

        /** The ranking; refuses a missing metric, mismatched lists, negative counts and non-finite numbers. */
        public RankingResult build() {
            return new RankingResult(this);
        }
    }
}
