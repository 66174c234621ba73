package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CpdagsTest {

    /** OEIS A007984, Markov equivalence classes of labelled DAGs (Gillispie and Perlman 2001; Steinsky 2003). */
    private static final int[] A007984 = {1, 2, 11, 185, 8782};

    @Test
    @DisplayName("CPDAGs of all DAGs on n <= 5 nodes number 1, 2, 11, 185, 8782 (OEIS A007984; Gillispie and Perlman 2001; Steinsky 2003), by both constructions")
    void distinctCpdagsMatchGillispiePerlman() {
        for (int n = 1; n <= 5; n++) {
            Set<Graph> byMeek = new HashSet<>();
            Set<Graph> byChickering = new HashSet<>();
            for (Graph dag : SmallDags.dags(n)) {
                Graph m = Cpdags.meek(dag);
                Graph c = Cpdags.chickering(dag);
                assertEquals(m, c, () -> "Meek and Chickering disagree on " + dag);
                byMeek.add(m);
                byChickering.add(c);
            }
            assertEquals(A007984[n - 1], byMeek.size(), "Meek, n = " + n);
            assertEquals(A007984[n - 1], byChickering.size(), "Chickering, n = " + n);
        }
    }

    @Test
    @DisplayName("on n <= 5 each CPDAG is the essential graph of its class by definition (Andersson, Madigan and Perlman 1997), classes grouped by skeleton and v-structures (Verma and Pearl 1990)")
    void cpdagIsEssentialGraphOfItsClass() {
        for (int n = 1; n <= 5; n++) {
            List<List<Graph>> classes = SmallDags.classes(n);
            assertEquals(A007984[n - 1], classes.size(), "classes by Verma-Pearl key, n = " + n);
            for (List<Graph> members : classes) {
                Graph expected = SmallDags.essentialGraph(members);
                for (Graph dag : members) {
                    assertEquals(expected, Cpdags.of(dag), () -> "class of " + dag);
                }
            }
        }
    }

    @Test
    @DisplayName("Meek and Chickering agree on 300 seeded random DAGs of 10 to 300 nodes (Erdős–Rényi and scale-free)")
    void constructionsAgreeOnLargerRandomDags() {
        int checked = 0;
        for (int i = 0; i < 200; i++) {
            int n = 10 + (i * 37) % 291;
            double degree = 1 + (i % 7);
            Graph dag = RandomDags.erdosRenyi(n, degree, 1000 + i);
            assertEquals(Cpdags.meek(dag), Cpdags.chickering(dag), "Erdős–Rényi seed " + (1000 + i));
            checked++;
        }
        for (int i = 0; i < 100; i++) {
            int n = 10 + (i * 53) % 191;
            Graph dag = RandomDags.scaleFree(n, 1 + i % 4, 5000 + i);
            assertEquals(Cpdags.meek(dag), Cpdags.chickering(dag), "scale-free seed " + (5000 + i));
            checked++;
        }
        assertEquals(300, checked);
    }

    @Test
    @DisplayName("CPDAG of random DAGs keeps skeleton and v-structures, directs every v-structure edge, and is a valid CPDAG (Verma and Pearl 1990)")
    void cpdagKeepsSkeletonAndVStructures() {
        for (int i = 0; i < 60; i++) {
            Graph dag = RandomDags.erdosRenyi(40, 1 + i % 5, 77 + i);
            Graph cpdag = Cpdags.of(dag);
            assertEquals(dag.edgeCount(), cpdag.edgeCount());
            for (var e : dag.edges()) {
                assertTrue(cpdag.adjacent(e.a(), e.b()));
            }
            assertEquals(VStructures.of(dag), VStructures.of(cpdag));
            assertTrue(GraphChecks.isCpdag(cpdag), "seed " + (77 + i));
        }
    }

    @Test
    @DisplayName("sprinkler (Pearl 2000, ch. 1): season—sprinkler, season—rain undirected; sprinkler → wet ← rain; wet → slippery")
    void sprinkler() {
        Graph expected = TestGraphs.of("season sprinkler rain wet slippery",
                "season--sprinkler, season--rain, sprinkler->wet, rain->wet, wet->slippery");
        assertEquals(expected, Cpdags.meek(TestGraphs.sprinkler()));
        assertEquals(expected, Cpdags.chickering(TestGraphs.sprinkler()));
    }

    @Test
    @DisplayName("chest clinic (Lauritzen and Spiegelhalter 1988): asia—tub, smoke—lung, smoke—bronc undirected, the other five arcs directed")
    void asia() {
        Graph expected = TestGraphs.of("asia tub smoke lung bronc either xray dysp",
                "asia--tub, smoke--lung, smoke--bronc, tub->either, lung->either, either->xray,"
                        + " either->dysp, bronc->dysp");
        assertEquals(expected, Cpdags.meek(TestGraphs.asia()));
        assertEquals(expected, Cpdags.chickering(TestGraphs.asia()));
    }

    @Test
    @DisplayName("hidden flags are copied from the DAG")
    void keepsHiddenFlags() {
        Graph dag = TestGraphs.sprinkler().withHidden(Set.of("rain"));
        assertTrue(Cpdags.meek(dag).isHidden(2));
        assertTrue(Cpdags.chickering(dag).isHidden(2));
    }

    @Test
    @DisplayName("a cycle where a DAG is required is refused with the cycle named")
    void refusesCycle() {
        Graph cyclic = TestGraphs.of("a b c d", "a->b, b->c, c->d, d->b");
        for (var f : List.<java.util.function.Function<Graph, Graph>>of(Cpdags::meek, Cpdags::chickering,
                Cpdags::of)) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> f.apply(cyclic));
            assertEquals("not a DAG: directed cycle b -> c -> d -> b", e.getMessage());
        }
        Graph undirected = TestGraphs.of("a b c", "a->b, b--c");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Cpdags.of(undirected));
        assertEquals("not a DAG: edge b --- c is not directed", e.getMessage());
    }
}
