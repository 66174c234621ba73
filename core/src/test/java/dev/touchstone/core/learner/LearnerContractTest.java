package dev.touchstone.core.learner;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The contract every learner must pass: it declares its properties truthfully, returns a
 * graph of its declared class over the input's variables, is deterministic for a seed,
 * honours the deadline, and rejects data it does not accept with a clear message.
 *
 * <p>Extend it with {@link #learner()} and, where the defaults do not fit, override the
 * input or parameter hooks.
 */
public abstract class LearnerContractTest {

    /** The learner under test. */
    protected abstract Learner learner();

    /** Raw parameter values to run with (defaults fill in the rest). */
    protected Map<String, Object> parameters() {
        return Map.of();
    }

    /**
     * Whether the learner checks its deadline. Only learners whose whole work is
     * O(variables) (such as the empty graph) may return false.
     */
    protected boolean checksDeadline() {
        return true;
    }

    /** The truth behind the generated inputs: a small random DAG. */
    protected Graph truth() {
        return RandomDags.erdosRenyi(6, 2.0, 11);
    }

    /** A data set of the given kind, from {@link #truth()}. */
    protected DataSet data(DataKind kind, long seed) {
        switch (kind) {
            case CONTINUOUS:
                return SmallData.linearGaussian(truth(), 400, seed);
            case DISCRETE:
                return SmallData.binary(truth(), 400, seed);
            default:
                return SmallData.mixed(SmallData.linearGaussian(RandomDags.erdosRenyi(3, 1.5, 5), 400, seed),
                        SmallData.binary(RandomDags.erdosRenyi(3, 1.5, 6), 400, seed + 1));
        }
    }

    /** An input the learner accepts. */
    protected LearnerInput acceptedInput() {
        DataKind kind = description().accepts().iterator().next();
        return LearnerInput.of(data(kind, 3));
    }

    protected final LearnerDescription description() {
        return learner().description();
    }

    protected final ParameterValues parameterValues() {
        return ParameterValues.resolve("learner " + description().id(), description().parameters(), parameters());
    }

    private Estimate run(LearnerInput input, RunContext ctx) {
        return learner().learn(input, Knowledge.none(), parameterValues(), ctx);
    }

    @Test
    void describesItselfCompletely() {
        LearnerDescription d = description();
        assertTrue(d.id().matches("[a-z][a-z0-9-]*"), d.id());
        assertFalse(d.summary().isBlank(), "summary");
        assertFalse(d.publication().isBlank(), "publication");
        assertNotNull(d.family(), "family");
        assertNotNull(d.returns(), "returns");
        assertFalse(d.accepts().isEmpty(), "accepts");
        Set<String> names = new HashSet<>();
        for (ParameterSpec p : d.parameters()) {
            assertTrue(names.add(p.name()), "parameter declared twice: " + p.name());
            assertFalse(p.meaning().isBlank(), "meaning of " + p.name());
            if (p.defaultValue() != null) {
                p.parse(p.defaultValue());
            }
        }
    }

    @Test
    void returnsItsDeclaredClassOverTheInputVariables() {
        LearnerInput input = acceptedInput();
        Estimate e = run(input, RunContext.unlimited(7));
        assertEquals(description().returns(), e.graphClass(), "declared graph class");
        assertEquals(input.variableNames(), e.graph().names(), "variables of the estimate");
        assertFalse(e.graph().hasHidden(), "an estimate has no hidden variables");
        for (Edge edge : e.graph().edges()) {
            assertTrue(e.graphClass().allows(edge), "edge marks not allowed in " + e.graphClass() + ": " + edge);
        }
        if (e.graphClass() == GraphClass.DAG) {
            assertTrue(e.graph().isFullyDirected(), "a DAG has only directed edges");
        }
    }

    @Test
    void isDeterministicForASeed() {
        LearnerInput input = acceptedInput();
        Estimate a = run(input, RunContext.unlimited(42));
        Estimate b = run(input, RunContext.unlimited(42));
        assertEquals(a.graph(), b.graph(), "same input and seed must give the same estimate");
    }

    @Test
    void honoursTheDeadline() {
        RunContext expired = RunContext.of(1, Duration.ZERO, 1);
        if (checksDeadline()) {
            assertThrows(DeadlineExceededException.class, () -> run(acceptedInput(), expired),
                    "a run whose limit has passed must stop with DeadlineExceededException");
        } else {
            // A learner that declares O(variables) work without deadline checks must then
            // finish even when its limit has already passed, with its declared class.
            LearnerInput input = acceptedInput();
            Estimate e = run(input, expired);
            assertEquals(description().returns(), e.graphClass(), "declared graph class");
            assertEquals(input.variableNames(), e.graph().names(), "variables of the estimate");
        }
    }

    @Test
    void acceptsTheDataKindsItDeclaresAndRejectsTheOthers() {
        for (DataKind kind : DataKind.values()) {
            LearnerInput input = LearnerInput.of(data(kind, 5));
            if (description().accepts().contains(kind)) {
                Estimate e = run(input, RunContext.unlimited(1));
                assertEquals(description().returns(), e.graphClass(), "declared graph class on " + kind.word());
                assertEquals(input.variableNames(), e.graph().names(), "variables on " + kind.word() + " data");
                continue;
            }
            LearnerException ex = assertThrows(LearnerException.class, () -> run(input, RunContext.unlimited(1)),
                    "must reject " + kind.word() + " data");
            assertTrue(ex.getMessage().contains(kind.word()), "message should name the data kind: " + ex.getMessage());
        }
    }

    @Test
    void treatsMissingValuesAsItDeclares() {
        LearnerInput holed = LearnerInput.of(withMissingCell(acceptedInput().data()));
        if (description().missingValues() == MissingValues.REJECTS) {
            assertThrows(LearnerException.class, () -> run(holed, RunContext.unlimited(1)),
                    "declares that it rejects missing values");
        } else {
            Estimate e = run(holed, RunContext.unlimited(1));
            assertEquals(description().returns(), e.graphClass(),
                    "declares that it handles missing values (" + description().missingValues() + ")");
            assertEquals(holed.variableNames(), e.graph().names(), "variables of the estimate");
        }
    }

    /** The same data with the first cell of the first column missing. */
    private static DataSet withMissingCell(DataSet data) {
        DataSet.Builder b = DataSet.builder(data.rows());
        for (int j = 0; j < data.columns(); j++) {
            if (data.isDiscrete(j)) {
                int[] codes = data.discrete(j).clone();
                if (j == 0) {
                    codes[0] = DataSet.MISSING_CODE;
                }
                b.discrete(data.variable(j), codes);
            } else {
                double[] values = data.continuous(j).clone();
                if (j == 0) {
                    values[0] = Double.NaN;
                }
                b.continuous(data.variable(j).name(), values);
            }
        }
        return b.build();
    }

    /**
     * Knowledge between the first two variables of an accepted input: forbidden both ways, the
     * pair stays apart; required one way, the estimate has that edge, tail first (Meek 1995 and
     * Zhang 2008 for how knowledge constrains CPDAGs and PAGs; common practice). A learner that
     * declares no kind of knowledge must still run when some is given and return its class.
     */
    @Test
    void honoursTheKnowledgeItDeclares() {
        LearnerInput input = acceptedInput();
        String a = input.variableNames().get(0);
        String b = input.variableNames().get(1);
        Set<KnowledgeUse> uses = description().knowledge();
        Estimate apart = learner().learn(input, Knowledge.builder().forbid(a, b).forbid(b, a).build(),
                parameterValues(), RunContext.unlimited(3));
        assertEquals(description().returns(), apart.graphClass(), "declared graph class with knowledge");
        assertEquals(input.variableNames(), apart.graph().names(), "variables of the estimate with knowledge");
        if (uses.contains(KnowledgeUse.FORBIDDEN_EDGES)) {
            assertFalse(apart.graph().adjacent(0, 1), "declares forbidden edges, yet joined " + a + " and " + b
                    + " when both directions were forbidden: " + apart.graph().edge(0, 1));
        }
        if (uses.contains(KnowledgeUse.REQUIRED_EDGES)) {
            Estimate joined = learner().learn(input, Knowledge.builder().require(a, b).build(), parameterValues(),
                    RunContext.unlimited(3));
            assertTrue(joined.graph().hasDirected(0, 1), "declares required edges, yet has no " + a + " -> " + b
                    + " when it was required: " + joined.graph().edge(0, 1));
        }
    }

    @Test
    void usesTheOracleExactlyWhenItSaysSo() {
        Graph dag = truth();
        CovarianceMatrix population = null;
        if (description().oracle() == OracleUse.COVARIANCE) {
            population = data(DataKind.CONTINUOUS, 9).covariance();
        }
        LearnerInput oracle = LearnerInput.of(new Oracle(dag, population));
        if (description().oracle() == OracleUse.NONE) {
            assertThrows(LearnerException.class, () -> run(oracle, RunContext.unlimited(1)),
                    "declares that it cannot use the oracle");
        } else {
            Estimate e = run(oracle, RunContext.unlimited(1));
            assertEquals(oracle.variableNames(), e.graph().names());
            assertEquals(description().returns(), e.graphClass());
        }
    }
}
