package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.MeekRules;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.random.Shuffles;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The PC algorithm (Spirtes, Glymour and Scheines 2000, "Causation, Prediction, and
 * Search", 2nd ed., §5.4.2) with the variants in which published versions differ, chosen
 * by parameters of the one learner {@code pc}:
 * <ul>
 *   <li>{@code skeleton}: the sequential adjacency search or the order-independent one of
 *   Colombo and Maathuis (2014, JMLR 15), whose levels run in parallel;</li>
 *   <li>{@code colliders}: the sepset rule, the conservative rule (Ramsey, Zhang and Spirtes
 *   2006, UAI) or the majority rule (Colombo and Maathuis 2014);</li>
 *   <li>{@code conflicts}: how two colliders that disagree about one edge are resolved
 *   ({@link ConflictRule});</li>
 *   <li>{@code order_seed}: when above 0, the search sees the data's columns in a random order
 *   drawn from the run's seed and this number, and the estimate is mapped back to the given
 *   order. A grid of order seeds shows how much a variant depends on variable order, the
 *   question of Colombo and Maathuis (2014, §2); with the oracle the order cannot matter to the
 *   result (the correctness theorem), so it is ignored there. The shuffled view shares the
 *   data's columns but not its cached statistics, so a run with an order seed computes its
 *   own covariance (O(n·p²) more).</li>
 * </ul>
 * After the colliders, Meek's rules (Meek 1995, "Causal inference and causal explanation
 * with background knowledge", UAI) orient what follows, honouring the knowledge.
 *
 * <p>With the d-separation oracle every variant returns the CPDAG of the true DAG (the
 * correctness theorem of PC; checked in the tests). Cost: dominated by the adjacency search
 * (see {@link AdjacencySearch}); the conservative and majority rules add the tests of
 * {@link ColliderOrientation}. Stateless and thread-safe.
 */
public final class PcLearner extends DeclaredLearner {

    static final Parameter<ColliderRule> COLLIDERS = Parameter.choice("colliders", ColliderRule.SEPSET,
            "collider rule: sepset (z not in the recorded separating set), conservative "
                    + "(Ramsey, Zhang and Spirtes 2006) or majority (Colombo and Maathuis 2014)");
    static final Parameter<ConflictRule> CONFLICTS = Parameter.choice("conflicts", ConflictRule.KEEP_FIRST,
            "colliders disagreeing about an edge: keep-first (in variable order) or "
                    + "drop-both (the edge stays undirected; order-independent)");

    static final Parameter<Integer> ORDER_SEED = Parameter.integer("order_seed", 0, 0, 1_000_000,
            "0: search the variables in the order given; above 0: in a random order drawn from the run's seed and "
                    + "this number (to show order dependence; Colombo and Maathuis 2014)");

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        LearnerDescription.Builder b = ConstraintParameters.describe("pc", GraphClass.CPDAG)
                .summary("PC: adjacency search by conditional independence tests, then colliders and Meek's rules;"
                        + " sequential or order-independent skeleton, sepset, conservative or majority colliders")
                .publication("Spirtes, Glymour and Scheines (2000), Causation, Prediction, and Search, 2nd ed.;"
                        + " Colombo and Maathuis (2014), JMLR 15; Ramsey, Zhang and Spirtes (2006), UAI")
                .assumption("acyclic causal structure")
                .assumption("causal Markov condition and faithfulness")
                .assumption("no hidden common causes and no selection bias")
                .assumption("the independence test fits the data (e.g. Gaussian for fisher-z)");
        return ConstraintParameters.build(b, COLLIDERS, CONFLICTS, ORDER_SEED);
    }

    public PcLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        int orderSeed = run.get(ORDER_SEED);
        if (orderSeed == 0 || run.input().isOracle()) {
            return searchAndOrient(SearchInputs.read(run), run);
        }
        int[] order = Shuffles.permutation(Seeds.random(Seeds.derive(run.context().seed(), "column-order", orderSeed)),
                run.names().size());
        LearnerRun shuffled = new LearnerRun(LearnerInput.of(run.input().data().select(order)), run.knowledge(),
                run.parameters(), run.context());
        Estimate e = searchAndOrient(SearchInputs.read(shuffled), shuffled);
        return new Estimate(inOrder(e.graph(), run.names()), e.graphClass(), e.extras());
    }

    /** The same graph with its variables listed in {@code names}' order. */
    private static Graph inOrder(Graph g, List<String> names) {
        MutableGraph m = Graph.builder(names);
        for (Edge e : g.edges()) {
            m.addEdge(names.indexOf(g.name(e.a())), names.indexOf(g.name(e.b())), e.atA(), e.atB());
        }
        return m.freeze();
    }

    /**
     * PC's steps after its inputs are read: adjacency search with {@code in}'s test, colliders
     * by the {@code colliders} and {@code conflicts} parameters, Meek's rules. Shared with the
     * learners that are PC with another test.
     */
    static Estimate searchAndOrient(SearchInputs in, LearnerRun run) {
        RunContext context = run.context();
        KnowledgeIndex ki = in.knowledge();
        IndependenceTest test = in.test();
        int maxDepth = in.maxDepth();
        Skeleton skeleton = new AdjacencySearch(test, ki, in.variant(), maxDepth, context).run();
        ColliderOrientation colliders = new ColliderOrientation(skeleton, test, ki,
                run.get(COLLIDERS), run.get(CONFLICTS), maxDepth, context);
        MutableGraph g = colliders.orient(in.names());
        context.checkDeadline();
        MeekRules.Outcome meek = MeekRules.apply(g, run.knowledge());
        Map<String, Double> extras = new LinkedHashMap<>();
        extras.put("colliders", (double) colliders.counts().colliders());
        extras.put("ambiguous_triples", (double) colliders.counts().ambiguous());
        extras.put("collider_conflicts", (double) colliders.counts().conflicts());
        extras.put("orientation_conflicts", (double) meek.conflicts().size());
        return new Estimate(g.freeze(), GraphClass.CPDAG, extras);
    }
}
