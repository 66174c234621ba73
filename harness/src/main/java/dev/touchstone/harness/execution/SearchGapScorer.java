package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeadlineExceededException;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.score.OptimisedScore;
import dev.touchstone.metrics.scoring.SearchGapMeasure;
import dev.touchstone.metrics.truth.TruthSelection;

import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The search-gap measures of one run ({@link SearchGapMeasure}): the learner's own score of
 * its estimate, of the true DAG and of an exact optimum, the search's shortfall in score and
 * SHD, and the score's own error in SHD. All null for a learner whose score is not known
 * ({@link OptimisedScore#of}); the optimum and what derives from it are null beyond the exact
 * search's reach or when it passes the run's time limit. SHDs compare classes (CPDAGs of
 * member DAGs), since a score-equivalent score cannot tell members of a class apart.
 * Cost: one pass of local scores per graph, plus the exact search (BIC: under a second of CPU at 16
 * variables, growing as 2^p; BDeu and the conditional Gaussian score cost O(n) per local score).
 */
final class SearchGapScorer {

    /** Relative size under which a gap is rounding (sums in another order) and reported as 0. */
    static final double ROUNDING = 1e-9;

    private SearchGapScorer() {
    }

    /** Whether a study asks for any of the measures. */
    static boolean wanted(List<String> metrics) {
        return metrics.stream().anyMatch(SearchGapMeasure::isOne);
    }

    /** The measures of this run, by name (values may be null). */
    static Map<String, Double> score(Learner learner, LearnerInput input, ParameterValues values, Knowledge knowledge,
                                     Graph trueDag, Estimate estimate, Duration limit) {
        Map<String, Double> out = new LinkedHashMap<>();
        SearchGapMeasure.ALL.forEach(m -> out.put(m.name(), null));
        Optional<OptimisedScore> os = OptimisedScore.of(learner, input, values, knowledge);
        if (os.isEmpty()) {
            return out;
        }
        OptimisedScore score = os.get();
        Double est = score.of(estimate.graph(), estimate.graphClass()).orElse(null);
        Double truth = trueDag.hasHidden() ? null : score.of(trueDag, GraphClass.DAG).orElse(null);
        out.put(SearchGapMeasure.SCORE_OF_ESTIMATE.name(), est);
        out.put(SearchGapMeasure.SCORE_OF_TRUTH.name(), truth);
        OptimisedScore.Optimum optimum;
        try {
            optimum = score.optimum(RunContext.of(0, limit, 1)).orElse(null);
        } catch (DeadlineExceededException e) {
            optimum = null;
        }
        if (optimum == null) {
            return out;
        }
        out.put(SearchGapMeasure.SCORE_OF_OPTIMUM.name(), optimum.score());
        Graph optimalClass = Cpdags.of(optimum.dag());
        if (est != null) {
            double gap = optimum.score() - est;
            if (Math.abs(gap) <= ROUNDING * Math.max(1, Math.abs(optimum.score()))) {
                gap = 0;
            }
            out.put(SearchGapMeasure.SEARCH_SCORE_GAP.name(), gap);
            Graph member = estimate.graphClass() == GraphClass.DAG ? estimate.graph() : DagExtension.of(estimate.graph());
            out.put(SearchGapMeasure.SEARCH_SHD.name(), shd(optimum.dag(), Cpdags.of(member)));
        }
        if (truth != null) {
            out.put(SearchGapMeasure.SCORE_SHD.name(), shd(trueDag, optimalClass));
        }
        return out;
    }

    /** SHD of a CPDAG against the CPDAG of a DAG (the metrics module's definition). */
    private static Double shd(Graph referenceDag, Graph cpdag) {
        return dev.touchstone.metrics.scoring.Scorer.score(TruthSelection.as(referenceDag, GraphClass.CPDAG), cpdag,
                GraphClass.CPDAG, List.of("shd")).get("shd");
    }
}
