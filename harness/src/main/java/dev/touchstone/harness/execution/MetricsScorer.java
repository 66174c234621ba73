package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.metrics.against.MetricAgainst;
import dev.touchstone.metrics.truth.Truth;
import dev.touchstone.metrics.truth.TruthSelection;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The scorer over the metrics module: the truth of the estimate's class comes from
 * {@code TruthSelection.forEstimate} (DAG → true DAG or, with hidden variables, the
 * true MAG; CPDAG → true CPDAG or PAG; PAG → true PAG), and the requested metrics from
 * {@code dev.touchstone.metrics.scoring.Scorer}. Cost: building the truth (the PAG construction
 * when variables are hidden) plus the metrics. Extra metrics ({@code METRIC_vs_CLASS}, a
 * study's {@code score_against}) are scored against {@code TruthSelection.as(dag, CLASS)},
 * as {@code touchstone score --as CLASS} does.
 */
public final class MetricsScorer implements Scorer {

    @Override
    public Scored score(Replicate replicate, Estimate estimate, List<String> metrics) {
        Truth truth = truthFor(replicate.trueDag(), estimate.graphClass());
        List<String> plain = new ArrayList<>();
        Map<GraphClass, List<MetricAgainst>> extras = new LinkedHashMap<>();
        for (String m : metrics) {
            MetricAgainst x = MetricAgainst.parse(m);
            if (x == null) {
                plain.add(m);
            } else {
                extras.computeIfAbsent(x.against(), c -> new ArrayList<>()).add(x);
            }
        }
        Map<String, Double> values = new LinkedHashMap<>(dev.touchstone.metrics.scoring.Scorer.score(truth,
                estimate.graph(), estimate.graphClass(), plain));
        extras.forEach((against, wanted) -> values.putAll(scoreAgainst(replicate.trueDag(), estimate, against, wanted)));
        return new Scored(truth.referenceClass(), values);
    }

    /**
     * The wanted metrics against the truth of a requested class ({@code score_against}); all
     * undefined (null) when that truth does not exist, e.g. a CPDAG when variables are hidden.
     */
    private static Map<String, Double> scoreAgainst(Graph dag, Estimate estimate, GraphClass against,
                                                    List<MetricAgainst> wanted) {
        Map<String, Double> out = new LinkedHashMap<>();
        Truth truth;
        try {
            truth = TruthSelection.as(dag, against);
        } catch (IllegalArgumentException e) {
            wanted.forEach(x -> out.put(x.name(), null));
            return out;
        }
        Map<String, Double> v = dev.touchstone.metrics.scoring.Scorer.score(truth, estimate.graph(),
                estimate.graphClass(), wanted.stream().map(MetricAgainst::base).toList());
        wanted.forEach(x -> out.put(x.name(), v.get(x.base())));
        return out;
    }

    /** The truth an estimate of this class is scored against (the metrics module's selection). */
    static Truth truthFor(Graph dag, GraphClass estimateClass) {
        return TruthSelection.forEstimate(dag, estimateClass);
    }
}
