package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.Estimate;

import java.util.List;
import java.util.Map;

/**
 * Scores an estimate against the truth of its class derived from the replicate's DAG
 * (TruthSelection). Implemented over the metrics module; thread-safe.
 */
public interface Scorer {

    /** The metrics the runner measures itself and the scorer never sees. */
    List<String> MEASURED = dev.touchstone.harness.study.MetricCatalog.MEASURED;

    /**
     * @param replicate the truth
     * @param estimate  what the learner returned
     * @param metrics   the structural metrics wanted (none of {@link #MEASURED})
     */
    Scored score(Replicate replicate, Estimate estimate, List<String> metrics);

    /** The truth class the estimate was scored against and the metric values (null = undefined). */
    record Scored(GraphClass scoredAgainst, Map<String, Double> values) {
    }
}
