package dev.touchstone.harness.calibrate;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.param.ParameterValues;

import java.time.Duration;
import java.util.List;

/**
 * What a calibration does: the learners (with their parameter values), the sample sizes,
 * the number of simulated replicates per size (spread in turn over the fitted truth and
 * its perturbed variants), the number of variants, the number of bootstrap resamples of
 * the real data, the root seed, worker threads and the per-run time limit. Immutable.
 */
public record CalibrationSettings(List<Choice> learners, List<Integer> samples, int replicates, int variants,
                                  int bootstrap, long seed, int threads, Duration limit) {

    /** The metrics computed on every simulated run. */
    public static final List<String> METRICS = List.of("adjacency_precision", "adjacency_recall", "adjacency_f1",
            "orientation_precision", "orientation_recall", "orientation_f1", "shd");

    public CalibrationSettings {
        learners = List.copyOf(learners);
        samples = List.copyOf(samples);
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
}
