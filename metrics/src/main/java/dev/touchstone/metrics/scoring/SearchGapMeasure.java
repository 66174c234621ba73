package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.GraphClass;

import java.util.EnumSet;
import java.util.List;
import java.util.Set;

/**
 * The search gap of a score-based learner: what separates the score's own error at this
 * sample size from its search's. For one run, the decomposable score the learner maximised
 * (its own score settings, on its own input) is evaluated on the estimate (a DAG, or a member
 * DAG of a CPDAG), on the true DAG and, where the variables are few enough, on an exact
 * optimum (dynamic programming over subsets: Silander and Myllymäki 2006). Two errors follow:
 * the score's own ({@link #SCORE_SHD}: the optimum's class against the truth's) and the
 * search's ({@link #SEARCH_SCORE_GAP}, {@link #SEARCH_SHD}: the estimate against the optimum).
 *
 * <p>Computed by the harness, which has the data (they are not functions of the two graphs
 * alone); undefined (null) for learners whose score is not known, estimates that are not a
 * DAG or CPDAG, truths with hidden variables (for the truth's score and the score's error)
 * and inputs beyond the exact search's reach (for the optimum and both derived values).
 */
public final class SearchGapMeasure implements Metric {

    /** Scores are log-likelihoods with penalties: any real number. */
    private static final MetricRange ANY = new MetricRange(Double.NEGATIVE_INFINITY, null, "any real number");

    public static final SearchGapMeasure SCORE_OF_ESTIMATE = new SearchGapMeasure("score_of_estimate", Direction.NONE,
            ANY, "the learner's score of its estimate (a member DAG of a CPDAG)");
    public static final SearchGapMeasure SCORE_OF_TRUTH = new SearchGapMeasure("score_of_truth", Direction.NONE,
            ANY, "the learner's score of the true DAG");
    public static final SearchGapMeasure SCORE_OF_OPTIMUM = new SearchGapMeasure("score_of_optimum", Direction.NONE,
            ANY, "the highest score over all DAGs within the learner's parent limit and knowledge"
            + " (exact dynamic programming, Silander and Myllymäki 2006)");
    public static final SearchGapMeasure SEARCH_SCORE_GAP = new SearchGapMeasure("search_score_gap",
            Direction.LOWER_IS_BETTER, MetricRange.NON_NEGATIVE, "score of the optimum minus score of the estimate:"
            + " the search's shortfall (0 when it reached an optimum)");
    public static final SearchGapMeasure SEARCH_SHD = new SearchGapMeasure("search_shd", Direction.LOWER_IS_BETTER,
            MetricRange.upTo("p(p−1)/2"), "SHD between the CPDAGs of the estimate and of the optimum: the search's"
            + " structural error");
    public static final SearchGapMeasure SCORE_SHD = new SearchGapMeasure("score_shd", Direction.LOWER_IS_BETTER,
            MetricRange.upTo("p(p−1)/2"), "SHD between the CPDAGs of the optimum and of the truth: the score's own"
            + " error at this sample size (0 with the oracle when the truth is faithful)");

    /** All of them, in table order. */
    public static final List<SearchGapMeasure> ALL = List.of(SCORE_OF_ESTIMATE, SCORE_OF_TRUTH, SCORE_OF_OPTIMUM,
            SEARCH_SCORE_GAP, SEARCH_SHD, SCORE_SHD);

    private final String name;
    private final Direction direction;
    private final MetricRange range;
    private final String definition;

    private SearchGapMeasure(String name, Direction direction, MetricRange range, String definition) {
        this.name = name;
        this.direction = direction;
        this.range = range;
        this.definition = definition;
    }

    /** Whether a metric name is one of the search-gap measures. */
    public static boolean isOne(String name) {
        for (SearchGapMeasure m : ALL) {
            if (m.name.equals(name)) {
                return true;
            }
        }
        return false;
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public Direction direction() {
        return direction;
    }

    @Override
    public MetricRange range() {
        return range;
    }

    @Override
    public Set<GraphClass> appliesTo() {
        return EnumSet.of(GraphClass.DAG, GraphClass.CPDAG);
    }

    @Override
    public String definition() {
        return definition;
    }

    @Override
    public String toString() {
        return name;
    }
}
