package dev.touchstone.metrics.sid;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagEnumeration;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.metrics.testing.SmallDags;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class StructuralInterventionDistanceTest {

    private static List<Graph> dags4;
    /** fast[g][h]: the fast SID of DAG h from true DAG g, over all 4-node DAGs. */
    private static long[][] fast;

    @BeforeAll
    static void enumerate() {
        dags4 = DagEnumeration.all(4);
        fast = new long[dags4.size()][dags4.size()];
        for (int a = 0; a < dags4.size(); a++) {
            for (int b = 0; b < dags4.size(); b++) {
                fast[a][b] = StructuralInterventionDistance.between(dags4.get(a), dags4.get(b)).sid();
            }
        }
    }

    private static Graph graph(int n, int... fromTo) {
        MutableGraph g = Graph.builder(RandomDags.names(n));
        for (int k = 0; k < fromTo.length; k += 2) {
            g.addDirected(fromTo[k], fromTo[k + 1]);
        }
        return g.freeze();
    }

    @Test
    @DisplayName("test machinery: 543 labelled DAGs on 4 nodes (OEIS A003024) in 185 equivalence classes (OEIS A007984)")
    void enumerationCounts() {
        assertEquals(543, dags4.size());
        List<List<Graph>> classes = SmallDags.classes(dags4);
        assertEquals(185, classes.size());
        assertEquals(11, SmallDags.classes(DagEnumeration.all(3)).size());
        // the CPDAG by definition (directed where all members agree) is core's CPDAG of every member
        for (List<Graph> members : classes) {
            Graph byDefinition = SmallDags.cpdag(members);
            for (Graph m : members) {
                assertEquals(byDefinition, Cpdags.of(m));
            }
        }
    }

    @Test
    @DisplayName("hand-worked: chain X1 → X2 against the empty graph (1) and the reversed edge (2) — definition of Peters and Bühlmann 2015")
    void chain() {
        Graph g = graph(2, 0, 1);
        // empty H: (X1, X2) adjusts for ∅, valid (no back-door path) → right;
        // (X2, X1) adjusts for ∅, but X2 and X1 are adjacent, so ∅ does not d-separate them while X1 is
        // not a descendant of X2 → wrong. SID = 1.
        assertEquals(1L, StructuralInterventionDistance.between(g, graph(2)).sid());
        // reversed H: X2 → X1. (X1, X2): X2 ∈ Pa_H(X1) claims X2 is unaffected, but X2 descends from X1 → wrong;
        // (X2, X1): Pa_H(X2) = ∅, wrong as above. SID = 2.
        assertEquals(2L, StructuralInterventionDistance.between(g, graph(2, 1, 0)).sid());
    }

    @Test
    @DisplayName("hand-worked: confounded pair Z → X → Y, Z → Y with Z → X missing: SHD 1, SID 2 (Peters and Bühlmann 2015: SID and SHD disagree)")
    void confounder() {
        // indices: X1 = Z, X2 = X, X3 = Y
        Graph g = graph(3, 0, 1, 0, 2, 1, 2);
        Graph h = graph(3, 0, 2, 1, 2);
        // (X, Y): Pa_H(X) = ∅ leaves the back-door path X ← Z → Y open → wrong.
        // (X, Z): Pa_H(X) = ∅; Z is no descendant of X, but ∅ does not separate the adjacent X, Z → wrong.
        // (Z, X), (Z, Y): Z has no parents in G, ∅ is valid → right.
        // (Y, X), (Y, Z): both in Pa_H(Y) and neither descends from Y → right.
        assertEquals(2L, StructuralInterventionDistance.between(g, h).sid());
    }

    @Test
    @DisplayName("SID(G, G) = 0 and SID(G, H) ≤ p(p−1) on all 4-node DAGs (Peters and Bühlmann 2015)")
    void zeroOnItself() {
        for (Graph g : dags4) {
            assertEquals(0L, StructuralInterventionDistance.between(g, g).sid(), g.toString());
        }
    }

    @Test
    @DisplayName("fast SID equals the pair-by-pair adjustment criterion (Shpitser, VanderWeele and Robins 2010) on all 543 × 543 pairs of 4-node DAGs")
    void allPairsOfFourNodeDags() {
        int p = 4;
        // the direct answer depends only on (G, i, Pa_H(i)): tabulate it once per true DAG
        long[][] table = new long[p][1 << p];
        for (int a = 0; a < dags4.size(); a++) {
            Graph g = dags4.get(a);
            DirectSid direct = new DirectSid(g);
            for (int i = 0; i < p; i++) {
                for (int mask = 0; mask < (1 << p); mask++) {
                    if ((mask & (1 << i)) == 0) {
                        table[i][mask] = direct.wrong(i, members(mask));
                    }
                }
            }
            for (int b = 0; b < dags4.size(); b++) {
                Graph h = dags4.get(b);
                long expected = 0;
                for (int i = 0; i < p; i++) {
                    expected += table[i][mask(h.parents(i))];
                }
                assertEquals(expected, fast[a][b], () -> "G: " + g + " | H: " + h);
                assertTrue(fast[a][b] <= p * (p - 1));
            }
        }
    }

    @Test
    @DisplayName("fast SID equals the direct criterion on seeded random DAG pairs with 5 to 8 nodes")
    void randomLargerPairs() {
        for (int seed = 0; seed < 150; seed++) {
            int n = 5 + seed % 4;
            Graph g = RandomDags.erdosRenyi(n, 2.5, 1000 + seed);
            Graph h = RandomDags.erdosRenyi(n, 2.5, 5000 + seed);
            assertEquals(new DirectSid(g).sid(h), StructuralInterventionDistance.between(g, h).sid(), "seed " + seed);
            // and against a perturbation of G, where most pairs are right
            Graph near = perturb(g, seed);
            assertEquals(new DirectSid(g).sid(near), StructuralInterventionDistance.between(g, near).sid(), "near, seed " + seed);
        }
    }

    @Test
    @DisplayName("CPDAG bounds bracket the SID of every DAG in the class, for every true 4-node DAG and all 185 classes (Peters and Bühlmann 2015)")
    void boundsBracketTheClass() {
        List<List<Graph>> classes = SmallDags.classes(dags4);
        java.util.Map<Graph, Integer> position = new java.util.HashMap<>();
        for (int b = 0; b < dags4.size(); b++) {
            position.put(dags4.get(b), b);
        }
        List<Graph> cpdags = new java.util.ArrayList<>();
        for (List<Graph> members : classes) {
            cpdags.add(Cpdags.of(members.get(0)));
        }
        for (int a = 0; a < dags4.size(); a++) {
            Graph g = dags4.get(a);
            for (int c = 0; c < classes.size(); c++) {
                List<Graph> members = classes.get(c);
                Graph cpdag = cpdags.get(c);
                SidResult bounds = StructuralInterventionDistance.between(g, cpdag);
                long min = Long.MAX_VALUE;
                long max = Long.MIN_VALUE;
                for (Graph d : members) {
                    long s = fast[a][position.get(d)];
                    min = Math.min(min, s);
                    max = Math.max(max, s);
                }
                final long lo = min;
                final long hi = max;
                assertTrue(bounds.lower() <= min && max <= bounds.upper(),
                        () -> "G: " + g + " | class: " + cpdag + " bounds " + bounds + " members " + lo + "…" + hi);
                if (members.size() == 1) {
                    assertEquals(min, bounds.sid());
                } else {
                    assertNull(bounds.sid());
                }
            }
        }
    }

    @Test
    @DisplayName("refuses a cyclic truth and estimates with bidirected edges")
    void refusesBadInput() {
        Graph cyclic = graph(3, 0, 1, 1, 2, 2, 0);
        assertThrows(IllegalArgumentException.class, () -> StructuralInterventionDistance.between(cyclic, graph(3)));
        Graph bi = Graph.builder(RandomDags.names(2)).addBidirected(0, 1).freeze();
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> StructuralInterventionDistance.between(graph(2, 0, 1), bi));
        assertTrue(e.getMessage().contains("X1 arrow-arrow X2"), e.getMessage());
    }

    private static Graph perturb(Graph g, int seed) {
        MutableGraph m = g.toMutable();
        List<dev.touchstone.core.graph.Edge> edges = g.edges();
        if (!edges.isEmpty()) {
            dev.touchstone.core.graph.Edge e = edges.get(seed % edges.size());
            m.removeEdge(e.a(), e.b());
        }
        return m.freeze();
    }

    private static int[] members(int mask) {
        int[] out = new int[Integer.bitCount(mask)];
        int k = 0;
        for (int v = 0; v < 32; v++) {
            if ((mask & (1 << v)) != 0) {
                out[k++] = v;
            }
        }
        return out;
    }

    private static int mask(int[] set) {
        int m = 0;
        for (int v : set) {
            m |= 1 << v;
        }
        return m;
    }
}
