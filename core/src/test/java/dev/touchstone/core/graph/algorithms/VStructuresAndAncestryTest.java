package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class VStructuresAndAncestryTest {

    @Test
    @DisplayName("v-structures of the reference networks: sprinkler has sprinkler -> wet <- rain; Asia has tub -> either <- lung and either -> dysp <- bronc")
    void referenceNetworks() {
        Graph s = TestGraphs.sprinkler();
        assertEquals(List.of(new VStructures.VStructure(1, 3, 2)), VStructures.of(s));
        Graph a = TestGraphs.asia();
        assertEquals(List.of(new VStructures.VStructure(1, 5, 3), new VStructures.VStructure(4, 7, 5)),
                VStructures.of(a));
        assertEquals(2, VStructures.count(a));
        assertTrue(VStructures.isVStructure(a, 1, 5, 3));
        assertFalse(VStructures.isVStructure(a, 0, 1, 2));
    }

    @Test
    @DisplayName("a shielded collider is not a v-structure; undirected edges do not count")
    void shieldedAndUndirected() {
        assertEquals(0, VStructures.count(TestGraphs.of("a b c", "a->c, b->c, a->b")));
        assertEquals(0, VStructures.count(TestGraphs.of("a b c", "a->c, b--c")));
        assertThrows(IllegalArgumentException.class, () -> new VStructures.VStructure(2, 1, 0));
    }

    @Test
    @DisplayName("topological order puts every parent first and takes the smallest ready index (Kahn 1962)")
    void topologicalOrder() {
        assertArrayEquals(new int[] {0, 1, 2, 3, 4}, Ancestry.topologicalOrder(TestGraphs.sprinkler()));
        assertArrayEquals(new int[] {2, 0, 1}, Ancestry.topologicalOrder(TestGraphs.of("a b c", "c->a, a->b")));
        assertNull(Ancestry.topologicalOrder(TestGraphs.of("a b c", "a->b, b->c, c->a")));
        for (int i = 0; i < 20; i++) {
            Graph dag = RandomDags.erdosRenyi(200, 3, i);
            int[] pos = Ancestry.positions(Ancestry.topologicalOrder(dag));
            for (var e : dag.edges()) {
                int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
                assertTrue(pos[from] < pos[e.other(from)]);
            }
            assertEquals(0, Ancestry.directedCycle(dag).length);
        }
    }

    @Test
    @DisplayName("directedCycle returns a real cycle, first variable repeated")
    void directedCycle() {
        Graph g = TestGraphs.of("a b c d e", "a->b, b->c, c->d, d->b, d->e, a--e");
        int[] cycle = Ancestry.directedCycle(g);
        assertArrayEquals(new int[] {1, 2, 3, 1}, cycle);
        for (int i = 0; i + 1 < cycle.length; i++) {
            assertTrue(g.hasDirected(cycle[i], cycle[i + 1]));
        }
        assertEquals(0, Ancestry.directedCycle(TestGraphs.of("a b", "a--b")).length, "undirected is no cycle");
    }

    @Test
    @DisplayName("ancestors and descendants follow directed edges only")
    void ancestry() {
        Graph a = TestGraphs.asia();
        boolean[] an = Ancestry.ancestors(a, 7);
        assertArrayEquals(new boolean[] {true, true, true, true, true, true, false, true}, an);
        boolean[] de = Ancestry.descendants(a, 2);
        assertArrayEquals(new boolean[] {false, false, true, true, true, true, true, true}, de);
        assertTrue(Ancestry.isAncestor(a, 0, 6));
        assertFalse(Ancestry.isAncestor(a, 6, 0));
    }
}
