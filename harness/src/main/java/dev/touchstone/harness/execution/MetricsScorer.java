package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.metrics.truth.Truth;

import java.util.List;
import java.util.Map;

/**
 * The scorer over the metrics module: chooses the truth of the estimate's class (design §3)
 * and computes the requested metrics with {@code dev.touchstone.metrics.scoring.Scorer}.
 *
 * <p>Without hidden variables: a DAG estimate is scored against the true DAG, a CPDAG
 * estimate against the true CPDAG (Cpdags.of, Meek's construction cross-checked with
 * Chickering's in core). With hidden variables, or for MAG/PAG estimates, the true MAG/PAG
 * is needed from core's latent projection and PAG construction, which are not merged yet:
 * such runs are recorded {@code failed} with a message saying so rather than scored wrongly.
 * Cost: the CPDAG construction (linear in edges) plus the metrics.
 */
public final class MetricsScorer implements Scorer {

    @Override
    public Scored score(Replicate replicate, Estimate estimate, List<String> metrics) {
        Truth truth = truthFor(replicate.trueDag(), estimate.graphClass());
        Map<String, Double> values = dev.touchstone.metrics.scoring.Scorer.score(truth, estimate.graph(),
                estimate.graphClass(), metrics);
        return new Scored(truth.referenceClass(), values);
    }

    /** The truth an estimate of this class is scored against. */
    static Truth truthFor(Graph dag, GraphClass estimateClass) {
        if (dag.hasHidden()) {
            throw new UnsupportedOperationException("scoring with hidden variables needs the true MAG/PAG from core,"
                    + " which this build does not have yet");
        }
        switch (estimateClass) {
            case DAG:
                return new Truth(dag, GraphClass.DAG, dag);
            case CPDAG:
                return new Truth(Cpdags.of(dag), GraphClass.CPDAG, dag);
            default:
                throw new UnsupportedOperationException("scoring a " + estimateClass.word() + " estimate needs the"
                        + " true PAG from core, which this build does not have yet");
        }
    }
}
