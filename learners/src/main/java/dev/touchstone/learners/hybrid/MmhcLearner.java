package dev.touchstone.learners.hybrid;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.Worded;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.learners.constraint.ConstraintParameters;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.independence.IndependenceTests;
import dev.touchstone.learners.score.HillClimbLearner;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * MMHC, max-min hill climbing (Tsamardinos, Brown and Aliferis 2006, "The max-min
 * hill-climbing Bayesian network structure learning algorithm", Machine Learning 65): the
 * skeleton from Max-Min Parents and Children ({@link Mmpc}) with the symmetry correction, then
 * hill climbing over DAGs restricted to that skeleton. The restriction is background knowledge
 * (every pair outside the skeleton forbidden both ways) given, with the user's knowledge, to the
 * {@code hill-climbing} learner ({@link HillClimbLearner}), so no search is copied. Returns the
 * DAG the climb reaches (one member of its equivalence class).
 *
 * <p>Knowledge: pairs with a required edge are kept in the skeleton whatever the tests say;
 * forbidden directions and tiers are the climb's. Cost: MMPC's tests (see {@link Mmpc}), then
 * the climb, whose moves are limited to the skeleton's pairs. Stateless and thread-safe.
 */
public final class MmhcLearner extends DeclaredLearner {

    /** The learner id. */
    public static final String ID = "mmhc";

    /** Which candidate sets must name a pair for it to join the skeleton. */
    enum SkeletonRule implements Worded {
        /** Each variable is in the other's candidate set (the paper's symmetry correction). */
        AND,
        /** Either is in the other's set. */
        OR
    }

    static final Parameter<SkeletonRule> SKELETON_RULE = Parameter.choice("skeleton_rule", SkeletonRule.AND,
            "symmetry correction of the candidate sets: and keeps x - y when each is in the other's set (the"
                    + " paper), or when either is");

    private static final HillClimbLearner CLIMB = new HillClimbLearner();
    private static final List<ParameterSpec> TEST_SPECS = testSpecs();
    private static final LearnerDescription DESCRIPTION = describe();

    private static List<ParameterSpec> testSpecs() {
        List<ParameterSpec> specs = new ArrayList<>(ConstraintParameters.testParameters());
        specs.add(ConstraintParameters.MAX_DEPTH.spec());
        specs.add(SKELETON_RULE.spec());
        return List.copyOf(specs);
    }

    private static LearnerDescription describe() {
        LearnerDescription.Builder b = LearnerDescription.builder(ID)
                .summary("MMHC: max-min parents and children with the symmetry correction for the skeleton, then"
                        + " hill climbing restricted to it; returns a DAG. The climb drops rows with missing cells;"
                        + " the tests follow 'missing'")
                .publication("Tsamardinos, Brown and Aliferis (2006), The max-min hill-climbing Bayesian network"
                        + " structure learning algorithm, Machine Learning 65")
                .family(LearnerFamily.HYBRID)
                .accepts(DataKind.CONTINUOUS, DataKind.DISCRETE, DataKind.MIXED)
                .returns(GraphClass.DAG)
                .missingValues(MissingValues.CONFIGURABLE)
                .knowledge(KnowledgeUse.REQUIRED_EDGES, KnowledgeUse.FORBIDDEN_EDGES, KnowledgeUse.TIERS)
                .oracle(OracleUse.COVARIANCE)
                .assumption("acyclic causal structure")
                .assumption("no hidden confounders")
                .assumption("faithfulness, for the skeleton")
                .assumption("the DAG returned is one member of its equivalence class; its orientations within the"
                        + " class are not identified by the data");
        for (ParameterSpec s : DelegateParameters.union(TEST_SPECS, CLIMB.description().parameters())) {
            b.parameter(s);
        }
        return b.build();
    }

    public MmhcLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        List<String> names = run.names();
        Knowledge knowledge = run.knowledge();
        RunContext context = run.context();
        Mmpc mmpc = new Mmpc(IndependenceTests.forInput(run.input(), run.parameters(),
                Seeds.derive(context.seed(), "independence-test")),
                run.get(ConstraintParameters.MAX_DEPTH), context);
        List<int[]> pc;
        try {
            pc = mmpc.all();
        } finally {
            context.countTests(mmpc.tests());
        }
        boolean both = run.get(SKELETON_RULE) == SkeletonRule.AND;
        Knowledge.Builder restricted = knowledge.toBuilder();
        int edges = 0;
        int oneSided = 0;
        for (int x = 0; x < names.size(); x++) {
            for (int y = x + 1; y < names.size(); y++) {
                String a = names.get(x);
                String b = names.get(y);
                boolean required = knowledge.isRequired(a, b) || knowledge.isRequired(b, a);
                if (Mmpc.joined(pc, x, y, true) != Mmpc.joined(pc, x, y, false)) {
                    oneSided++;
                }
                if (required || Mmpc.joined(pc, x, y, both)) {
                    edges++;
                } else {
                    restricted.forbid(a, b).forbid(b, a);
                }
            }
        }
        Estimate climb = CLIMB.learn(run.input(), restricted.build(),
                DelegateParameters.part("learner " + ID, run.parameters(), CLIMB.description()), context);
        Map<String, Double> extras = new LinkedHashMap<>();
        extras.put("skeleton_edges", (double) edges);
        extras.put("one_sided_pairs", (double) oneSided);
        extras.putAll(climb.extras());
        return new Estimate(climb.graph(), GraphClass.DAG, extras);
    }

    /** The candidate parents and children of every variable (before the symmetry correction), for tests. */
    static List<int[]> candidateSets(IndependenceTest test, int maxDepth, RunContext context) {
        return new Mmpc(test, maxDepth, context).all();
    }
}
