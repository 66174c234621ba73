package dev.touchstone.metrics.truth;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
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
    @DisplayName("default truths: DAG for a DAG, CPDAG for a CPDAG (PAG with hidden variables), PAG for a PAG")
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
        // CPDAG of Pearl's sprinkler network (Pearl 2000, ch. 1): season—sprinkler, season—rain undirected; sprinkler → wet ← rain; wet → slippery
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
    @DisplayName("hidden variables: a DAG or CPDAG truth is refused with the hidden names")
    void hiddenRefusals() {
        Graph dag = sprinkler().withHidden(Set.of("season"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> TruthSelection.as(dag, GraphClass.CPDAG));
        assertTrue(e.getMessage().contains("season"), e.getMessage());
    }

    @Test
    @DisplayName("hidden confounder L → A, L → B, A → C: DAG learners are scored against the MAG (A ↔ B, A → C; Richardson and Spirtes 2002), CPDAG learners against the PAG (B o-o A o-o C; Zhang 2008)")
    void hiddenConfounder() {
        List<String> names = List.of("L", "A", "B", "C");
        Graph dag = Graph.builder(names).addDirected(0, 1).addDirected(0, 2).addDirected(1, 3).freeze()
                .withHidden(Set.of("L"));
        List<String> observed = List.of("A", "B", "C");

        // MAG: L induces A ↔ B (neither is an ancestor of the other); A → C stays. Worked by hand.
        Truth mag = TruthSelection.forEstimate(dag, GraphClass.DAG);
        assertEquals(GraphClass.MAG, mag.referenceClass());
        assertEquals(Graph.builder(observed).addBidirected(0, 1).addDirected(0, 2).freeze(), mag.reference());
        assertNull(mag.dag());
        Graph dagEstimate = Graph.builder(observed).addDirected(0, 1).addDirected(0, 2).freeze();
        Map<String, Double> m = Scorer.scoreAll(mag, dagEstimate, GraphClass.DAG);
        // {A,B}: A → B against A ↔ B differs at A; {A,C} agrees: SHD 1. A → B puts its tail where the MAG has an
        // arrowhead: reversed (Zheng et al. 2018 rule, extended to marks as in docs/dev/metrics.md); A → C a hit: TPR 1/2.
        assertEquals(1.0, m.get("shd"));
        assertEquals(0.5, m.get("directed_tpr"));
        assertNull(m.get("sid"));   // SID is defined against a DAG over the same variables

        // PAG: no arrowhead is forced (B ↔ A → C has no collider at A; nothing else to orient): B o-o A o-o C.
        Truth pag = TruthSelection.forEstimate(dag, GraphClass.CPDAG);
        assertEquals(GraphClass.PAG, pag.referenceClass());
        MutableGraph expected = Graph.builder(observed);
        expected.addEdge(0, 1, Mark.CIRCLE, Mark.CIRCLE);
        expected.addEdge(0, 2, Mark.CIRCLE, Mark.CIRCLE);
        assertEquals(expected.freeze(), pag.reference());
        Graph cpdagEstimate = Graph.builder(observed).addUndirected(0, 1).addUndirected(0, 2).freeze();
        Map<String, Double> c = Scorer.scoreAll(pag, cpdagEstimate, GraphClass.CPDAG);
        assertEquals(2.0, c.get("shd"));            // both pairs: tails against circles
        assertEquals(1.0, c.get("adjacency_f1"));
        assertNull(c.get("orientation_precision")); // no arrowheads on either side
    }

    @Test
    @DisplayName("nothing hidden: the MAG is the DAG itself (Richardson and Spirtes 2002); the PAG has the CPDAG's skeleton")
    void magWithoutHidden() {
        Truth t = TruthSelection.as(sprinkler(), GraphClass.MAG);
        assertEquals(sprinkler(), t.reference());
        assertEquals(sprinkler(), t.dag());
        Truth p = TruthSelection.forEstimate(sprinkler(), GraphClass.PAG);
        Graph cpdag = TruthSelection.as(sprinkler(), GraphClass.CPDAG).reference();
        for (int a = 0; a < NAMES.size(); a++) {
            for (int b = 0; b < NAMES.size(); b++) {
                assertEquals(cpdag.adjacent(a, b), p.reference().adjacent(a, b));
            }
        }
        // sprinkler → wet ← rain is an unshielded collider: arrowheads at wet in the PAG too
        assertEquals(Mark.ARROW, p.reference().markAt(3, 1));
        assertEquals(Mark.ARROW, p.reference().markAt(3, 2));
    }

    @Test
    @DisplayName("a truth that is not a DAG is refused")
    void notADag() {
        Graph cyclic = Graph.builder(List.of("a", "b")).addUndirected(0, 1).freeze();
        assertThrows(IllegalArgumentException.class, () -> TruthSelection.as(cyclic, GraphClass.DAG));
        assertNull(Truth.of(cyclic, GraphClass.CPDAG).dag());
    }
}
