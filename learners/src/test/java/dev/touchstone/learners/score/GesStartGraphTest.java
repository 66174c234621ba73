package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** GES from a given start graph ({@code LearnerInput.withStart}): both phases begin at its class. */
class GesStartGraphTest {

    private static final GesLearner GES = new GesLearner();

    private static Estimate run(LearnerInput input, Knowledge k) {
        ParameterValues values = ParameterValues.resolve("test", GES.description().parameters(), Map.of());
        return GES.learn(input, k, values, RunContext.unlimited(1));
    }

    private static Oracle oracle(Graph dag, long seed) {
        return new Oracle(dag, PopulationCovariance.of(dag, 0.5, 2.0, seed));
    }

    @Test
    @DisplayName("GES declares that it takes a start graph")
    void declaresIt() {
        assertTrue(GES.description().takesStartGraph());
    }

    /**
     * At the true class no Insert and no Delete raises a locally consistent score in the
     * large-sample limit (Chickering 2002, lemmas 9 and 10 with theorem 4, from memory), and the
     * oracle's BIC stands for 10⁹ rows: started there, GES makes no move.
     */
    @Test
    @DisplayName("with the oracle, started from the true CPDAG GES makes no move and returns it (60 seeded DAGs)")
    void staysAtTheTrueClass() {
        for (long seed = 1; seed <= 60; seed++) {
            Graph dag = RandomDags.erdosRenyi(4 + (int) (seed % 12), 1.0 + (seed % 3) * 0.5, 900 + seed);
            Graph cpdag = Cpdags.of(dag);
            Estimate e = run(LearnerInput.of(oracle(dag, seed)).withStart(cpdag), Knowledge.none());
            assertEquals(cpdag, e.graph(), "seed " + seed);
            assertEquals(0.0, e.extras().get("forward-moves"), "seed " + seed);
            assertEquals(0.0, e.extras().get("backward-moves"), "seed " + seed);
        }
    }

    /**
     * A complete DAG is an independence map of every distribution, and the backward phase from an
     * independence map reaches the true class with a consistent score (Chickering 2002, the second
     * phase's guarantee, from memory). So from a complete DAG the forward phase has nothing to
     * insert and the deletions alone must reach the truth: the start graph is really used.
     */
    @Test
    @DisplayName("with the oracle, started from a complete DAG GES only deletes and reaches the true CPDAG (30 seeded DAGs)")
    void deletesDownFromACompleteDag() {
        for (long seed = 1; seed <= 30; seed++) {
            int p = 4 + (int) (seed % 7);
            Graph dag = RandomDags.erdosRenyi(p, 1.5, 700 + seed);
            MutableGraph complete = Graph.builder(dag.names());
            for (int a = 0; a < p; a++) {
                for (int b = a + 1; b < p; b++) {
                    complete.addDirected(a, b);
                }
            }
            Estimate e = run(LearnerInput.of(oracle(dag, seed)).withStart(complete.freeze()), Knowledge.none());
            assertEquals(Cpdags.of(dag), e.graph(), "seed " + seed);
            assertEquals(0.0, e.extras().get("forward-moves"), "seed " + seed);
            assertTrue(e.extras().get("backward-moves") >= p * (p - 1) / 2.0 - dag.edgeCount(), "seed " + seed);
        }
    }

    @Test
    @DisplayName("from an empty start graph GES returns exactly what it returns with none (data, with and without knowledge)")
    void emptyStartIsThePlainSearch() {
        for (long seed = 1; seed <= 6; seed++) {
            DataSet data = ScoreData.linearGaussian(25, 2.0, 1000, 60 + seed);
            List<String> v = data.names();
            Knowledge k = seed % 2 == 0 ? Knowledge.none()
                    : Knowledge.builder().require(v.get(0), v.get(5)).forbid(v.get(3), v.get(4)).build();
            Estimate plain = run(LearnerInput.of(data), k);
            Estimate fromEmpty = run(LearnerInput.of(data).withStart(Graph.empty(v)), k);
            assertEquals(plain.graph(), fromEmpty.graph(), "seed " + seed);
            assertEquals(plain.extras(), fromEmpty.extras(), "seed " + seed);
        }
    }

    @Test
    @DisplayName("a start graph the knowledge contradicts is refused with one line naming the edge")
    void contradictingStartIsRefused() {
        Graph dag = RandomDags.erdosRenyi(4, 1.0, 5);
        MutableGraph start = Graph.builder(dag.names());
        start.addDirected(0, 1);
        Knowledge k = Knowledge.builder().forbid(dag.name(0), dag.name(1)).build();
        String m = assertThrows(LearnerException.class,
                () -> run(LearnerInput.of(oracle(dag, 1)).withStart(start.freeze()), k)).getMessage();
        assertEquals("the start graph has " + dag.name(0) + " -> " + dag.name(1) + ", which the knowledge forbids", m);
    }
}
