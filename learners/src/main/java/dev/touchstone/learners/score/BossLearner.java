package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
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
import java.util.Map;

/**
 * Best order score search (Andrews, Ramsey, Sanchez-Romero, Camchong and Kummerfeld 2023,
 * NeurIPS) with any of the local scores, returning a CPDAG: a search over variable orders
 * ({@link BossSearch}) whose orders are scored through grow-shrink trees
 * ({@link GrowShrinkTree}), then, by default, the backward phase of greedy equivalence
 * search on the CPDAG of the best order's DAG, as in the paper (from memory; Chickering 2002: from an
 * I-map of the distribution the deletions reach the true class in the large-sample limit).
 * Stateless and thread-safe.
 */
public final class BossLearner implements Learner {

    /** The learner id. */
    public static final String ID = "boss";

    static final String STARTS = "starts";
    static final String BACKWARD_PHASE = "backward_phase";

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        return ScoreSettings.describe(ID,
                        "best order score search: moves each variable to the place in a variable order where"
                                + " the DAG the order induces scores best, with grow-shrink trees for the parent"
                                + " sets, then backward deletions on the resulting CPDAG",
                        "Andrews, Ramsey, Sanchez-Romero, Camchong and Kummerfeld (2023), Fast scalable and"
                                + " accurate discovery of DAGs using the best order score search and grow-shrink"
                                + " trees, Advances in Neural Information Processing Systems 36",
                        GraphClass.CPDAG)
                .assumption("a consistent score and faithfulness for the large-sample guarantee")
                .parameter(ParameterSpec.integer(STARTS, 1, 1, 1000,
                        "number of searches from seeded random orders; the best-scoring result is kept"))
                .parameter(ParameterSpec.bool(BACKWARD_PHASE, true,
                        "after the order search, apply the backward (deletion) phase of greedy equivalence"
                                + " search to the CPDAG of the best order's DAG"))
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
        int maxParents = ScoreSettings.maxParents(parameters);
        OrderScorer scorer = new OrderScorer(score, index, maxParents);
        BossSearch search = new BossSearch(scorer, parameters.getInt(STARTS), context);
        int[] order = search.run();
        Pdag dag = scorer.dag(order);
        CpdagCompletion completion = new CpdagCompletion(names, knowledge);
        Pdag result = parameters.getBoolean(BACKWARD_PHASE)
                ? new GesSearch(score, index, completion, maxParents, context).backwardFrom(dag)
                : completion.complete(dag);
        Graph cpdag = result.toGraph(names);
        return new Estimate(cpdag, GraphClass.CPDAG, Map.of(
                "passes", (double) search.passes(),
                "moves", (double) search.moves(),
                "tree-nodes", (double) scorer.treeNodes()));
    }
}
