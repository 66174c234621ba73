package dev.touchstone.reports;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RankingResult;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Summary;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.function.Function;

/**
 * Everything a study report shows, gathered by the harness from a finished or partial
 * study. Immutable; build with {@link #builder(String)}.
 */
public final class ReportData {

    /** The sortability audit of one setting's simulated data (means over its replicates). */
    public record Audit(Setting setting, Double varsortability, Double r2Sortability) {
    }

    /** A run chosen for a picture: its truth (of the estimate's class) beside its estimate. */
    public record Example(String title, Graph truth, Graph estimate) {
    }

    private final String studyName;
    private final String description;
    private final boolean partial;
    private final List<String> metrics;
    private final Map<String, Boolean> higherIsBetter;
    private final String reference;
    private final List<RunResult> runs;
    private final List<AggregateRow> summary;
    private final List<ComparisonRow> comparisons;
    private final List<RankingResult> rankings;
    private final List<Audit> audits;
    private final List<Example> examples;
    private final Map<String, String> provenance;
    private final Function<List<Double>, Summary> summarizer;
    private final Set<String> scaleBaselines;
    private final String sampleCoordinate;
    private final String sizeCoordinate;
    private final List<String> groupCoordinates;
    private final String pictureRule;

    private ReportData(Builder b) {
        this.studyName = b.studyName;
        this.description = b.description;
        this.partial = b.partial;
        this.metrics = List.copyOf(b.metrics);
        this.higherIsBetter = Map.copyOf(b.higherIsBetter);
        this.reference = b.reference;
        this.runs = List.copyOf(b.runs);
        this.summary = List.copyOf(b.summary);
        this.comparisons = List.copyOf(b.comparisons);
        this.rankings = List.copyOf(b.rankings);
        this.audits = List.copyOf(b.audits);
        this.examples = List.copyOf(b.examples);
        this.provenance = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(b.provenance));
        this.summarizer = Objects.requireNonNull(b.summarizer, "a summarizer for pooled values is required");
        this.scaleBaselines = Set.copyOf(b.scaleBaselines);
        this.sampleCoordinate = b.sampleCoordinate;
        this.sizeCoordinate = b.sizeCoordinate;
        this.groupCoordinates = b.groupCoordinates;
        this.pictureRule = b.pictureRule;
    }

    public static Builder builder(String studyName) {
        return new Builder(studyName);
    }

    public String studyName() {
        return studyName;
    }

    public String description() {
        return description;
    }

    /** Whether the study is still running or was interrupted. */
    public boolean partial() {
        return partial;
    }

    /** The chosen metrics, in the study's order. */
    public List<String> metrics() {
        return metrics;
    }

    /** Whether higher values of a metric are better; metrics without a direction are absent. */
    public Boolean higherIsBetter(String metric) {
        return higherIsBetter.get(metric);
    }

    /** The reference configuration of the paired comparisons, or null. */
    public String reference() {
        return reference;
    }

    public List<RunResult> runs() {
        return runs;
    }

    public List<AggregateRow> summary() {
        return summary;
    }

    public List<ComparisonRow> comparisons() {
        return comparisons;
    }

    public List<RankingResult> rankings() {
        return rankings;
    }

    public List<Audit> audits() {
        return audits;
    }

    public List<Example> examples() {
        return examples;
    }

    public Map<String, String> provenance() {
        return provenance;
    }

    /** Summarises values pooled over settings (the metrics module's seeded bootstrap summary). */
    public Summary summarize(List<Double> values) {
        return summarizer.apply(values);
    }

    /** Learner ids of the scale-artefact baselines (variance and R² sorting), for the audit warning. */
    public Set<String> scaleBaselines() {
        return scaleBaselines;
    }

    /** The setting coordinate holding the sample size (default {@code samples}). */
    public String sampleCoordinate() {
        return sampleCoordinate;
    }

    /** Coordinates splitting the headline into groups; empty for one table. */
    public List<String> groupCoordinates() {
        return groupCoordinates;
    }

    /** The setting coordinate holding the graph size (default {@code nodes}). */
    public String sizeCoordinate() {
        return sizeCoordinate;
    }

    /** The rule by which the pictured runs were chosen, in a sentence; empty when not stated. */
    public String pictureRule() {
        return pictureRule;
    }

    /** Collects report data. */
    public static final class Builder {
        private final String studyName;
        private String description = "";
        private boolean partial;
        private List<String> metrics = new ArrayList<>();
        private Map<String, Boolean> higherIsBetter = new LinkedHashMap<>();
        private String reference;
        private List<RunResult> runs = new ArrayList<>();
        private List<AggregateRow> summary = new ArrayList<>();
        private List<ComparisonRow> comparisons = new ArrayList<>();
        private List<RankingResult> rankings = new ArrayList<>();
        private List<Audit> audits = new ArrayList<>();
        private List<Example> examples = new ArrayList<>();
        private Map<String, String> provenance = new LinkedHashMap<>();
        private Function<List<Double>, Summary> summarizer;
        private Set<String> scaleBaselines = Set.of();
        private String sampleCoordinate = "samples";
        private String sizeCoordinate = "nodes";
        private List<String> groupCoordinates = List.of();
        private String pictureRule = "";

        private Builder(String studyName) {
            this.studyName = Objects.requireNonNull(studyName);
        }

        public Builder description(String d) {
            this.description = d == null ? "" : d;
            return this;
        }

        public Builder partial(boolean p) {
            this.partial = p;
            return this;
        }

        public Builder metrics(List<String> m) {
            this.metrics = new ArrayList<>(m);
            return this;
        }

        public Builder direction(String metric, boolean higherBetter) {
            this.higherIsBetter.put(metric, higherBetter);
            return this;
        }

        public Builder reference(String r) {
            this.reference = r;
            return this;
        }

        public Builder runs(List<RunResult> r) {
            this.runs = new ArrayList<>(r);
            return this;
        }

        public Builder summary(List<AggregateRow> s) {
            this.summary = new ArrayList<>(s);
            return this;
        }

        public Builder comparisons(List<ComparisonRow> c) {
            this.comparisons = new ArrayList<>(c);
            return this;
        }

        public Builder rankings(List<RankingResult> r) {
            this.rankings = new ArrayList<>(r);
            return this;
        }

        public Builder audits(List<Audit> a) {
            this.audits = new ArrayList<>(a);
            return this;
        }

        public Builder examples(List<Example> e) {
            this.examples = new ArrayList<>(e);
            return this;
        }

        public Builder provenance(Map<String, String> p) {
            this.provenance = new LinkedHashMap<>(p);
            return this;
        }

        public Builder summarizer(Function<List<Double>, Summary> s) {
            this.summarizer = s;
            return this;
        }

        public Builder scaleBaselines(Set<String> learnerIds) {
            this.scaleBaselines = learnerIds;
            return this;
        }

        public Builder coordinates(String sample, String size) {
            this.sampleCoordinate = sample;
            this.sizeCoordinate = size;
            return this;
        }

        /**
         * Coordinates whose values split the headline into one table per group (for example
         * the truth's kind when a study runs random graphs beside a named network); empty
         * for one table over all settings.
         */
        public Builder groupBy(List<String> coordinates) {
            this.groupCoordinates = List.copyOf(coordinates);
            return this;
        }

        /** States the rule by which the runs in {@link #examples(List)} were chosen. */
        public Builder pictureRule(String rule) {
            this.pictureRule = rule == null ? "" : rule;
            return this;
        }

        public ReportData build() {
            return new ReportData(this);
        }
    }
}
