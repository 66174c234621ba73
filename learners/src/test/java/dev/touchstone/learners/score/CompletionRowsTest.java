package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Checks the completion GES runs after each move on its own sparse PDAG. The reference is
 * core's {@link DagExtension} (Dor and Tarsi 1992) and {@link Cpdags} (Chickering 1995, whose
 * tests check it against Meek's rules on every DAG of up to five variables); the completion
 * must give the same DAG, the same CPDAG and the same neighbour order as going through them,
 * since the searches iterate neighbours in that order and their results must not move.
 */
class CompletionRowsTest {

    @Test
    @DisplayName("on 600 seeded PDAGs (CPDAGs of random DAGs, then random edits) the extension and the CPDAG"
            + " equal core's Dor–Tarsi extension and Chickering CPDAG, neighbour order included")
    void matchesCoreOnRandomPdags() {
        int extendable = 0;
        int without = 0;
        for (long seed = 1; seed <= 600; seed++) {
            SplittableRandom rng = new SplittableRandom(seed);
            int p = 3 + rng.nextInt(13);
            Graph dag = RandomDags.erdosRenyi(p, 1 + 3 * rng.nextDouble(), seed);
            Graph pdag = edit(Cpdags.of(dag), rng);
            Graph coreDag = DagExtension.of(pdag);
            Pdag ours = CompletionRows.extensionOf(Pdag.of(pdag));
            Pdag oursClass = CompletionRows.cpdagOf(Pdag.of(pdag));
            if (coreDag == null) {
                without++;
                assertNull(ours, "seed " + seed);
                assertNull(oursClass, "seed " + seed);
                continue;
            }
            extendable++;
            assertNotNull(ours, "seed " + seed);
            assertSameRows(Pdag.of(coreDag), ours, "extension, seed " + seed);
            assertSameRows(Pdag.of(Cpdags.of(coreDag)), oursClass, "CPDAG, seed " + seed);
        }
        // Both branches must be exercised, or the comparison would say little.
        assertTrue(extendable > 200 && without > 50, extendable + " with an extension, " + without + " without");
    }

    @Test
    @DisplayName("textbook classes: a chain is all reversible; a collider and the edge out of it are compelled"
            + " (Verma and Pearl 1990; Meek 1995, rule R1)")
    void textbookClasses() {
        List<String> names = RandomDags.names(4);
        Pdag chain = CompletionRows.cpdagOf(Pdag.of(Graph.builder(names).addDirected(0, 1).addDirected(1, 2).freeze()));
        assertTrue(chain.undirected(0, 1) && chain.undirected(1, 2) && chain.edgeCount() == 2);
        Pdag collider = CompletionRows.cpdagOf(Pdag.of(
                Graph.builder(names).addDirected(0, 2).addDirected(1, 2).addDirected(2, 3).freeze()));
        assertTrue(collider.directed(0, 2) && collider.directed(1, 2) && collider.directed(2, 3));
    }

    @Test
    @DisplayName("an undirected chordless 4-cycle and a directed cycle have no consistent extension"
            + " (an undirected graph has one exactly when it is chordal; Dor and Tarsi 1992)")
    void noExtension() {
        List<String> names = RandomDags.names(4);
        Graph square = Graph.builder(names).addUndirected(0, 1).addUndirected(1, 2).addUndirected(2, 3)
                .addUndirected(3, 0).freeze();
        assertNull(CompletionRows.cpdagOf(Pdag.of(square)));
        Graph chorded = square.toMutable().addUndirected(0, 2).freeze();
        Pdag extension = CompletionRows.extensionOf(Pdag.of(chorded));
        assertNotNull(extension);
        assertEquals(5, extension.edgeCount());
        Graph cycle = Graph.builder(names).addDirected(0, 1).addDirected(1, 2).addDirected(2, 0).freeze();
        assertNull(CompletionRows.extensionOf(Pdag.of(cycle)));
    }

    /** Up to three random edits: add an edge (directed or undirected), remove one, or direct an undirected one. */
    private static Graph edit(Graph cpdag, SplittableRandom rng) {
        MutableGraph g = cpdag.toMutable();
        int p = g.size();
        for (int i = rng.nextInt(4); i > 0; i--) {
            int a = rng.nextInt(p);
            int b = rng.nextInt(p);
            if (a == b) {
                continue;
            }
            if (!g.adjacent(a, b)) {
                if (rng.nextBoolean()) {
                    g.addDirected(a, b);
                } else {
                    g.addUndirected(a, b);
                }
            } else if (g.hasUndirected(a, b) && rng.nextBoolean()) {
                g.removeEdge(a, b);
                g.addDirected(a, b);
            } else {
                g.removeEdge(a, b);
            }
        }
        return g.freeze();
    }

    private static void assertSameRows(Pdag expected, Pdag actual, String what) {
        assertEquals(expected.size(), actual.size(), what);
        for (int v = 0; v < expected.size(); v++) {
            assertEquals(expected.degree(v), actual.degree(v), what + ", degree of " + v);
            for (int k = 0; k < expected.degree(v); k++) {
                assertEquals(expected.neighbour(v, k), actual.neighbour(v, k), what + ", neighbour " + k + " of " + v);
                assertEquals(expected.neighbourState(v, k), actual.neighbourState(v, k), what + ", state at " + v);
            }
        }
    }
}
