package dev.touchstone.harness.calibrate;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.param.ParameterValues;

import java.time.Duration;
import java.util.List;

/**
 * What a calibration does: the learners (with their parameter values), the sample sizes,
 * the number of simulated replicates per size (spread in turn over the fitted truth and
 * its perturbed variants), the number of variants, the number of bootstrap resamples of
 * the real data, the root seed, worker threads and the per-run time limit. Immutable; made
 * with {@link #builder}.
 */
public final class CalibrationSettings {

    /** The metrics computed on every simulated run. */
    public static final List<String> METRICS = List.of("adjacency_precision", "adjacency_recall", "adjacency_f1",
            "orientation_precision", "orientation_recall", "orientation_f1", "shd");

    private final List<Choice> learners;
    private final List<Integer> samples;
    private final int replicates;
    private final int variants;
    private final int bootstrap;
    private final long seed;
    private final int threads;
    private final Duration limit;

    private CalibrationSettings(Builder b) {
        learners = List.copyOf(b.learners);
        samples = List.copyOf(b.samples);
        replicates = b.replicates;
        variants = b.variants;
        bootstrap = b.bootstrap;
        seed = b.seed;
        threads = b.threads;
        limit = b.limit;
        if (learners.isEmpty()) {
            throw new IllegalArgumentException("at least one learner is needed");
        }
        if (samples.isEmpty() || samples.stream().anyMatch(n -> n < 2)) {
            throw new IllegalArgumentException("sample sizes must be at least 2");
        }
        // a size or learner listed twice would make runs with the same coordinates, hence the same keys
        if (samples.stream().distinct().count() < samples.size()) {
            throw new IllegalArgumentException("a sample size is listed twice: " + samples);
        }
        if (learners.stream().map(Choice::id).distinct().count() < learners.size()) {
            throw new IllegalArgumentException("a learner is listed twice");
        }
        if (replicates < 1 || variants < 0 || bootstrap < 0 || threads < 1) {
            throw new IllegalArgumentException("replicates and threads must be at least 1; variants and bootstrap"
                    + " resamples at least 0");
        }
    }

    /**
     * A calibration of these learners at these sample sizes: by default 1 replicate, no variants,
     * no bootstrap resamples, seed 0, 1 thread and no time limit.
     */
    public static Builder builder(List<Choice> learners, List<Integer> samples) {
        return new Builder(learners, samples);
    }

    /** One learner with its parameter values. */
    public record Choice(Learner learner, ParameterValues values) {
        /** The learner's id. */
        public String id() {
            return learner.description().id();
        }
    }

    /** The default sample sizes for data of {@code n} rows: n/2, n, 2n, 4n. */
    public static List<Integer> defaultSamples(int n) {
        return List.of(Math.max(2, n / 2), n, 2 * n, 4 * n);
    }

    /** The learners, in the order given. */
    public List<Choice> learners() {
        return learners;
    }

    /** The sample sizes simulated. */
    public List<Integer> samples() {
        return samples;
    }

    /** Simulated replicates per sample size. */
    public int replicates() {
        return replicates;
    }

    /** Perturbed truths besides the fitted one. */
    public int variants() {
        return variants;
    }

    /** Bootstrap resamples of the real data. */
    public int bootstrap() {
        return bootstrap;
    }

    /** The root seed. */
    public long seed() {
        return seed;
    }

    /** Worker threads. */
    public int threads() {
        return threads;
    }

    /** The per-run time limit, or null. */
    public Duration limit() {
        return limit;
    }

    /** Collects the parts of the settings. */
    public static final class Builder {
        private final List<Choice> learners;
        private final List<Integer> samples;
        private int replicates = 1;
        private int variants;
        private int bootstrap;
        private long seed;
        private int threads = 1;
        private Duration limit;

        private Builder(List<Choice> learners, List<Integer> samples) {
            this.learners = learners;
            this.samples = samples;
        }

        /** Simulated replicates per sample size, at least 1. */
        public Builder replicates(int value) {
            this.replicates = value;
            return this;
        }

        /** Perturbed truths besides the fitted one, at least 0. */
        public Builder variants(int value) {
            this.variants = value;
            return this;
        }

        /** Bootstrap resamples of the real data, at least 0. */
        public Builder bootstrap(int value) {
            this.bootstrap = value;
            return this;
        }

        public Builder seed(long value) {
            this.seed = value;
            return this;
        }

        /** Worker threads, at least 1. */
        public Builder threads(int value) {
            this.threads = value;
            return this;
        }

        /** The per-run time limit, or null for none. */
        public Builder limit(Duration value) {
            this.limit = value;
            return this;
        }

        /**
         * The settings.
         *
         * @throws IllegalArgumentException when a count is out of range, or a learner or size is missing or
         *     listed twice
         */
        public CalibrationSettings build() {
            return new CalibrationSettings(this);
        }
    }
}
