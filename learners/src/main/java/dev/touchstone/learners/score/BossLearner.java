package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
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
 * Best order score search (Andrews, Ramsey, Sanchez-Romero, Camchong and Kummerfeld 2023,
 * NeurIPS) with any of the local scores, returning a CPDAG: a search over variable orders
 * ({@link BossSearch}) whose orders are scored through grow-shrink trees
 * ({@link GrowShrinkTree}), then, by default, the backward phase of greedy equivalence
 * search on the CPDAG of the best order's DAG, as in the paper (from memory; Chickering 2002: from an
 * I-map of the distribution the deletions reach the true class in the large-sample limit).
 * Stateless and thread-safe.
 */
public final class BossLearner extends DeclaredLearner {

    /** The learner id. */
    public static final String ID = "boss";

    static final Parameter<Integer> STARTS = Parameter.integer("starts", 1, 1, 1000,
            "number of searches from seeded random orders; the best-scoring result is kept");
    static final Parameter<Boolean> BACKWARD_PHASE = Parameter.bool("backward_phase", true,
            "after the order search, apply the backward (deletion) phase of greedy equivalence"
                    + " search to the CPDAG of the best order's DAG");

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
                .parameter(STARTS)
                .parameter(BACKWARD_PHASE)
                .build();
    }

    public BossLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        List<String> names = run.names();
        KnowledgeIndex index = KnowledgeIndex.of(run.knowledge(), names);
        LocalScore score = ScoreCache.of(ScoreSettings.build(ID, run.input(), run.parameters()), run.context());
        int maxParents = run.get(ScoreSettings.PARENT_LIMIT);
        OrderScorer scorer = new OrderScorer(score, index, maxParents);
        BossSearch search = new BossSearch(scorer, run.get(STARTS), run.context());
        int[] order = search.run();
        Pdag dag = scorer.dag(order);
        CpdagCompletion completion = new CpdagCompletion(names, run.knowledge());
        Pdag result = run.get(BACKWARD_PHASE)
                ? new GesSearch(score, index, completion, maxParents, run.context()).backwardFrom(dag)
                : completion.complete(dag);
        Graph cpdag = result.toGraph(names);
        return new Estimate(cpdag, GraphClass.CPDAG, Map.of(
                "passes", (double) search.passes(),
                "moves", (double) search.moves(),
                "tree-nodes", (double) scorer.treeNodes()));
    }
}
