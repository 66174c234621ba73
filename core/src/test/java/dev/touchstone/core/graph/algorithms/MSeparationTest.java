package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.stream.IntStream;

import static dev.touchstone.core.graph.algorithms.PagTestGraphs.graph;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class MSeparationTest {

    private static boolean sep(Graph g, String x, String y, String... z) {
        int[] given = new int[z.length];
        for (int i = 0; i < z.length; i++) {
            given[i] = g.index(z[i]);
        }
        return new MSeparation(g).separated(g.index(x), g.index(y), given);
    }

    @Test
    @DisplayName("bidirected colliders close a path, open when conditioned on or on a descendant (Richardson and Spirtes 2002, §3.4 definition)")
    void bidirectedColliders() {
        Graph g = graph("A B C D", "A <-> B; B <-> C; B --> D");
        assertTrue(sep(g, "A", "C"));
        assertFalse(sep(g, "A", "C", "B"));
        assertFalse(sep(g, "A", "C", "D"), "a descendant of the collider opens it");
        Graph h = graph("A B C", "A --> B; B <-> C");
        assertTrue(sep(h, "A", "C"));
        assertFalse(sep(h, "A", "C", "B"));
    }

    @Test
    @DisplayName("non-colliders: chains, forks and undirected edges are blocked by conditioning (Richardson and Spirtes 2002, §3.4)")
    void nonColliders() {
        Graph chain = graph("A B C", "A --> B; B --> C");
        assertFalse(sep(chain, "A", "C"));
        assertTrue(sep(chain, "A", "C", "B"));
        Graph mixed = graph("A B C", "A <-- B; B <-> C");
        assertFalse(sep(mixed, "A", "C"));
        assertTrue(sep(mixed, "A", "C", "B"));
        Graph undirected = graph("A B C", "A --- B; B --- C");
        assertFalse(sep(undirected, "A", "C"));
        assertTrue(sep(undirected, "A", "C", "B"));
        Graph tailArrow = graph("A B C", "A --- B; B --> C");
        assertFalse(sep(tailArrow, "A", "C"));
        assertTrue(sep(tailArrow, "A", "C", "B"));
    }

    @Test
    @DisplayName("on DAGs m-separation equals d-separation (Richardson and Spirtes 2002, §3.4), on seeded random queries")
    void equalsDSeparationOnDags() {
        UniformRandomProvider rng = Seeds.random(11);
        int queries = 0;
        for (long seed = 1; seed <= 60; seed++) {
            Graph dag = RandomDags.erdosRenyi(12 + (int) (seed % 10), 2 + seed % 3, seed);
            MSeparation m = new MSeparation(dag);
            DSeparation d = new DSeparation(dag);
            for (int q = 0; q < 40; q++) {
                int[] xyz = randomQuery(dag.size(), rng);
                int[] z = java.util.Arrays.copyOfRange(xyz, 2, xyz.length);
                assertEquals(d.separated(xyz[0], xyz[1], z), m.separated(xyz[0], xyz[1], z),
                        "seed " + seed + " query " + java.util.Arrays.toString(xyz));
                queries++;
            }
        }
        assertEquals(2400, queries);
    }

    /** Two distinct variables followed by a random conditioning set that avoids both. */
    static int[] randomQuery(int n, UniformRandomProvider rng) {
        int[] perm = RandomDags.permutation(n, rng);
        int size = 2 + rng.nextInt(Math.min(n - 2, 6) + 1);
        return java.util.Arrays.copyOf(perm, size);
    }

    @Test
    @DisplayName("thread-safe: parallel queries give the sequential answers (common practice)")
    void threadSafe() {
        Graph dag = RandomDags.erdosRenyi(40, 3, 5);
        MSeparation m = new MSeparation(dag);
        UniformRandomProvider rng = Seeds.random(3);
        int[][] queries = new int[400][];
        for (int i = 0; i < queries.length; i++) {
            queries[i] = randomQuery(dag.size(), rng);
        }
        boolean[] sequential = new boolean[queries.length];
        for (int i = 0; i < queries.length; i++) {
            int[] q = queries[i];
            sequential[i] = m.separated(q[0], q[1], java.util.Arrays.copyOfRange(q, 2, q.length));
        }
        IntStream.range(0, queries.length).parallel().forEach(i -> {
            int[] q = queries[i];
            assertEquals(sequential[i], m.separated(q[0], q[1], java.util.Arrays.copyOfRange(q, 2, q.length)));
        });
    }

    @Test
    @DisplayName("bad input: circle marks and x or y in the conditioning set are refused with a clear message")
    void badInput() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new MSeparation(graph("A B", "A o-> B")));
        assertTrue(e.getMessage().contains("'A' o-> 'B'"), e.getMessage());
        Graph g = graph("A B C", "A --> B; B --> C");
        assertThrows(IllegalArgumentException.class, () -> new MSeparation(g).separated(0, 2, new int[] {0}));
    }
}
