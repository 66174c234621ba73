package dev.touchstone.harness.study;

import java.util.List;

/**
 * A validated study as written: what to simulate, which learners with which parameter
 * values, which metrics, how many replicates and the limits. Immutable; nothing is
 * expanded yet (see {@link Expansion}).
 *
 * @param name        a short name used in outputs
 * @param description free text saying what the study is for (may be empty)
 * @param seed        the root of every random choice in the study
 * @param replicates  independent draws of graph, parameters and data per setting
 * @param truth       one component per truth section, in the catalogue's order
 * @param samples     the sample sizes, in file order
 * @param learners    the learner entries, in file order
 * @param metrics     the metrics to compute, in file order
 * @param limits      per-run time limit and grid size limit
 * @param compareTo   the learner entry every other is compared with, or null
 * @param source      the file's tree, kept to write the study back out normalised
 */
public record Study(String name, String description, long seed, int replicates, List<ComponentSpec> truth,
                    List<SampleSize> samples, List<LearnerEntry> learners, List<String> metrics, Limits limits,
                    String compareTo, Node source) {

    public Study {
        truth = List.copyOf(truth);
        samples = List.copyOf(samples);
        learners = List.copyOf(learners);
        metrics = List.copyOf(metrics);
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

    /** The number of truth settings (combinations over every truth axis), before sample sizes. */
    public long truthCombinations() {
        long n = 1;
        for (ComponentSpec c : truth) {
            n = Math.multiplyExact(n, c.combinations());
        }
        return n;
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
}
