package dev.touchstone.core.graph;

import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;

import dev.touchstone.core.random.Seeds;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GraphTest {

    private static final List<String> NAMES = List.of("A", "B", "C", "D", "E");

    /** A → B, B ∘→ C, C ↔ D, D — E, A ∘–∘ E: one edge of every kind. */
    private static Graph mixed() {
        MutableGraph g = Graph.builder(NAMES);
        g.addDirected(0, 1);
        g.addEdge(1, 2, Mark.CIRCLE, Mark.ARROW);
        g.addBidirected(2, 3);
        g.addUndirected(3, 4);
        g.addEdge(4, 0, Mark.CIRCLE, Mark.CIRCLE);
        return g.freeze();
    }

    @Test
    void namesAndIndices() {
        Graph g = mixed();
        assertEquals(5, g.size());
        assertEquals(NAMES, g.names());
        assertEquals("C", g.name(2));
        assertEquals(3, g.index("D"));
        assertEquals(-1, g.indexOf("Z"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> g.index("Z"));
        assertTrue(e.getMessage().contains("'Z'"), e.getMessage());
    }

    @Test
    void adjacencyAndMarksSeenFromBothEnds() {
        Graph g = mixed();
        assertEquals(5, g.edgeCount());
        assertTrue(g.adjacent(0, 1));
        assertTrue(g.adjacent(1, 0));
        assertFalse(g.adjacent(0, 2));
        assertEquals(Mark.TAIL, g.markAt(0, 1));
        assertEquals(Mark.ARROW, g.markAt(1, 0));
        assertEquals(Mark.CIRCLE, g.markAt(1, 2));
        assertEquals(Mark.ARROW, g.markAt(2, 1));
        assertNull(g.markAt(0, 2));
        assertEquals(new Edge(2, 1, Mark.ARROW, Mark.CIRCLE), g.edge(2, 1));
        assertEquals(new Edge(1, 2, Mark.CIRCLE, Mark.ARROW), g.edge(1, 2));
        assertNull(g.edge(0, 3));
        assertTrue(g.hasDirected(0, 1));
        assertFalse(g.hasDirected(1, 0));
        assertFalse(g.hasDirected(1, 2));
        assertTrue(g.hasUndirected(3, 4));
        assertTrue(g.hasUndirected(4, 3));
        assertFalse(g.hasUndirected(2, 3));
    }

    @Test
    void neighbourhoodsBySortedIndex() {
        Graph g = mixed();
        assertEquals(2, g.degree(0));
        assertEquals(1, g.neighbour(0, 0));
        assertEquals(4, g.neighbour(0, 1));
        assertEquals(Mark.TAIL, g.markHere(0, 0));
        assertEquals(Mark.ARROW, g.markThere(0, 0));
        assertEquals(Mark.CIRCLE, g.markHere(0, 1));
        assertEquals(Mark.CIRCLE, g.markThere(0, 1));
        assertArrayEquals(new int[] {1, 4}, g.neighbours(0));
        assertArrayEquals(new int[] {0}, g.parents(1));
        assertArrayEquals(new int[] {1}, g.children(0));
        assertArrayEquals(new int[] {}, g.parents(2));
        assertArrayEquals(new int[] {3}, g.spouses(2));
        assertArrayEquals(new int[] {3}, g.undirectedNeighbours(4));
        assertFalse(g.isFullyDirected());
    }

    @Test
    void edgesAreCanonicalAndSorted() {
        Graph g = mixed();
        List<Edge> edges = g.edges();
        assertEquals(List.of(
                new Edge(0, 1, Mark.TAIL, Mark.ARROW),
                new Edge(0, 4, Mark.CIRCLE, Mark.CIRCLE),
                new Edge(1, 2, Mark.CIRCLE, Mark.ARROW),
                new Edge(2, 3, Mark.ARROW, Mark.ARROW),
                new Edge(3, 4, Mark.TAIL, Mark.TAIL)), edges);
        assertThrows(UnsupportedOperationException.class, () -> edges.add(Edge.directed(0, 3)));
        assertEquals("A --> B; A o-o E; B o-> C; C <-> D; D --- E", g.toString());
    }

    @Test
    void freezeThawRoundTripKeepsEverything() {
        Graph g = mixed().withHidden(Set.of("C"));
        assertTrue(g.isHidden(2));
        assertTrue(g.hasHidden());
        assertEquals(Set.of("C"), g.hiddenNames());
        assertArrayEquals(new int[] {0, 1, 3, 4}, g.observedIndices());
        Graph back = g.toMutable().freeze();
        assertEquals(g, back);
        assertEquals(g.hashCode(), back.hashCode());
        assertTrue(back.isHidden(2));
        MutableGraph copy = new MutableGraph(g.toMutable());
        assertEquals(g, copy.freeze());
    }

    @Test
    void equalityIgnoresInsertionOrderButNotMarksOrHiddenFlags() {
        MutableGraph a = Graph.builder(NAMES);
        a.addDirected(0, 1).addUndirected(2, 3);
        MutableGraph b = Graph.builder(NAMES);
        b.addUndirected(3, 2).addEdge(1, 0, Mark.ARROW, Mark.TAIL);
        assertEquals(a.freeze(), b.freeze());
        assertEquals(a.freeze().hashCode(), b.freeze().hashCode());

        b.setMark(1, 0, Mark.CIRCLE);
        assertNotEquals(a.freeze(), b.freeze());

        Graph hidden = a.freeze().withHidden(Set.of("E"));
        assertNotEquals(a.freeze(), hidden);
        assertTrue(a.freeze().sameEdges(hidden));

        Graph otherNames = Graph.builder(List.of("A", "B", "C", "D", "F")).addDirected(0, 1).addUndirected(2, 3).freeze();
        assertNotEquals(a.freeze(), otherNames);
        assertFalse(a.freeze().sameEdges(otherNames));
    }

    @Test
    void mutableEditsOrientRemoveAndReMark() {
        MutableGraph g = Graph.builder(NAMES);
        g.addUndirected(0, 1).addUndirected(1, 2);
        g.orient(1, 2);
        assertTrue(g.hasDirected(1, 2));
        assertArrayEquals(new int[] {2}, g.children(1));
        assertArrayEquals(new int[] {1}, g.parents(2));
        assertArrayEquals(new int[] {0}, g.undirectedNeighbours(1));
        g.setMarks(0, 1, Mark.ARROW, Mark.ARROW);
        assertEquals(new Edge(0, 1, Mark.ARROW, Mark.ARROW), g.edge(0, 1));
        assertTrue(g.removeEdge(1, 0));
        assertFalse(g.removeEdge(1, 0));
        assertEquals(1, g.edgeCount());
        assertEquals(0, g.degree(0));
        assertEquals(List.of(Edge.directed(1, 2)), g.freeze().edges());
    }

    @Test
    void refusesBadEditsWithTheNames() {
        MutableGraph g = Graph.builder(NAMES);
        g.addDirected(0, 1);
        IllegalArgumentException twice = assertThrows(IllegalArgumentException.class, () -> g.addDirected(1, 0));
        assertTrue(twice.getMessage().contains("'B' and 'A' are already adjacent"), twice.getMessage());
        IllegalArgumentException loop = assertThrows(IllegalArgumentException.class, () -> g.addUndirected(2, 2));
        assertTrue(loop.getMessage().contains("self-loop at 'C'"), loop.getMessage());
        IllegalArgumentException notAdjacent = assertThrows(IllegalArgumentException.class, () -> g.orient(2, 3));
        assertTrue(notAdjacent.getMessage().contains("'C' and 'D' are not adjacent"), notAdjacent.getMessage());
        IllegalArgumentException dup = assertThrows(IllegalArgumentException.class,
                () -> Graph.builder(List.of("A", "B", "A")));
        assertTrue(dup.getMessage().contains("'A' appears twice"), dup.getMessage());
        IllegalArgumentException blank = assertThrows(IllegalArgumentException.class,
                () -> Graph.builder(List.of("A", " ")));
        assertTrue(blank.getMessage().contains("variable 2 has an empty name"), blank.getMessage());
        IllegalArgumentException unknownHidden = assertThrows(IllegalArgumentException.class,
                () -> g.freeze().withHidden(Set.of("Q")));
        assertTrue(unknownHidden.getMessage().contains("'Q'"), unknownHidden.getMessage());
    }

    @Test
    void emptyGraph() {
        Graph g = Graph.empty(List.of("X", "Y"));
        assertEquals(0, g.edgeCount());
        assertEquals("(no edges over 2 variables)", g.toString());
        assertTrue(g.isFullyDirected());
        assertFalse(g.hasHidden());
    }

    @Test
    @DisplayName("property: on seeded random mixed graphs the CSR view agrees with the edits that built it (common practice)")
    void randomGraphsAgreeWithTheirEdits() {
        UniformRandomProvider rng = Seeds.random(20261201L);
        Mark[] marks = Mark.values();
        for (int trial = 0; trial < 200; trial++) {
            int n = 2 + rng.nextInt(12);
            List<String> names = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                names.add("v" + i);
            }
            MutableGraph m = Graph.builder(names);
            Mark[][] expected = new Mark[n][n];
            for (int a = 0; a < n; a++) {
                for (int b = a + 1; b < n; b++) {
                    if (rng.nextDouble() < 0.3) {
                        Mark ma = marks[rng.nextInt(3)];
                        Mark mb = marks[rng.nextInt(3)];
                        if (rng.nextBoolean()) {
                            m.addEdge(a, b, ma, mb);
                        } else {
                            m.addEdge(b, a, mb, ma);
                        }
                        expected[a][b] = ma;
                        expected[b][a] = mb;
                    }
                }
            }
            Graph g = m.freeze();
            int edges = 0;
            for (int a = 0; a < n; a++) {
                int degree = 0;
                int last = -1;
                for (int b = 0; b < n; b++) {
                    assertEquals(expected[a][b], g.markAt(a, b));
                    assertEquals(expected[a][b] != null, g.adjacent(a, b));
                    if (expected[a][b] != null) {
                        degree++;
                        if (a < b) {
                            edges++;
                        }
                    }
                }
                assertEquals(degree, g.degree(a));
                for (int k = 0; k < g.degree(a); k++) {
                    int w = g.neighbour(a, k);
                    assertTrue(w > last, "neighbours ascending");
                    last = w;
                    assertEquals(expected[a][w], g.markHere(a, k));
                    assertEquals(expected[w][a], g.markThere(a, k));
                }
            }
            assertEquals(edges, g.edgeCount());
            assertEquals(g, g.toMutable().freeze());
        }
    }
}
