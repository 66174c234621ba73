package dev.touchstone.harness.study;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.against.MetricAgainst;

import dev.touchstone.metrics.scoring.SearchGapMeasure;
import java.util.ArrayList;
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
 * @param truths      the truth blocks: each is one component per truth section given (in the
 *                    catalogue's order) and expands into its own grid; a study usually has
 *                    one, and a list under {@code truth} gives several whose settings are
 *                    run side by side (say random graphs and a named network)
 * @param samples     the sample sizes, in file order
 * @param learners    the learner entries, in file order
 * @param metrics     the metrics to compute, in file order
 * @param limits      per-run time limit and grid size limit
 * @param compareTo   the learner entry every other is compared with, or null
 * @param scoreAgainst extra truth classes every estimate is also scored against (may be empty)
 * @param source      the file's tree, kept to write the study back out normalised
 */
public record Study(String name, String description, long seed, int replicates, List<List<ComponentSpec>> truths,
                    List<SampleSize> samples, List<LearnerEntry> learners, List<String> metrics, Limits limits,
                    String compareTo, List<GraphClass> scoreAgainst, Node source) {

    public Study {
        truths = truths.stream().map(List::copyOf).toList();
        samples = List.copyOf(samples);
        learners = List.copyOf(learners);
        metrics = List.copyOf(metrics);
        scoreAgainst = List.copyOf(scoreAgainst);
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
}
