package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static dev.touchstone.core.graph.algorithms.PagTestGraphs.graph;
import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Definitions of Richardson and Spirtes (2002, Definition 3.1 and §3.7), checked on small graphs reasoned out by hand. */
class AncestralGraphsTest {

    private static String problem(Graph g) {
        return assertThrows(IllegalArgumentException.class, () -> AncestralGraphs.checkMag(g)).getMessage();
    }

    @Test
    @DisplayName("DAGs, and graphs with bidirected edges between non-ancestors, are MAGs (Richardson and Spirtes 2002, Def. 3.1)")
    void magsPass() {
        Graph dag = graph("A B C D", "A --> B; B --> C; A --> C; C --> D");
        assertTrue(AncestralGraphs.isAncestral(dag));
        assertTrue(AncestralGraphs.isMaximal(dag));
        Graph mag = graph("A B C D", "A --> B; B <-> C; C <-- D");
        assertDoesNotThrow(() -> AncestralGraphs.checkMag(mag));
        Graph withUndirected = graph("A B C D", "A --- B; B --> C; C <-> D");
        assertDoesNotThrow(() -> AncestralGraphs.checkMag(withUndirected));
    }

    @Test
    @DisplayName("a directed cycle is named edge by edge")
    void directedCycle() {
        String why = problem(graph("A B C D", "A --> B; B --> C; C --> A; C --> D"));
        assertTrue(why.contains("directed cycle"), why);
        assertTrue(why.contains("'A' --> 'B' --> 'C' --> 'A'"), why);
    }

    @Test
    @DisplayName("an almost directed cycle (A <-> B, A an ancestor of B) is named with its path (Richardson and Spirtes 2002, §3.1)")
    void almostDirectedCycle() {
        Graph g = graph("A B C", "A --> C; C --> B; A <-> B");
        assertFalse(AncestralGraphs.isAncestral(g));
        String why = problem(g);
        assertTrue(why.contains("almost directed cycle"), why);
        assertTrue(why.contains("'A' <-> 'B'"), why);
        assertTrue(why.contains("'A' --> 'C' --> 'B'"), why);
    }

    @Test
    @DisplayName("an undirected edge whose end has an arrowhead is named (Richardson and Spirtes 2002, Def. 3.1 (iii))")
    void undirectedWithArrowhead() {
        String why = problem(graph("A B C", "A --- B; C --> A"));
        assertTrue(why.contains("undirected edge 'A' --- 'B'"), why);
        assertTrue(why.contains("'A' has an arrowhead"), why);
        String spouse = problem(graph("A B C", "A --- B; B <-> C"));
        assertTrue(spouse.contains("'B' has an arrowhead"), spouse);
    }

    @Test
    @DisplayName("circle marks are not allowed in a MAG")
    void circles() {
        String why = problem(graph("A B", "A o-> B"));
        assertTrue(why.contains("'A' o-> 'B'") && why.contains("circle"), why);
    }

    @Test
    @DisplayName("an ancestral graph with an inducing path between non-adjacent variables is not maximal (Richardson and Spirtes 2002, §3.7 and the inducing-path theorem; reasoned out)")
    void notMaximal() {
        // A <-> B <-> C <-> D: B and C are colliders on it; B is an ancestor of D (B --> D)
        // and C of A (C --> A), so the path is inducing and no set separates A from D. The
        // graph is ancestral: no bidirected edge joins an ancestor pair, no directed cycle.
        Graph g = graph("A B C D", "A <-> B; B <-> C; C <-> D; B --> D; C --> A");
        assertTrue(AncestralGraphs.isAncestral(g));
        assertFalse(AncestralGraphs.isMaximal(g));
        String why = problem(g);
        assertTrue(why.contains("'A' and 'D' are not adjacent") && why.contains("inducing path"), why);
        // Adding the edge the inducing path calls for makes it maximal.
        Graph completed = graph("A B C D", "A <-> B; B <-> C; C <-> D; B --> D; C --> A; A <-> D");
        assertTrue(AncestralGraphs.isMaximal(completed));
        // Without the ancestor relations the path is not inducing: {B, C}-free sets separate A, D.
        Graph plain = graph("A B C D", "A <-> B; B <-> C; C <-> D");
        assertTrue(AncestralGraphs.isMaximal(plain));
    }

    @Test
    @DisplayName("maximality is asked only of ancestral graphs")
    void maximalityNeedsAncestral() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> AncestralGraphs.isMaximal(graph("A B C", "A --> C; C --> B; A <-> B")));
        assertEquals(true, e.getMessage().contains("ancestral"));
    }
}
