package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Pags;
import dev.touchstone.core.learner.Estimate;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

/**
 * A truth worked by hand in which RFCI's unshielded-triple check (Colombo et al. 2012, Annals of
 * Statistics 40, Algorithm 4.4; from memory) removes an edge the PC adjacency search cannot.
 *
 * <p>Observed x, y, a, b, v, k; hidden l1 → x, a; l2 → a, v; l3 → b, y; and b → x, a → y, v → b,
 * with k a child of a, b, v and y. In the MAG: x ↔ a, a ↔ v, b ↔ y, b → x, a → y, v → b, and
 * a, b, v, y → k. The pair x, y is separated by {a, b, v} only: {a, b} leaves x ↔ a ↔ v → b ↔ y
 * open (a and b colliders given, v not), and every set with k opens a → k ← b. v is adjacent to
 * neither x nor y, so the PC search keeps x – y (as FCI does, until Possible-D-Sep). The pair x, k
 * is separated by {a, b, v} (a blocks x ↔ a → k and x ↔ a → y → k, b blocks x ← b → k and
 * x ← b ↔ y → k, and with a given, v blocks x ↔ a ↔ v → k) and by no subset of adj(x) = {a, b, y},
 * so that is the set found from k's side. y is outside it, so the triple x – y – k is a collider
 * candidate and the check tests x ⫫ y | {a, b, v}: independent, so x – y goes. FCI reaches the same
 * skeleton through Possible-D-Sep; both then return the true PAG.
 */
class RfciWorkedExampleTest {

    static Graph truth() {
        MutableGraph g = Graph.builder(List.of("x", "y", "a", "b", "v", "k", "l1", "l2", "l3"));
        int x = 0, y = 1, a = 2, b = 3, v = 4, k = 5, l1 = 6, l2 = 7, l3 = 8;
        g.setHidden(l1, true).setHidden(l2, true).setHidden(l3, true);
        g.addDirected(l1, x).addDirected(l1, a).addDirected(l2, a).addDirected(l2, v).addDirected(l3, b)
                .addDirected(l3, y).addDirected(b, x).addDirected(a, y).addDirected(v, b)
                .addDirected(a, k).addDirected(b, k).addDirected(v, k).addDirected(y, k);
        return g.freeze();
    }

    @Test
    @DisplayName("the triple check removes x - y, which the PC search keeps, and RFCI returns the true PAG, as FCI")
    void tripleCheckRemovesTheSpuriousEdge() {
        Graph dag = truth();
        Estimate rfci = RfciOracleTest.run(dag, Map.of(), 1);
        assertEquals(1.0, rfci.extras().get("triple_check_removed"));
        assertEquals(Pags.of(dag), rfci.graph());
        assertEquals(FciOracleTest.run(dag, Map.of(), 1).graph(), rfci.graph());
        Graph pcSkeleton = FciOracleTest.run(dag, Map.of("possible_dsep", false), 1).graph();
        assertNotEquals(null, pcSkeleton.edge(pcSkeleton.index("x"), pcSkeleton.index("y")),
                "the PC search keeps x - y");
    }
}
