package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The correctness theorem of PC: with a d-separation oracle (faithfulness holds by
 * construction) PC returns exactly the CPDAG of the true DAG (Spirtes, Glymour and Scheines
 * 2000, Theorem 5.1; Meek 1995 for the completeness of the orientation rules). It holds for
 * the order-independent skeleton (Colombo and Maathuis 2014, Theorem 2) and the
 * conservative and majority rules, whose triples are never ambiguous under the oracle
 * (Ramsey, Zhang and Spirtes 2006).
 */
class PcOracleTest {

    static final PcLearner PC = new PcLearner();

    static Estimate run(Graph dag, Map<String, Object> raw, int threads) {
        ParameterValues values = ParameterValues.resolve("learner pc", PC.description().parameters(), raw);
        return PC.learn(LearnerInput.of(new Oracle(dag, null)), Knowledge.none(), values,
                RunContext.of(5, null, threads));
    }

    @Test
    @DisplayName("PC, order-independent PC, conservative and majority PC return the true CPDAG, 320 random DAGs")
    void oracleReturnsTheTrueCpdag() {
        int checked = 0;
        long tests = 0;
        for (int i = 0; i < 320; i++) {
            Graph dag = OracleSkeletonTest.truth(i);
            Graph cpdag = Cpdags.of(dag);
            Map<String, Object>[] variants = variants(i);
            for (Map<String, Object> raw : variants) {
                Estimate e = run(dag, raw, 1 + i % 2);
                assertTrue(e.graph().sameEdges(cpdag), "DAG " + i + " " + raw + "\n truth " + cpdag
                        + "\n estimate " + e.graph());
                assertEquals(0.0, e.extras().get("ambiguous_triples"));
                checked++;
            }
        }
        assertTrue(checked >= 960 + 100);
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object>[] variants(int i) {
        // The majority rule enumerates the same sets as the conservative one; every third DAG keeps the suite fast.
        Map<String, Object> conservative = Map.of("skeleton", i % 2 == 0 ? "order-independent" : "sequential",
                "colliders", "conservative");
        Map<String, Object> majority = Map.of("colliders", "majority", "conflicts", "drop-both");
        return i % 3 == 0
                ? new Map[] {Map.of("skeleton", "sequential"), Map.of("skeleton", "order-independent"), conservative, majority}
                : new Map[] {Map.of("skeleton", "sequential"), Map.of("skeleton", "order-independent"), conservative};
    }

    @Test
    @DisplayName("Pearl's sprinkler network: season—sprinkler, season—rain, sprinkler → wet ← rain, wet → slippery (Pearl 2000)")
    void sprinkler() {
        Graph dag = Graph.builder(java.util.List.of("season", "sprinkler", "rain", "wet", "slippery"))
                .addDirected(0, 1).addDirected(0, 2).addDirected(1, 3).addDirected(2, 3).addDirected(3, 4).freeze();
        Graph e = run(dag, Map.of(), 1).graph();
        assertTrue(e.hasUndirected(0, 1) && e.hasUndirected(0, 2));
        assertTrue(e.hasDirected(1, 3) && e.hasDirected(2, 3) && e.hasDirected(3, 4));
        assertEquals(5, e.edgeCount());
    }
}
