package dev.touchstone.harness.study;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.against.MetricAgainst;

import dev.touchstone.metrics.scoring.SearchGapMeasure;
import java.util.ArrayList;
import java.util.List;

/**
 * A validated study as written: what to simulate, which learners with which parameter
 * values, which metrics, how many replicates and the limits. Immutable; made with {@link
 * #builder}; nothing is expanded yet (see {@link Expansion}).
 */
public final class Study {

    private final String name;
    private final String description;
    private final long seed;
    private final int replicates;
    private final List<List<ComponentSpec>> truths;
    private final List<SampleSize> samples;
    private final List<LearnerEntry> learners;
    private final List<String> metrics;
    private final Limits limits;
    private final String compareTo;
    private final List<GraphClass> scoreAgainst;
    private final Node source;

    private Study(Builder b) {
        name = java.util.Objects.requireNonNull(b.name, "name");
        description = b.description;
        seed = b.seed;
        replicates = b.replicates;
        truths = b.truths.stream().map(List::copyOf).toList();
        samples = List.copyOf(b.samples);
        learners = List.copyOf(b.learners);
        metrics = List.copyOf(b.metrics);
        limits = b.limits;
        compareTo = b.compareTo;
        scoreAgainst = List.copyOf(b.scoreAgainst);
        source = b.source;
    }

    /** A study of this name; every other part starts empty (no seed, one replicate, default limits). */
    public static Builder builder(String name) {
        return new Builder(name);
    }

    /** A short name used in outputs. */
    public String name() {
        return name;
    }

    /** Free text saying what the study is for (may be empty). */
    public String description() {
        return description;
    }

    /** The root of every random choice in the study. */
    public long seed() {
        return seed;
    }

    /** Independent draws of graph, parameters and data per setting. */
    public int replicates() {
        return replicates;
    }

    /**
     * The truth blocks: each is one component per truth section given (in the catalogue's order)
     * and expands into its own grid; a study usually has one, and a list under {@code truth} gives
     * several whose settings are run side by side (say random graphs and a named network).
     */
    public List<List<ComponentSpec>> truths() {
        return truths;
    }

    /** The sample sizes, in file order. */
    public List<SampleSize> samples() {
        return samples;
    }

    /** The learner entries, in file order. */
    public List<LearnerEntry> learners() {
        return learners;
    }

    /** The metrics to compute, in file order. */
    public List<String> metrics() {
        return metrics;
    }

    /** Per-run time limit and grid size limit. */
    public Limits limits() {
        return limits;
    }

    /** The learner entry every other is compared with, or null. */
    public String compareTo() {
        return compareTo;
    }

    /** Extra truth classes every estimate is also scored against (may be empty). */
    public List<GraphClass> scoreAgainst() {
        return scoreAgainst;
    }

    /** The file's tree, kept to write the study back out normalised (null when built in code). */
    public Node source() {
        return source;
    }

    /** The metrics every run computes: the study's, then those against the {@code score_against} truths. */
    public List<String> allMetrics() {
        return withScoreAgainst(metrics, scoreAgainst);
    }

    /**
     * The metrics followed by, for each class in {@code against}, every structural metric
     * (not one the runner measures itself) against that class ({@code METRIC_vs_CLASS}).
     */
    public static List<String> withScoreAgainst(List<String> metrics, List<GraphClass> against) {
        List<String> out = new ArrayList<>(metrics);
        for (GraphClass c : against) {
            for (String m : metrics) {
                if (!MetricCatalog.MEASURED.contains(m) && !SearchGapMeasure.isOne(m)) {
                    out.add(new MetricAgainst(m, c).name());
                }
            }
        }
        return out;
    }

    /** The learner entry with this id, or null. */
    public LearnerEntry learner(String id) {
        for (LearnerEntry e : learners) {
            if (e.id().equals(id)) {
                return e;
            }
        }
        return null;
    }

    /** The number of truth settings (combinations over every truth axis, summed over blocks), before sample sizes. */
    public long truthCombinations() {
        long total = 0;
        for (List<ComponentSpec> block : truths) {
            long n = 1;
            for (ComponentSpec c : block) {
                n = Math.multiplyExact(n, c.combinations());
            }
            total = Math.addExact(total, n);
        }
        return total;
    }

    /** The number of learner configurations. */
    public long configurations() {
        long n = 0;
        for (LearnerEntry e : learners) {
            n = Math.addExact(n, e.configurations());
        }
        return n;
    }

    /** The number of runs the study expands to. */
    public long runCount() {
        return Math.multiplyExact(Math.multiplyExact(Math.multiplyExact(truthCombinations(), replicates),
                samples.size()), configurations());
    }

    /** Collects the parts of a study. */
    public static final class Builder {
        private final String name;
        private String description = "";
        private long seed;
        private int replicates = 1;
        private List<List<ComponentSpec>> truths = List.of();
        private List<SampleSize> samples = List.of();
        private List<LearnerEntry> learners = List.of();
        private List<String> metrics = List.of();
        private Limits limits = Limits.defaults();
        private String compareTo;
        private List<GraphClass> scoreAgainst = List.of();
        private Node source;

        private Builder(String name) {
            this.name = name;
        }

        public Builder description(String value) {
            this.description = value;
            return this;
        }

        public Builder seed(long value) {
            this.seed = value;
            return this;
        }

        public Builder replicates(int value) {
            this.replicates = value;
            return this;
        }

        /** The truth blocks (see {@link Study#truths()}). */
        public Builder truths(List<List<ComponentSpec>> value) {
            this.truths = value;
            return this;
        }

        public Builder samples(List<SampleSize> value) {
            this.samples = value;
            return this;
        }

        public Builder learners(List<LearnerEntry> value) {
            this.learners = value;
            return this;
        }

        public Builder metrics(List<String> value) {
            this.metrics = value;
            return this;
        }

        public Builder limits(Limits value) {
            this.limits = value;
            return this;
        }

        /** The reference entry's id, or null. */
        public Builder compareTo(String value) {
            this.compareTo = value;
            return this;
        }

        public Builder scoreAgainst(List<GraphClass> value) {
            this.scoreAgainst = value;
            return this;
        }

        /** The file's tree. */
        public Builder source(Node value) {
            this.source = value;
            return this;
        }

        public Study build() {
            return new Study(this);
        }
    }
}
