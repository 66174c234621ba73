package dev.touchstone.core.graph;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class EdgeMarkClassTest {

    @Test
    void edgeFactoriesAndQuestions() {
        Edge d = Edge.directed(3, 1);
        assertEquals(Mark.TAIL, d.markAt(3));
        assertEquals(Mark.ARROW, d.markAt(1));
        assertTrue(d.isDirected());
        assertTrue(d.isDirectedFrom(3));
        assertFalse(d.isDirectedFrom(1));
        assertEquals(new Edge(1, 3, Mark.ARROW, Mark.TAIL), d.canonical());
        assertEquals(1, d.other(3));
        assertTrue(Edge.undirected(0, 1).isUndirected());
        assertTrue(Edge.bidirected(0, 1).isBidirected());
        assertFalse(new Edge(0, 1, Mark.CIRCLE, Mark.ARROW).isDirected());
    }

    @Test
    void tailOfADirectedEdgeWhicheverEndIsStoredFirst() {
        assertEquals(3, Edge.directed(3, 5).tail());
        assertEquals(5, Edge.directed(5, 3).tail());
        assertEquals(5, new Edge(3, 5, Mark.ARROW, Mark.TAIL).tail());
        assertEquals(3, new Edge(3, 5, Mark.TAIL, Mark.ARROW).tail());
    }

    @Test
    void edgeRefusesBadEnds() {
        assertTrue(assertThrows(IllegalArgumentException.class, () -> Edge.directed(2, 2))
                .getMessage().contains("2 twice"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> Edge.directed(-1, 2))
                .getMessage().contains("non-negative"));
        assertThrows(NullPointerException.class, () -> new Edge(0, 1, null, Mark.TAIL));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> Edge.directed(0, 1).markAt(5))
                .getMessage().contains("variable 5 is not an end"));
        assertThrows(IllegalArgumentException.class, () -> Edge.directed(0, 1).other(5));
    }

    @Test
    void markWordsRoundTrip() {
        for (Mark m : Mark.values()) {
            assertEquals(m, Mark.parse(m.word()));
            assertEquals(m, Mark.parse(" " + m.word().toUpperCase() + " "));
        }
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Mark.parse("dot"));
        assertEquals("unknown mark 'dot' (allowed: tail, arrow, circle)", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Mark.parse(null));
    }

    @Test
    void graphClassWordsRoundTrip() {
        for (GraphClass c : GraphClass.values()) {
            assertEquals(c, GraphClass.parse(c.word()));
        }
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> GraphClass.parse("tree"));
        assertEquals("unknown graph class 'tree' (allowed: dag, cpdag, mag, pag)", e.getMessage());
    }

    @Test
    void graphClassMarkCombinations() {
        Edge directed = Edge.directed(0, 1);
        Edge undirected = Edge.undirected(0, 1);
        Edge bidirected = Edge.bidirected(0, 1);
        Edge partial = new Edge(0, 1, Mark.CIRCLE, Mark.ARROW);
        // DAG: only directed edges; CPDAG adds undirected; MAG adds bidirected; PAG adds circles
        // (definitions as in Meek 1995, Richardson and Spirtes 2002, Zhang 2008).
        assertTrue(GraphClass.DAG.allows(directed));
        assertFalse(GraphClass.DAG.allows(undirected));
        assertFalse(GraphClass.DAG.allows(bidirected));
        assertTrue(GraphClass.CPDAG.allows(undirected));
        assertFalse(GraphClass.CPDAG.allows(partial));
        assertTrue(GraphClass.MAG.allows(bidirected));
        assertFalse(GraphClass.MAG.allows(partial));
        assertTrue(GraphClass.PAG.allows(partial));
        assertTrue(GraphClass.PAG.allows(new Edge(0, 1, Mark.CIRCLE, Mark.CIRCLE)));
    }
}
