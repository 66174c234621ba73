package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.metrics.truth.Truth;
import dev.touchstone.metrics.truth.TruthSelection;

import java.util.List;
import java.util.Map;

/**
 * The scorer over the metrics module: the truth of the estimate's class comes from
 * {@code TruthSelection.forEstimate} (design §3: DAG → true DAG or, with hidden variables, the
 * true MAG; CPDAG → true CPDAG or PAG; PAG → true PAG), and the requested metrics from
 * {@code dev.touchstone.metrics.scoring.Scorer}. Cost: building the truth (the PAG construction
 * when variables are hidden) plus the metrics.
 */
public final class MetricsScorer implements Scorer {

    @Override
    public Scored score(Replicate replicate, Estimate estimate, List<String> metrics) {
        Truth truth = truthFor(replicate.trueDag(), estimate.graphClass());
        Map<String, Double> values = dev.touchstone.metrics.scoring.Scorer.score(truth, estimate.graph(),
                estimate.graphClass(), metrics);
        return new Scored(truth.referenceClass(), values);
    }

    /** The truth an estimate of this class is scored against (the metrics module's selection, design §3). */
    static Truth truthFor(Graph dag, GraphClass estimateClass) {
        return TruthSelection.forEstimate(dag, estimateClass);
    }
}
