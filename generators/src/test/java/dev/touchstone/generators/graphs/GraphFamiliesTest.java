package dev.touchstone.generators.graphs;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Seeds;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GraphFamiliesTest {

    private static GeneratedGraph draw(String id, Map<String, ?> raw, long seed) {
        GraphFamily f = GraphFamilies.byId(id);
        return f.generate(f.resolve(raw), Seeds.random(seed));
    }

    @Test
    @DisplayName("Erdős–Rényi edge counts follow Binomial(n(n-1)/2, p): mean within 4 SE, variance within 25% (binomial law)")
    void erdosRenyiEdgeCountsAreBinomial() {
        int n = 30;
        double p = 0.1;
        int graphs = 400;
        double[] counts = new double[graphs];
        for (int i = 0; i < graphs; i++) {
            Graph g = draw(ErdosRenyiFamily.ID, Map.of("nodes", n, "edge_probability", p), Seeds.derive(1, i)).dag();
            assertTrue(Ancestry.isAcyclic(g));
            assertTrue(g.isFullyDirected());
            counts[i] = g.edgeCount();
        }
        double pairs = n * (n - 1) / 2.0;
        double mean = 0;
        for (double c : counts) {
            mean += c;
        }
        mean /= graphs;
        double var = 0;
        for (double c : counts) {
            var += (c - mean) * (c - mean);
        }
        var /= graphs - 1;
        double binomialMean = pairs * p;
        double binomialVar = pairs * p * (1 - p);
        assertEquals(binomialMean, mean, 4 * Math.sqrt(binomialVar / graphs));
        assertEquals(binomialVar, var, 0.25 * binomialVar);
    }

    @Test
    @DisplayName("mean_degree d gives p = d/(n-1); too large a mean degree names both fields")
    void meanDegree() {
        GraphFamily f = GraphFamilies.byId(ErdosRenyiFamily.ID);
        assertEquals(2.0 / 19, ErdosRenyiFamily.edgeProbability(f.resolve(Map.of("nodes", 20, "mean_degree", 2))),
                1e-15);
        ParameterException e = assertThrows(ParameterException.class,
                () -> f.generate(f.resolve(Map.of("nodes", 5, "mean_degree", 6)), Seeds.random(1)));
        assertTrue(e.getMessage().contains("mean_degree") && e.getMessage().contains("nodes"), e.getMessage());
    }

    @Test
    @DisplayName("column position does not leak the causal order: about half the edges point from a lower to a higher column")
    void columnOrderDoesNotLeak() {
        int forward = 0;
        int total = 0;
        for (int i = 0; i < 50; i++) {
            Graph g = draw(ErdosRenyiFamily.ID, Map.of("nodes", 20, "mean_degree", 3), Seeds.derive(2, i)).dag();
            for (var e : g.edges()) {
                total++;
                if (g.hasDirected(e.a(), e.b())) {
                    forward++;
                }
            }
        }
        double share = forward / (double) total;
        // Binomial(total, 1/2) under a uniformly random order; 5 SE either side (common practice).
        assertEquals(0.5, share, 5 * Math.sqrt(0.25 / total));
    }

    @Test
    @DisplayName("the causal order recorded is a topological order of the DAG")
    void causalOrderIsTopological() {
        for (String id : List.of(ErdosRenyiFamily.ID, PreferentialAttachmentFamily.ID, FixedInDegreeFamily.ID,
                LayeredFamily.ID)) {
            GeneratedGraph gg = draw(id, Map.of("nodes", 25), 3);
            Graph g = gg.dag();
            for (var e : g.edges()) {
                int from = g.hasDirected(e.a(), e.b()) ? e.a() : e.b();
                int to = from == e.a() ? e.b() : e.a();
                assertTrue(gg.causalOrder().indexOf(g.name(from)) < gg.causalOrder().indexOf(g.name(to)), id);
            }
        }
    }

    /** Discrete power-law exponent by the approximate maximum-likelihood estimator of Clauset, Shalizi and Newman (2009). */
    private static double tailExponent(Graph g, int dmin) {
        double s = 0;
        int n = 0;
        for (int v = 0; v < g.size(); v++) {
            if (g.degree(v) >= dmin) {
                s += Math.log(g.degree(v) / (dmin - 0.5));
                n++;
            }
        }
        return 1 + n / s;
    }

    private static int maxDegree(Graph g) {
        int m = 0;
        for (int v = 0; v < g.size(); v++) {
            m = Math.max(m, g.degree(v));
        }
        return m;
    }

    @Test
    @DisplayName("preferential attachment: tail exponent near 3 (Barabási and Albert 1999), tail heavier than Erdős–Rényi's")
    void preferentialAttachmentTail() {
        double exponent = 0;
        int reps = 5;
        for (int i = 0; i < reps; i++) {
            Graph ba = draw(PreferentialAttachmentFamily.ID, Map.of("nodes", 3000, "edges_per_node", 2),
                    Seeds.derive(4, i)).dag();
            Graph er = draw(ErdosRenyiFamily.ID, Map.of("nodes", 3000, "mean_degree", 4), Seeds.derive(5, i)).dag();
            assertEquals(2.0 * ba.edgeCount() / ba.size(), 4.0, 0.1);
            assertTrue(maxDegree(ba) > 3 * maxDegree(er), maxDegree(ba) + " vs " + maxDegree(er));
            exponent += tailExponent(ba, 6);
        }
        exponent /= reps;
        // Wide tolerance: finite-size estimates of the BA exponent scatter around 3.
        assertEquals(3.0, exponent, 0.6, "estimated exponent " + exponent);
    }

    @Test
    @DisplayName("hubs as causes point edges away from the largest hub, hubs as effects into it")
    void hubDirection() {
        for (String hubs : List.of("causes", "effects")) {
            Graph g = draw(PreferentialAttachmentFamily.ID, Map.of("nodes", 500, "edges_per_node", 1, "hubs", hubs),
                    6).dag();
            int hub = 0;
            for (int v = 0; v < g.size(); v++) {
                if (g.degree(v) > g.degree(hub)) {
                    hub = v;
                }
            }
            int out = g.children(hub).length;
            int in = g.parents(hub).length;
            if (hubs.equals("causes")) {
                assertTrue(out > 5 * Math.max(1, in), out + " out, " + in + " in");
            } else {
                assertTrue(in > 5 * Math.max(1, out), out + " out, " + in + " in");
            }
        }
    }

    @Test
    @DisplayName("fixed in-degree: the i-th variable of the order has min(k, i) parents")
    void fixedInDegree() {
        GeneratedGraph gg = draw(FixedInDegreeFamily.ID, Map.of("nodes", 40, "in_degree", 3), 7);
        for (int pos = 0; pos < 40; pos++) {
            int v = gg.dag().index(gg.causalOrder().get(pos));
            assertEquals(Math.min(3, pos), gg.dag().parents(v).length);
        }
    }

    @Test
    @DisplayName("layered: no edge inside a layer or backwards; layers come out as tiers; next-layer skips nothing")
    void layered() {
        for (String links : List.of("all-later-layers", "next-layer")) {
            GeneratedGraph gg = draw(LayeredFamily.ID,
                    Map.of("nodes", 30, "layers", 4, "edge_probability", 0.5, "links", links), 8);
            Knowledge k = gg.knowledge();
            assertEquals(4, k.tiers().size());
            Graph g = gg.dag();
            assertTrue(g.edgeCount() > 0);
            for (var e : g.edges()) {
                int from = g.hasDirected(e.a(), e.b()) ? e.a() : e.b();
                int to = from == e.a() ? e.b() : e.a();
                int gap = k.tierOf(g.name(to)) - k.tierOf(g.name(from));
                assertTrue(gap >= 1, "edge inside or against the tiers");
                if (links.equals("next-layer")) {
                    assertEquals(1, gap);
                }
                assertTrue(!k.isForbidden(g.name(from), g.name(to)));
            }
        }
    }

    @Test
    @DisplayName("a given graph is returned as is; a cyclic or undirected one is refused with a clear line")
    void given() {
        Graph dag = Graph.builder(List.of("a", "b", "c")).addDirected(0, 1).addDirected(1, 2).freeze();
        GivenGraphFamily f = GivenGraphFamily.of(dag);
        GeneratedGraph gg = f.generate(ParameterValues.none(), Seeds.random(1));
        assertEquals(dag, gg.dag());
        assertEquals(List.of("a", "b", "c"), gg.causalOrder());
        Graph cyclic = Graph.builder(List.of("a", "b", "c")).addDirected(0, 1).addDirected(1, 2).addDirected(2, 0)
                .freeze();
        assertTrue(assertThrows(IllegalArgumentException.class, () -> GivenGraphFamily.of(cyclic)).getMessage()
                .contains("cycle"));
        Graph undirected = Graph.builder(List.of("a", "b")).addUndirected(0, 1).freeze();
        assertTrue(assertThrows(IllegalArgumentException.class, () -> GivenGraphFamily.of(undirected)).getMessage()
                .contains("edge a tail-tail b"));
        assertThrows(IllegalStateException.class,
                () -> GraphFamilies.byId("given").generate(ParameterValues.none(), Seeds.random(1)));
    }

    @Test
    @DisplayName("an unknown family id is refused with the known ids listed")
    void unknownFamily() {
        String m = assertThrows(IllegalArgumentException.class, () -> GraphFamilies.byId("small-world")).getMessage();
        assertTrue(m.contains("small-world") && m.contains("erdos-renyi") && m.contains("layered"), m);
    }

    @Test
    @DisplayName("pinned: Erdős–Rényi with seed 42 gives exactly this graph (regression pin)")
    void pinnedOutput() {
        Graph g = draw(ErdosRenyiFamily.ID, Map.of("nodes", 6, "mean_degree", 2), 42).dag();
        assertEquals(PINNED_ER, g.toString());
    }

    static final String PINNED_ER = "X1 <-- X2; X1 <-- X5; X3 <-- X6; X4 --> X6";
}
