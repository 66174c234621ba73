package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DSeparationTest {

    @Test
    @DisplayName("agrees with networkx is_d_separator on every query of the committed fixture (scripts/fixtures/dseparation_fixture.py)")
    void agreesWithNetworkx() throws IOException {
        Map<Integer, DSeparation> graphs = new HashMap<>();
        int queries = 0;
        int separated = 0;
        try (InputStream in = getClass().getResourceAsStream("/fixtures/dseparation.txt")) {
            assertNotNull(in, "fixture missing");
            BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            String line;
            int lineNo = 0;
            while ((line = r.readLine()) != null) {
                lineNo++;
                if (line.startsWith("#") || line.isBlank()) {
                    continue;
                }
                String[] f = line.split(" ");
                if (f[0].equals("graph")) {
                    int n = Integer.parseInt(f[2]);
                    MutableGraph g = Graph.builder(RandomDags.names(n));
                    for (int i = 3; i < f.length; i++) {
                        String[] e = f[i].split(">");
                        g.addDirected(Integer.parseInt(e[0]), Integer.parseInt(e[1]));
                    }
                    graphs.put(Integer.parseInt(f[1]), new DSeparation(g.freeze()));
                } else {
                    DSeparation d = graphs.get(Integer.parseInt(f[1]));
                    int[] xs = set(f[2]);
                    int[] ys = set(f[3]);
                    int[] zs = set(f[4]);
                    boolean expected = f[5].equals("1");
                    String where = "fixture line " + lineNo + ": " + line;
                    assertEquals(expected, d.separated(xs, ys, zs), where);
                    if (xs.length == 1 && ys.length == 1) {
                        assertEquals(expected, d.separated(xs[0], ys[0], zs), where);
                        assertEquals(expected, d.separated(ys[0], xs[0], zs), "symmetry, " + where);
                    }
                    queries++;
                    separated += expected ? 1 : 0;
                }
            }
        }
        assertTrue(queries >= 2000, "only " + queries + " queries");
        assertTrue(separated > queries / 4 && separated < 3 * queries / 4, "answers too one-sided: " + separated);
    }

    private static int[] set(String field) {
        if (field.equals("-")) {
            return new int[0];
        }
        String[] parts = field.split(",");
        int[] out = new int[parts.length];
        for (int i = 0; i < parts.length; i++) {
            out[i] = Integer.parseInt(parts[i]);
        }
        return out;
    }

    @Test
    @DisplayName("sprinkler (Pearl 2000, ch. 1): the textbook independences and dependences")
    void sprinkler() {
        Graph g = TestGraphs.sprinkler();
        DSeparation d = new DSeparation(g);
        int season = 0;
        int sprinkler = 1;
        int rain = 2;
        int wet = 3;
        int slippery = 4;
        assertTrue(d.separated(sprinkler, rain, new int[] {season}));
        assertFalse(d.separated(sprinkler, rain, new int[] {season, wet}), "conditioning on a collider");
        assertFalse(d.separated(sprinkler, rain, new int[] {season, slippery}), "on a descendant of a collider");
        assertFalse(d.separated(sprinkler, rain, new int[0]), "common cause season");
        assertTrue(d.separated(season, slippery, new int[] {wet}));
        assertTrue(d.separated(season, wet, new int[] {sprinkler, rain}));
        assertFalse(d.separated(season, wet, new int[] {sprinkler}));
    }

    @Test
    @DisplayName("agrees with the moralised ancestral graph criterion (Lauritzen, Dawid, Larsen and Leimer 1990) on larger random DAGs")
    void agreesWithMoralisation() {
        UniformRandomProvider rng = Seeds.random(99L);
        for (int i = 0; i < 30; i++) {
            int n = 50 + 17 * i;
            Graph dag = RandomDags.erdosRenyi(n, 2 + i % 4, 400 + i);
            DSeparation d = new DSeparation(dag);
            for (int q = 0; q < 40; q++) {
                int x = rng.nextInt(n);
                int y = rng.nextInt(n - 1);
                y = y >= x ? y + 1 : y;
                List<Integer> z = new ArrayList<>();
                int size = rng.nextInt(6);
                while (z.size() < size) {
                    int v = rng.nextInt(n);
                    if (v != x && v != y && !z.contains(v)) {
                        z.add(v);
                    }
                }
                int[] zs = z.stream().mapToInt(Integer::intValue).toArray();
                assertEquals(moralised(dag, x, y, zs), d.separated(x, y, zs), "seed " + (400 + i) + " query " + q);
            }
        }
    }

    /** x ⊥ y | Z iff Z separates x from y in the moral graph of An({x, y} ∪ Z). */
    private static boolean moralised(Graph dag, int x, int y, int[] z) {
        int[] start = new int[z.length + 2];
        System.arraycopy(z, 0, start, 0, z.length);
        start[z.length] = x;
        start[z.length + 1] = y;
        boolean[] an = Ancestry.ancestors(dag, start);
        int n = dag.size();
        List<List<Integer>> adj = new ArrayList<>();
        for (int v = 0; v < n; v++) {
            adj.add(new ArrayList<>());
        }
        for (int v = 0; v < n; v++) {
            if (!an[v]) {
                continue;
            }
            int[] pa = dag.parents(v);
            for (int p : pa) {
                adj.get(v).add(p);
                adj.get(p).add(v);
            }
            for (int i = 0; i < pa.length; i++) {
                for (int j = i + 1; j < pa.length; j++) {
                    adj.get(pa[i]).add(pa[j]);
                    adj.get(pa[j]).add(pa[i]);
                }
            }
        }
        boolean[] blocked = new boolean[n];
        for (int v : z) {
            blocked[v] = true;
        }
        boolean[] seen = new boolean[n];
        List<Integer> stack = new ArrayList<>(List.of(x));
        seen[x] = true;
        while (!stack.isEmpty()) {
            int v = stack.remove(stack.size() - 1);
            if (v == y) {
                return false;
            }
            for (int w : adj.get(v)) {
                if (an[w] && !seen[w] && !blocked[w]) {
                    seen[w] = true;
                    stack.add(w);
                }
            }
        }
        return true;
    }

    @Test
    @DisplayName("queries from many threads at once give the answers of one thread")
    void threadSafe() {
        Graph dag = RandomDags.erdosRenyi(300, 3, 5L);
        DSeparation d = new DSeparation(dag);
        boolean[] single = new boolean[2000];
        for (int q = 0; q < single.length; q++) {
            single[q] = d.separated(q % 300, (q * 7 + 1) % 300 == q % 300 ? (q + 1) % 300 : (q * 7 + 1) % 300,
                    new int[] {(q * 13 + 5) % 300 == q % 300 ? 299 - q % 300 : (q * 13 + 5) % 300});
        }
        IntStream.range(0, 8).parallel().forEach(rep -> {
            for (int q = 0; q < single.length; q++) {
                boolean s = d.separated(q % 300, (q * 7 + 1) % 300 == q % 300 ? (q + 1) % 300 : (q * 7 + 1) % 300,
                        new int[] {(q * 13 + 5) % 300 == q % 300 ? 299 - q % 300 : (q * 13 + 5) % 300});
                assertEquals(single[q], s, "query " + q);
            }
        });
    }

    @Test
    @DisplayName("bad input: a cyclic graph, overlapping sets, x = y are refused with clear messages")
    void badInput() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new DSeparation(TestGraphs.of("a b c", "a->b, b->c, c->a")));
        assertEquals("not a DAG: directed cycle a -> b -> c -> a", e.getMessage());
        DSeparation d = new DSeparation(TestGraphs.sprinkler());
        e = assertThrows(IllegalArgumentException.class, () -> d.separated(1, 2, new int[] {1}));
        assertEquals("'sprinkler' is both separated and conditioned on", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> d.separated(1, 1, new int[0]));
        assertEquals("x and y must differ, got 'sprinkler' twice", e.getMessage());
    }
}
