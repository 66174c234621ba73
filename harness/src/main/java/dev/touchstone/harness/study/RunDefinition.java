package dev.touchstone.harness.study;

import dev.touchstone.core.random.Seeds;

import java.time.Duration;
import java.util.List;

/**
 * One run of an expanded study: a learner configuration applied to one replicate's data at
 * one sample size, with everything needed to perform it alone and get the same result.
 * Immutable.
 *
 * <p>The {@link #key()} is a hash of everything that defines the run (study seed, truth
 * setting, replicate, sample size, learner configuration, metrics, time limit), so a
 * resumed study recognises the runs it has already done and recomputes only those whose
 * definition changed.
 *
 * @param index     position in the study's run order
 * @param truth     the truth setting
 * @param replicate 0-based replicate number
 * @param sample    the sample size
 * @param config    the learner configuration
 * @param studySeed the study's root seed
 * @param metrics   the metrics to compute
 * @param limit     the run's time limit, or null
 */
public record RunDefinition(int index, TruthSetting truth, int replicate, SampleSize sample, LearnerConfig config,
                            long studySeed, List<String> metrics, Duration limit, String key) {

    public RunDefinition(int index, TruthSetting truth, int replicate, SampleSize sample, LearnerConfig config,
                         long studySeed, List<String> metrics, Duration limit) {
        this(index, truth, replicate, sample, config, studySeed, List.copyOf(metrics), limit,
                Canonical.hash(definition(truth, replicate, sample, config, studySeed, metrics, limit)));
    }

    /** The text the key hashes. */
    public static String definition(TruthSetting truth, int replicate, SampleSize sample, LearnerConfig config,
                                    long studySeed, List<String> metrics, Duration limit) {
        return "run/v1|seed=" + studySeed + "|truth=" + truth.canonical() + "|replicate=" + replicate
                + "|samples=" + sample.word() + "|learner=" + config.canonical() + "|metrics="
                + String.join(",", metrics) + "|limit=" + (limit == null ? "none" : limit.toMillis() + "ms");
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

    /** A replicate: truth setting index and replicate number. */
    public record ReplicateId(int truthIndex, int replicate) {
    }
}
