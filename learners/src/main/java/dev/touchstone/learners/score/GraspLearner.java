package dev.touchstone.learners.score;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.List;
import java.util.Map;

/**
 * Greedy relaxations of the sparsest permutation (GRaSP; Lam, Andrews and Ramsey 2022, UAI) with
 * any of the local scores, returning the CPDAG of the best order's DAG: a depth-limited search
 * over tucks of a variable order ({@link GraspSearch}), the orders scored through the same
 * grow-shrink trees as BOSS ({@link OrderScorer}). Stateless and thread-safe.
 */
public final class GraspLearner extends DeclaredLearner {

    /** The learner id. */
    public static final String ID = "grasp";

    static final Parameter<Integer> STARTS = Parameter.integer("starts", 1, 1, 1000,
            "number of searches from seeded random orders; the best-scoring result is kept");
    static final Parameter<Integer> DEPTH = Parameter.integer("depth", 4, 1, 20,
            "longest chain of score-keeping tucks explored in search of an improvement");
    static final Parameter<GraspSearch.Tucks> TUCKS = Parameter.choice("tucks", GraspSearch.Tucks.ALL,
            "tucks tried: covered edges only (GRaSP0), also uncovered ones that move a single"
                    + " variable (GRaSP1), or all (GRaSP2)");

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        return ScoreSettings.describe(ID,
                        "greedy relaxations of the sparsest permutation: a depth-limited search over tucks of a"
                                + " variable order (move a variable, with its ancestors in between, before one of its"
                                + " parents), each order scored as the DAG it induces through grow-shrink trees",
                        "Lam, Andrews and Ramsey (2022), Greedy relaxations of the sparsest permutation algorithm,"
                                + " Proceedings of the 38th Conference on Uncertainty in Artificial Intelligence",
                        GraphClass.CPDAG)
                .assumption("a consistent score and faithfulness for the large-sample guarantee")
                .parameter(STARTS)
                .parameter(DEPTH)
                .parameter(TUCKS)
                .build();
    }

    public GraspLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        List<String> names = run.names();
        KnowledgeIndex index = KnowledgeIndex.of(run.knowledge(), names);
        LocalScore score = ScoreCache.of(ScoreSettings.build(ID, run.input(), run.parameters()), run.context());
        OrderScorer scorer = new OrderScorer(score, index, run.get(ScoreSettings.PARENT_LIMIT));
        GraspSearch search = new GraspSearch(scorer, run.get(TUCKS), run.get(DEPTH), run.context());
        int[] order = search.run(run.get(STARTS));
        Pdag cpdag = new CpdagCompletion(names, run.knowledge()).complete(scorer.dag(order));
        return new Estimate(cpdag.toGraph(names), GraphClass.CPDAG, Map.of(
                "tucks-tried", (double) search.tucksTried(),
                "improvements", (double) search.improvements(),
                "tree-nodes", (double) scorer.treeNodes()));
    }
}
