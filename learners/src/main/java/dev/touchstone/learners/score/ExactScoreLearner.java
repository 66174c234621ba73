package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The exact optimum of a decomposable score over all DAGs (within a parent-set limit and the
 * knowledge), by dynamic programming over subsets (Koivisto and Sood 2004, JMLR 5; Silander
 * and Myllymäki 2006, UAI; method and cost: {@link ExactSearch}). Returns the CPDAG of one
 * optimal DAG and says in its extras how many equivalence classes were found at the optimum.
 * Its use in a benchmark is as the yardstick of the score itself: it separates what a score
 * gets wrong at a sample size from what a greedy search fails to reach. Stateless and
 * thread-safe.
 */
public final class ExactScoreLearner extends DeclaredLearner {

    /** The learner id. */
    public static final String ID = "exact-score";

    /** The most variables accepted without a parent limit (or a limit above {@value #WIDE_LIMIT}). */
    public static final int MAX_VARIABLES = 20;
    /** The most variables accepted with a parent limit of at most {@value #WIDE_LIMIT}. */
    public static final int MAX_VARIABLES_LIMITED = 24;
    /** The largest parent limit that admits up to {@value #MAX_VARIABLES_LIMITED} variables. */
    public static final int WIDE_LIMIT = 4;

    /** Scores within this fraction of the optimum's magnitude count as tied. */
    static final double TIE_TOLERANCE = 1e-9;
    /** The most states the walk over tied decisions visits. */
    static final int TIE_STATE_BUDGET = 20_000;

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        return ScoreSettings.describe(ID,
                        "the highest-scoring DAG by dynamic programming over subsets (best parent sets, then"
                                + " the best sink order), returned as its CPDAG; at most " + MAX_VARIABLES
                                + " variables, or " + MAX_VARIABLES_LIMITED + " with parent_limit at most " + WIDE_LIMIT,
                        "Silander and Myllymäki (2006), A simple approach for finding the globally optimal"
                                + " Bayesian network structure, UAI; Koivisto and Sood (2004), Exact Bayesian structure"
                                + " discovery in Bayesian networks, Journal of Machine Learning Research 5",
                        GraphClass.CPDAG)
                .assumption("time and memory grow as 2^p: refused above " + MAX_VARIABLES + " variables ("
                        + MAX_VARIABLES_LIMITED + " with parent_limit at most " + WIDE_LIMIT + ")")
                .build();
    }

    public ExactScoreLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        List<String> names = run.names();
        int limit = run.get(ScoreSettings.PARENT_LIMIT);
        checkSize(names.size(), limit);
        KnowledgeIndex index = KnowledgeIndex.of(run.knowledge(), names);
        LocalScore score = ScoreSettings.build(ID, run.input(), run.parameters());
        ExactSearch search = new ExactSearch(score, index, limit, run.context());
        int[] parents;
        try {
            parents = search.run();
        } catch (IllegalStateException e) {
            throw new LearnerException("learner " + ID + ": " + e.getMessage());
        }
        double optimum = search.optimum();
        ExactSearch.TieWalk walk = search.optimalDags(TIE_TOLERANCE * Math.max(1.0, Math.abs(optimum)), TIE_STATE_BUDGET);
        Set<Graph> classes = new LinkedHashSet<>();
        for (int[] dag : walk.dags()) {
            classes.add(classOf(dag, names, run.knowledge()));
        }
        Graph cpdag = classOf(parents, names, run.knowledge());
        return new Estimate(cpdag, GraphClass.CPDAG, Map.of(
                "score", optimum,
                "optimal-classes-found", (double) Math.max(1, classes.size()),
                "tie-walk-complete", walk.complete() ? 1.0 : 0.0,
                "local-scores", (double) search.localScoresEvaluated(),
                "parent-sets-kept", (double) search.candidatesKept()));
    }

    /** Refuses inputs beyond the stated size, in one line naming the limit. */
    static void checkSize(int p, int limit) {
        boolean narrow = limit >= 0 && limit <= WIDE_LIMIT;
        int max = narrow ? MAX_VARIABLES_LIMITED : MAX_VARIABLES;
        if (p > max) {
            throw new LearnerException("learner " + ID + ": " + p + " variables is more than the " + max
                    + " it accepts" + (narrow ? " with parent_limit at most " + WIDE_LIMIT
                    : " (" + MAX_VARIABLES_LIMITED + " with parent_limit at most " + WIDE_LIMIT + ")")
                    + ": its time and memory grow as 2^p");
        }
    }

    /** The DAG given by parent masks. */
    static Graph dagOf(int[] parents, List<String> names) {
        MutableGraph g = Graph.builder(names);
        for (int v = 0; v < parents.length; v++) {
            for (int rest = parents[v]; rest != 0; rest &= rest - 1) {
                g.addDirected(Integer.numberOfTrailingZeros(rest), v);
            }
        }
        return g.freeze();
    }

    /** The CPDAG of the DAG, with the orientations knowledge demands closed under Meek's rules (as GES returns). */
    private static Graph classOf(int[] parents, List<String> names, Knowledge knowledge) {
        return CpdagCompletion.classOf(dagOf(parents, names), knowledge);
    }
}
