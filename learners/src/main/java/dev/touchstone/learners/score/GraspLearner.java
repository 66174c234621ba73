package dev.touchstone.learners.score;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;

import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Greedy relaxations of the sparsest permutation (GRaSP; Lam, Andrews and Ramsey 2022, UAI) with
 * any of the local scores, returning the CPDAG of the best order's DAG: a depth-limited search
 * over tucks of a variable order ({@link GraspSearch}), the orders scored through the same
 * grow-shrink trees as BOSS ({@link OrderScorer}). Stateless and thread-safe.
 */
public final class GraspLearner implements Learner {

    /** The learner id. */
    public static final String ID = "grasp";

    static final String STARTS = "starts";
    static final String DEPTH = "depth";
    static final String TUCKS = "tucks";

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
                .parameter(ParameterSpec.integer(STARTS, 1, 1, 1000,
                        "number of searches from seeded random orders; the best-scoring result is kept"))
                .parameter(ParameterSpec.integer(DEPTH, 4, 1, 20,
                        "longest chain of score-keeping tucks explored in search of an improvement"))
                .parameter(ParameterSpec.choice(TUCKS, "all", List.of("covered", "singular", "all"),
                        "tucks tried: covered edges only (GRaSP0), also uncovered ones that move a single"
                                + " variable (GRaSP1), or all (GRaSP2)"))
                .build();
    }

    @Override
    public LearnerDescription description() {
        return DESCRIPTION;
    }

    @Override
    public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
        DESCRIPTION.checkAccepts(input);
        context.checkDeadline();
        List<String> names = input.variableNames();
        KnowledgeIndex index = HillClimbLearner.indexKnowledge(knowledge, names);
        LocalScore score = ScoreCache.of(ScoreSettings.build(ID, input, parameters), context);
        OrderScorer scorer = new OrderScorer(score, index, ScoreSettings.maxParents(parameters));
        GraspSearch.Tucks tucks = GraspSearch.Tucks.valueOf(parameters.getString(TUCKS).toUpperCase(Locale.ROOT));
        GraspSearch search = new GraspSearch(scorer, tucks, parameters.getInt(DEPTH), context);
        int[] order = search.run(parameters.getInt(STARTS));
        Pdag cpdag = new CpdagCompletion(names, knowledge).complete(scorer.dag(order));
        return new Estimate(cpdag.toGraph(names), GraphClass.CPDAG, Map.of(
                "tucks-tried", (double) search.tucksTried(),
                "improvements", (double) search.improvements(),
                "tree-nodes", (double) scorer.treeNodes()));
    }
}
