package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DagExtensionTest {

    @Test
    @DisplayName("the extension of every CPDAG on n <= 5 nodes is a DAG of the same class: its CPDAG is the input (Dor and Tarsi 1992)")
    void everySmallCpdagExtendsIntoItsClass() {
        int classes = 0;
        for (int n = 1; n <= 5; n++) {
            Set<Graph> seen = new HashSet<>();
            for (Graph dag : SmallDags.dags(n)) {
                Graph cpdag = Cpdags.of(dag);
                if (!seen.add(cpdag)) {
                    continue;
                }
                Graph ext = DagExtension.of(cpdag);
                assertNotNull(ext, cpdag::toString);
                assertTrue(GraphChecks.isDag(ext), ext::toString);
                assertEquals(cpdag, Cpdags.meek(ext), cpdag::toString);
                classes++;
            }
        }
        assertEquals(1 + 2 + 11 + 185 + 8782, classes);
    }

    @Test
    @DisplayName("no extension for the undirected chordless 4-cycle: every orientation adds a v-structure or a cycle (hand example)")
    void chordlessCycleHasNoExtension() {
        // a - b - c - d - a with no chord: an acyclic orientation has a sink on the cycle,
        // whose two cycle neighbours are not adjacent, so it is a new v-structure.
        Graph square = TestGraphs.of("a b c d", "a--b, b--c, c--d, d--a");
        assertNull(DagExtension.of(square));
        assertTrue(BruteForce.extensions(square).isEmpty(), "brute force agrees");
        // With the chord a - c it is chordal and extends.
        assertNotNull(DagExtension.of(TestGraphs.of("a b c d", "a--b, b--c, c--d, d--a, a--c")));
    }

    @Test
    @DisplayName("no extension when the directed edges already form a cycle, or when they force one (hand examples)")
    void cyclesHaveNoExtension() {
        assertNull(DagExtension.of(TestGraphs.of("a b c", "a->b, b->c, c->a")));
        // a -> b, b - c, c -> d, d -> a: b -> c closes the cycle a -> b -> c -> d -> a, and
        // c -> b makes a -> b <- c a new v-structure (a, c not adjacent).
        Graph forced = TestGraphs.of("a b c d", "a->b, b--c, c->d, d->a");
        assertNull(DagExtension.of(forced));
        assertTrue(BruteForce.extensions(forced).isEmpty(), "brute force agrees");
    }

    @Test
    @DisplayName("on every PDAG made from a 4-node DAG by un-directing some edges, an extension exists exactly when brute force finds one, and it is consistent")
    void agreesWithBruteForceOnSmallPdags() {
        UniformRandomProvider rng = Seeds.random(11L);
        int none = 0;
        int some = 0;
        for (Graph dag : SmallDags.dags(4)) {
            for (int rep = 0; rep < 4; rep++) {
                MutableGraph m = dag.toMutable();
                for (Edge e : dag.edges()) {
                    if (rng.nextBoolean()) {
                        m.setMarks(e.a(), e.b(), dev.touchstone.core.graph.Mark.TAIL, dev.touchstone.core.graph.Mark.TAIL);
                    }
                }
                Graph pdag = m.freeze();
                List<Graph> all = BruteForce.extensions(pdag);
                Graph ext = DagExtension.of(pdag);
                if (all.isEmpty()) {
                    assertNull(ext, pdag::toString);
                    none++;
                } else {
                    assertNotNull(ext, pdag::toString);
                    assertTrue(all.contains(ext), () -> "not a consistent extension of " + pdag + ": " + ext);
                    some++;
                }
            }
        }
        assertTrue(none > 50 && some > 50, "both outcomes exercised: " + none + " / " + some);
    }

    @Test
    @DisplayName("extensions of CPDAGs of random DAGs with up to 2000 nodes land back in the class")
    void largeRandom() {
        for (int i = 0; i < 20; i++) {
            Graph dag = RandomDags.erdosRenyi(100 + 100 * i, 2 + i % 4, 900 + i);
            Graph cpdag = Cpdags.of(dag);
            Graph ext = DagExtension.of(cpdag);
            assertNotNull(ext);
            assertEquals(cpdag, Cpdags.of(ext));
        }
    }

    @Test
    @DisplayName("bad input: an edge with a circle is refused, naming the edge")
    void refusesCircles() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> DagExtension.of(TestGraphs.of("a b", "ao>b")));
        assertTrue(e.getMessage().startsWith("edge a o-> b is neither directed nor undirected"), e.getMessage());
    }
}
