package dev.touchstone.core.learner;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterValues;

/**
 * Runs the contract against a minimal learner written here, so the contract itself is
 * exercised in core (a learner that broke a rule would fail it; see {@link BrokenLearnerTest}).
 */
class EmptyLearnerContractTest extends LearnerContractTest {

    static final class Nothing implements Learner {
        private final LearnerDescription description = LearnerDescription.builder("test-nothing")
                .summary("returns no edges").publication("common practice").family(LearnerFamily.BASELINE)
                .accepts(DataKind.CONTINUOUS).returns(GraphClass.CPDAG).oracle(OracleUse.INDEPENDENCE).build();

        @Override
        public LearnerDescription description() {
            return description;
        }

        @Override
        public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
            description.checkAccepts(input);
            context.checkDeadline();
            return Estimate.of(Graph.empty(input.variableNames()), GraphClass.CPDAG);
        }
    }

    @Override
    protected Learner learner() {
        return new Nothing();
    }
}
