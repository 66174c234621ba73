package dev.touchstone.core.learner;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterValues;
import org.junit.jupiter.api.Test;
import org.opentest4j.AssertionFailedError;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertThrows;

/** The contract test fails for learners that break its rules (so it is not a test that cannot fail). */
class BrokenLearnerTest {

    /** Claims a DAG but returns undirected edges, ignores the deadline, uses a variable order of its own. */
    static final class Liar implements Learner {
        @Override
        public LearnerDescription description() {
            return LearnerDescription.builder("test-liar").summary("breaks the contract").publication("none")
                    .family(LearnerFamily.BASELINE).accepts(DataKind.CONTINUOUS).returns(GraphClass.DAG).build();
        }

        @Override
        public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
            List<String> names = new ArrayList<>(input.variableNames());
            java.util.Collections.reverse(names);
            return Estimate.of(Graph.builder(names).addUndirected(0, 1).freeze(), GraphClass.CPDAG);
        }
    }

    static final class LiarContract extends LearnerContractTest {
        @Override
        protected Learner learner() {
            return new Liar();
        }
    }

    /** Declares forbidden edges but always joins its first two variables. */
    static final class KnowledgeIgnorer implements Learner {
        @Override
        public LearnerDescription description() {
            return LearnerDescription.builder("test-ignorer").summary("ignores knowledge").publication("none")
                    .family(LearnerFamily.BASELINE).accepts(DataKind.CONTINUOUS).returns(GraphClass.DAG)
                    .missingValues(MissingValues.OWN_METHOD).knowledge(KnowledgeUse.FORBIDDEN_EDGES).build();
        }

        @Override
        public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
            return Estimate.of(Graph.builder(input.variableNames()).addDirected(0, 1).freeze(), GraphClass.DAG);
        }
    }

    static final class KnowledgeIgnorerContract extends LearnerContractTest {
        @Override
        protected Learner learner() {
            return new KnowledgeIgnorer();
        }
    }

    @Test
    void contractCatchesIgnoredKnowledge() {
        assertThrows(AssertionFailedError.class, () -> new KnowledgeIgnorerContract().honoursTheKnowledgeItDeclares());
    }

    @Test
    void contractCatchesAWrongClassAndOrder() {
        assertThrows(AssertionFailedError.class, () -> new LiarContract().returnsItsDeclaredClassOverTheInputVariables());
    }

    @Test
    void contractCatchesAnIgnoredDeadline() {
        assertThrows(AssertionFailedError.class, () -> new LiarContract().honoursTheDeadline());
    }

    @Test
    void contractCatchesAcceptingDataItDoesNotDeclare() {
        assertThrows(AssertionFailedError.class, () -> new LiarContract().acceptsTheDataKindsItDeclaresAndRejectsTheOthers());
    }

    @Test
    void contractCatchesIgnoringMissingValuesItDeclaresToReject() {
        assertThrows(AssertionFailedError.class, () -> new LiarContract().treatsMissingValuesAsItDeclares());
    }

    @Test
    void contractCatchesUsingAnOracleItDoesNotDeclare() {
        assertThrows(AssertionFailedError.class, () -> new LiarContract().usesTheOracleExactlyWhenItSaysSo());
    }
}
