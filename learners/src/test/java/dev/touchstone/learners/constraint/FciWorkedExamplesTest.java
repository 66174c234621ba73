package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.LatentProjection;
import dev.touchstone.core.graph.algorithms.Pags;
import dev.touchstone.core.learner.Estimate;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** FCI with the d-separation oracle on examples worked out by hand, each reasoned in its comment. */
class FciWorkedExamplesTest {

    /** A DAG over the names (hidden ones flagged) with edges written "A->B" separated by spaces. */
    static Graph dag(String names, String hidden, String edges) {
        List<String> list = Arrays.asList(names.split(" "));
        MutableGraph g = Graph.builder(list);
        for (String h : hidden.isEmpty() ? new String[0] : hidden.split(" ")) {
            g.setHidden(list.indexOf(h), true);
        }
        for (String e : edges.split(" ")) {
            String[] ends = e.split("->");
            g.addDirected(list.indexOf(ends[0]), list.indexOf(ends[1]));
        }
        return g.freeze();
    }

    private static void assertEdge(Graph g, String a, Mark atA, Mark atB, String b) {
        int x = g.index(a);
        int y = g.index(b);
        assertTrue(g.adjacent(x, y), a + " and " + b + " must be adjacent in " + g);
        assertEquals(atA, g.markAt(x, y), "mark at " + a + " on " + a + "-" + b + " in " + g);
        assertEquals(atB, g.markAt(y, x), "mark at " + b + " on " + a + "-" + b + " in " + g);
    }

    @Test
    @DisplayName("a hidden common cause of B and C: A o-> B <-> C <-o D (the classic FCI example; Spirtes, Glymour "
            + "and Scheines 2000, ch. 6, from memory; reasoned out)")
    void latentCommonCause() {
        // A -> B <- L -> C <- D, L hidden. A ⊥ C and B ⊥ D marginally (B, C are colliders), so the
        // unshielded triples A-B-C and B-C-D are colliders with empty separating sets: arrowheads at
        // B and C from both sides, B <-> C. No rule decides the marks at A and D (A -> B and A <-> B
        // are both consistent), so they stay circles. PC, assuming no hidden variables, would have to
        // pick a direction for B - C; FCI says neither causes the other.
        Graph truth = dag("A B C D L", "L", "A->B L->B L->C D->C");
        Graph g = FciOracleTest.run(truth, Map.of(), 1).graph();
        assertEquals(3, g.edgeCount());
        assertEdge(g, "A", Mark.CIRCLE, Mark.ARROW, "B");
        assertEdge(g, "B", Mark.ARROW, Mark.ARROW, "C");
        assertEdge(g, "D", Mark.CIRCLE, Mark.ARROW, "C");
        assertEquals(Pags.of(truth), g);
    }

    @Test
    @DisplayName("a Y-structure orients C --> D, a confounded C and D do not (Mani, Cooper and Spirtes 2006, from "
            + "memory; reasoned out)")
    void yStructure() {
        // A -> C <- B, C -> D, nothing hidden: A ⊥ B makes C an unshielded collider; then R1 on
        // A *-> C o-* D (A, D not adjacent) gives C --> D: C is a cause of D and no hidden variable
        // confounds them, the one tail FCI can give without a known order.
        Graph y = dag("A B C D", "", "A->C B->C C->D");
        Graph g = FciOracleTest.run(y, Map.of(), 1).graph();
        assertEdge(g, "A", Mark.CIRCLE, Mark.ARROW, "C");
        assertEdge(g, "B", Mark.CIRCLE, Mark.ARROW, "C");
        assertEdge(g, "C", Mark.TAIL, Mark.ARROW, "D");
        assertEquals(3, g.edgeCount());
        // Replace C -> D by a hidden common cause H of C and D: now A ⊥ D too (C is a collider on
        // A -> C <- H -> D), so A-C-D is an unshielded collider and the edge becomes D o-> C.
        Graph confounded = dag("A B C D H", "H", "A->C B->C H->C H->D");
        Graph h = FciOracleTest.run(confounded, Map.of(), 1).graph();
        assertEdge(h, "D", Mark.CIRCLE, Mark.ARROW, "C");
        assertEdge(h, "A", Mark.CIRCLE, Mark.ARROW, "C");
        assertEquals(Pags.of(confounded), h);
    }

    /**
     * An edge that survives the PC-style adjacency search and only the Possible-D-Sep step removes.
     * Constructed for this test (reasoned out below; the phenomenon is the one Spirtes, Glymour and
     * Scheines 2000, §6.7 introduce Possible-D-Sep for). The DAG: b -> x, a -> y, v -> b, with hidden
     * common causes L1 of x and a, L2 of a and v, L3 of b and y. Its MAG: x <-> a, a <-> v, v -> b,
     * b <-> y, b -> x, a -> y.
     *
     * <p>Separating x from y: the path x <-> a -> y needs a in the set, x <- b <-> y needs b; but then
     * x <-> a <-> v -> b <-> y is open (a and b colliders in the set, v a non-collider) unless v is in
     * the set too. So every separating set contains v, and v is adjacent to neither x nor y: the
     * adjacency search, which only conditions on subsets of adj(x) = {a, b, y} and adj(y) = {a, b, x},
     * keeps x - y. After R0, x *-> a <-* v is a collider (x and v are separated by {b}), so v is in
     * Possible-D-Sep(x), and {a, b, v} removes the edge.
     */
    @Test
    @DisplayName("Possible-D-Sep removes an edge every separating set of which contains a vertex adjacent to neither end "
            + "(constructed and reasoned out; Spirtes, Glymour and Scheines 2000, §6.7)")
    void possibleDsepRemovesASpuriousEdge() {
        Graph truth = dag("x y a b v L1 L2 L3", "L1 L2 L3",
                "b->x a->y v->b L1->x L1->a L2->a L2->v L3->b L3->y");
        Graph mag = LatentProjection.mag(truth);
        int x = mag.index("x");
        int y = mag.index("y");
        assertFalse(mag.adjacent(x, y), "the MAG has no x - y edge: " + mag);

        Estimate without = FciOracleTest.run(truth, Map.of("possible_dsep", false), 1);
        assertTrue(without.graph().adjacent(x, y), "the PC-style skeleton keeps x - y: " + without.graph());

        Estimate with = FciOracleTest.run(truth, Map.of(), 1);
        Graph g = with.graph();
        assertFalse(g.adjacent(x, y), "Possible-D-Sep removes x - y: " + g);
        assertEquals(1.0, with.extras().get("possible_dsep_removed"));
        // Marks reasoned from the separating sets: colliders at a (x, v), x (a, b), b (v, y), y (a, b);
        // then R1 gives a --> y (x *-> a o-* y, x and y not adjacent) and b --> x (v *-> b o-* x).
        assertEdge(g, "x", Mark.ARROW, Mark.ARROW, "a");
        assertEdge(g, "b", Mark.ARROW, Mark.ARROW, "y");
        assertEdge(g, "a", Mark.TAIL, Mark.ARROW, "y");
        assertEdge(g, "b", Mark.TAIL, Mark.ARROW, "x");
        assertEquals(Pags.of(truth), g);
        // Bounding the walk to length 1 makes Possible-D-Sep the neighbourhood: the edge stays.
        assertTrue(FciOracleTest.run(truth, Map.of("possible_dsep_length", 1), 1).graph().adjacent(x, y));
    }
}
