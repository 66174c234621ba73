package dev.touchstone.harness.study;

import dev.touchstone.core.random.Seeds;

import java.time.Duration;
import java.util.List;
import java.util.Objects;

/**
 * One run of an expanded study: a learner configuration applied to one replicate's data at
 * one sample size, with everything needed to perform it alone and get the same result.
 * Immutable; made with {@link #builder()}.
 *
 * <p>The {@link #key()} is a hash of everything that defines the run (study seed, truth
 * setting, replicate, sample size, learner configuration, metrics, time limit), so a
 * resumed study recognises the runs it has already done and recomputes only those whose
 * definition changed.
 */
public final class RunDefinition {

    private final int index;
    private final TruthSetting truth;
    private final int replicate;
    private final SampleSize sample;
    private final LearnerConfig config;
    private final long studySeed;
    private final List<String> metrics;
    private final Duration limit;
    private final String key;

    private RunDefinition(Builder b) {
        this.index = b.index;
        this.truth = Objects.requireNonNull(b.truth, "truth");
        this.replicate = b.replicate;
        this.sample = Objects.requireNonNull(b.sample, "sample");
        this.config = Objects.requireNonNull(b.config, "config");
        this.studySeed = b.studySeed;
        this.metrics = List.copyOf(b.metrics);
        this.limit = b.limit;
        this.key = Canonical.hash(definition(truth, replicate, sample, config, studySeed, metrics, limit));
    }

    /** A builder of a run; every part but the limit (none by default) and the metrics (none) must be set. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder starting from this run's parts (for the same run with one part changed). */
    public Builder toBuilder() {
        return new Builder().index(index).truth(truth).replicate(replicate).sample(sample).config(config)
                .studySeed(studySeed).metrics(metrics).limit(limit);
    }

    /** The text the key hashes. */
    public static String definition(TruthSetting truth, int replicate, SampleSize sample, LearnerConfig config,
                                    long studySeed, List<String> metrics, Duration limit) {
        return "run/v1|seed=" + studySeed + "|truth=" + truth.canonical() + "|replicate=" + replicate
                + "|samples=" + sample.word() + "|learner=" + config.canonical() + "|metrics="
                + String.join(",", metrics) + "|limit=" + (limit == null ? "none" : limit.toMillis() + "ms");
    }

    /** Position in the study's run order. */
    public int index() {
        return index;
    }

    /** The truth setting. */
    public TruthSetting truth() {
        return truth;
    }

    /** The 0-based replicate number. */
    public int replicate() {
        return replicate;
    }

    /** The sample size. */
    public SampleSize sample() {
        return sample;
    }

    /** The learner configuration. */
    public LearnerConfig config() {
        return config;
    }

    /** The study's root seed. */
    public long studySeed() {
        return studySeed;
    }

    /** The metrics to compute. */
    public List<String> metrics() {
        return metrics;
    }

    /** The run's time limit, or null. */
    public Duration limit() {
        return limit;
    }

    /** The hash of everything that defines the run ({@link #definition}). */
    public String key() {
        return key;
    }

    /** The seeds of the replicate this run belongs to (shared by all its sample sizes and learners). */
    public ReplicateSeeds seeds() {
        return new ReplicateSeeds(studySeed, truth, replicate);
    }

    /** The learner's seed: derived from the run's coordinates, never from the order runs are done in. */
    public long learnerSeed() {
        return Seeds.derive(studySeed, "learner", truth.canonical(), replicate, sample.word(), config.canonical());
    }

    /** Identifies the replicate (truth setting and replicate number) whose data this run shares. */
    public ReplicateId replicateId() {
        return new ReplicateId(truth.index(), replicate);
    }

    /** The coordinates in words, to recognise a run whose definition changed: setting, replicate, samples, configuration. */
    public String coordinates() {
        return truth.label() + " | replicate " + replicate + " | samples " + sample.word() + " | " + config.label();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof RunDefinition r && index == r.index && key.equals(r.key);
    }

    @Override
    public int hashCode() {
        return 31 * index + key.hashCode();
    }

    @Override
    public String toString() {
        return "run " + index + " (" + coordinates() + ", key " + key + ")";
    }

    /** A replicate: truth setting index and replicate number. */
    public record ReplicateId(int truthIndex, int replicate) {
    }

    /** Collects the parts of a run. */
    public static final class Builder {
        private int index;
        private TruthSetting truth;
        private int replicate;
        private SampleSize sample;
        private LearnerConfig config;
        private long studySeed;
        private List<String> metrics = List.of();
        private Duration limit;

        private Builder() {
        }

        /** Position in the study's run order. */
        public Builder index(int value) {
            this.index = value;
            return this;
        }

        public Builder truth(TruthSetting value) {
            this.truth = value;
            return this;
        }

        /** The 0-based replicate number. */
        public Builder replicate(int value) {
            this.replicate = value;
            return this;
        }

        public Builder sample(SampleSize value) {
            this.sample = value;
            return this;
        }

        public Builder config(LearnerConfig value) {
            this.config = value;
            return this;
        }

        public Builder studySeed(long value) {
            this.studySeed = value;
            return this;
        }

        public Builder metrics(List<String> value) {
            this.metrics = value;
            return this;
        }

        /** The time limit, or null for none. */
        public Builder limit(Duration value) {
            this.limit = value;
            return this;
        }

        public RunDefinition build() {
            return new RunDefinition(this);
        }
    }
}
