package dev.touchstone.learners.constraint;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.learners.independence.FisherZTest;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.independence.IndependenceTests;
import dev.touchstone.learners.independence.MissingnessCauses;
import dev.touchstone.learners.independence.OracleTest;
import dev.touchstone.learners.independence.PermutationCorrectedTest;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * MVPC, the missing-value PC of Tu, Zhang, Ackermann, Mohan, Kjellström and Zhang (2019,
 * "Causal discovery in the presence of missing data", AISTATS, PMLR 89), for continuous data:
 * (1) find the causes of each missingness indicator ({@link MissingnessCauses}); (2) run PC
 * with Fisher z under test-wise deletion in which every test whose variables' indicators have
 * causes outside the test is corrected by the paper's permutation-based correction
 * ({@link PermutationCorrectedTest}); (3) PC's colliders and Meek's rules. The paper corrects
 * only the tests that decide edges left after a first test-wise skeleton; applying the
 * correction to every test it concerns gives the same decisions on those tests at the cost of
 * more corrected tests (a choice made here).
 *
 * <p>What the correction cannot fix, as the paper states: self-masking missingness (a value's
 * own size makes it missing) leaves no trace in the observed rows, so its indicator's cause is
 * not found and the test stays plain test-wise deletion.
 *
 * <p>Cost: PC's tests, each corrected one O(n (|S| + 2)(|W| + 1)²), plus the indicator search.
 * Stateless and thread-safe.
 */
public final class MvpcLearner extends DeclaredLearner {

    /** The learner id. */
    public static final String ID = "mvpc";

    static final Parameter<Integer> INDICATOR_DEPTH = Parameter.integer("indicator_depth", 2, 0, 10,
            "largest conditioning set tried when finding the causes of each missingness indicator");

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        return LearnerDescription.builder(ID)
                .summary("PC for continuous data with missing values: Fisher z under test-wise deletion, each test"
                        + " corrected by permutation for the causes of the missingness indicators it involves")
                .publication("Tu, Zhang, Ackermann, Mohan, Kjellström and Zhang (2019), Causal discovery in the"
                        + " presence of missing data, AISTATS, PMLR 89")
                .family(LearnerFamily.CONSTRAINT)
                .accepts(DataKind.CONTINUOUS)
                .returns(GraphClass.CPDAG)
                .missingValues(MissingValues.OWN_METHOD)
                .knowledge(KnowledgeUse.REQUIRED_EDGES, KnowledgeUse.FORBIDDEN_EDGES, KnowledgeUse.TIERS)
                .oracle(OracleUse.INDEPENDENCE)
                .assumption("acyclic causal structure, causal Markov condition and faithfulness")
                .assumption("no hidden common causes and no selection bias")
                .assumption("linear Gaussian relations (Fisher z and linear fits of the correction)")
                .assumption("missingness indicators have no children and are not caused by their own variable"
                        + " (no self-masking)")
                .parameter(IndependenceTests.ALPHA)
                .parameter(ConstraintParameters.MAX_DEPTH)
                .parameter(ConstraintParameters.SKELETON)
                .parameter(PcLearner.COLLIDERS)
                .parameter(PcLearner.CONFLICTS)
                .parameter(INDICATOR_DEPTH)
                .build();
    }

    public MvpcLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        LearnerInput input = run.input();
        double alpha = run.get(IndependenceTests.ALPHA);
        IndependenceTest test;
        int[][] causes = null;
        if (input.isOracle()) {
            test = new OracleTest(input.oracle());
        } else if (!input.data().hasMissing()) {
            test = FisherZTest.of(input.data(), alpha);
        } else {
            DataSet data = input.data();
            causes = MissingnessCauses.find(data, alpha, run.get(INDICATOR_DEPTH), run.context());
            test = new PermutationCorrectedTest(data, alpha, causes, run.context().seed());
        }
        Estimate e = PcLearner.searchAndOrient(SearchInputs.of(run, test), run);
        Map<String, Double> extras = new LinkedHashMap<>(e.extras());
        if (causes != null) {
            int withCauses = 0;
            for (int[] c : causes) {
                withCauses += c.length > 0 ? 1 : 0;
            }
            extras.put("indicators_with_causes", (double) withCauses);
            extras.put("corrected_tests", (double) ((PermutationCorrectedTest) test).correctedTests());
        }
        return new Estimate(e.graph(), e.graphClass(), extras);
    }
}
