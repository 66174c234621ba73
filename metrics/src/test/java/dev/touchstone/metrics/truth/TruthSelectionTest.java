package dev.touchstone.metrics.truth;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.scoring.Scorer;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class TruthSelectionTest {

    /** Pearl's sprinkler network (Pearl 2000, ch. 1). */
    private static final List<String> NAMES = List.of("season", "sprinkler", "rain", "wet", "slippery");

    private static Graph sprinkler() {
        return Graph.builder(NAMES).addDirected(0, 1).addDirected(0, 2).addDirected(1, 3).addDirected(2, 3)
                .addDirected(3, 4).freeze();
    }

    @Test
    @DisplayName("default classes follow the table of design §3")
    void defaults() {
        assertEquals(GraphClass.DAG, TruthSelection.defaultClass(GraphClass.DAG, false));
        assertEquals(GraphClass.MAG, TruthSelection.defaultClass(GraphClass.DAG, true));
        assertEquals(GraphClass.CPDAG, TruthSelection.defaultClass(GraphClass.CPDAG, false));
        assertEquals(GraphClass.PAG, TruthSelection.defaultClass(GraphClass.CPDAG, true));
        assertEquals(GraphClass.PAG, TruthSelection.defaultClass(GraphClass.PAG, false));
        assertEquals(GraphClass.PAG, TruthSelection.defaultClass(GraphClass.PAG, true));
    }

    @Test
    @DisplayName("a CPDAG learner that returns the sprinkler CPDAG (Pearl 2000, ch. 1) is exact against its own class, not charged for unknowable orientations")
    void cpdagLearnerScoredAgainstCpdag() {
        // CPDAG from checks.md: season—sprinkler, season—rain undirected; sprinkler → wet ← rain; wet → slippery
        Graph cpdag = Graph.builder(NAMES).addUndirected(0, 1).addUndirected(0, 2).addDirected(1, 3).addDirected(2, 3)
                .addDirected(3, 4).freeze();
        Truth t = TruthSelection.forEstimate(sprinkler(), GraphClass.CPDAG);
        assertEquals(GraphClass.CPDAG, t.referenceClass());
        assertEquals(cpdag, t.reference());
        Map<String, Double> m = Scorer.scoreAll(t, cpdag, GraphClass.CPDAG);
        assertEquals(0.0, m.get("shd"));
        assertEquals(1.0, m.get("exact"));
        // against the DAG instead (score_against: dag) the same estimate differs on the two undirected pairs
        Map<String, Double> asDag = Scorer.scoreAll(TruthSelection.as(sprinkler(), GraphClass.DAG), cpdag, GraphClass.CPDAG);
        assertEquals(2.0, asDag.get("shd"));
        // the SID bounds use the generating DAG either way: the true DAG is in the class, so the lower bound is 0
        assertEquals(0.0, m.get("sid_lower"));
    }

    @Test
    @DisplayName("hidden variables: a DAG or CPDAG truth is refused with the hidden names; MAG/PAG are not available yet")
    void hidden() {
        Graph dag = sprinkler().withHidden(Set.of("season"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> TruthSelection.as(dag, GraphClass.CPDAG));
        assertTrue(e.getMessage().contains("season"), e.getMessage());
        assertThrows(UnsupportedOperationException.class, () -> TruthSelection.forEstimate(dag, GraphClass.DAG));
    }

    @Test
    @DisplayName("nothing hidden: the MAG is the DAG itself (Richardson and Spirtes 2002)")
    void magWithoutHidden() {
        Truth t = TruthSelection.as(sprinkler(), GraphClass.MAG);
        assertEquals(sprinkler(), t.reference());
        assertEquals(sprinkler(), t.dag());
    }

    @Test
    @DisplayName("a truth that is not a DAG is refused")
    void notADag() {
        Graph cyclic = Graph.builder(List.of("a", "b")).addUndirected(0, 1).freeze();
        assertThrows(IllegalArgumentException.class, () -> TruthSelection.as(cyclic, GraphClass.DAG));
        assertNull(Truth.of(cyclic, GraphClass.CPDAG).dag());
    }
}
