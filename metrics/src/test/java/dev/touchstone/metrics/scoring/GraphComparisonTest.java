package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.metrics.truth.Truth;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GraphComparisonTest {

    /** A random graph with any marks: each pair joined with probability q, each end tail/arrow/circle. */
    static Graph randomMarks(int n, double q, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        MutableGraph g = Graph.builder(RandomDags.names(n));
        Mark[] marks = Mark.values();
        for (int a = 0; a < n; a++) {
            for (int b = a + 1; b < n; b++) {
                if (rng.nextDouble() < q) {
                    g.addEdge(a, b, marks[rng.nextInt(3)], marks[rng.nextInt(3)]);
                }
            }
        }
        return g.freeze();
    }

    @Test
    @DisplayName("one-pass counts equal a pair-by-pair count straight from the definitions (docs/dev/metrics.md), on seeded random mixed graphs")
    void countsMatchDefinitions() {
        for (int seed = 0; seed < 200; seed++) {
            int n = 2 + seed % 12;
            Graph t = randomMarks(n, 0.4, seed);
            Graph e = randomMarks(n, 0.4, 10_000 + seed);
            EdgeCounts c = EdgeCounts.of(t, e);
            long shd = 0;
            long common = 0;
            long trueArrows = 0;
            long estArrows = 0;
            long correctArrows = 0;
            long correctTails = 0;
            long trueTails = 0;
            long estTails = 0;
            for (int a = 0; a < n; a++) {
                for (int b = 0; b < n; b++) {
                    if (a == b) {
                        continue;
                    }
                    Mark ta = t.markAt(a, b);
                    Mark ea = e.markAt(a, b);
                    trueArrows += ta == Mark.ARROW ? 1 : 0;
                    estArrows += ea == Mark.ARROW ? 1 : 0;
                    correctArrows += ea == Mark.ARROW && ta == Mark.ARROW ? 1 : 0;
                    correctTails += ea == Mark.TAIL && ta == Mark.TAIL ? 1 : 0;
                    trueTails += ta == Mark.TAIL ? 1 : 0;
                    estTails += ea == Mark.TAIL ? 1 : 0;
                    if (a < b) {
                        boolean inT = t.adjacent(a, b);
                        boolean inE = e.adjacent(a, b);
                        common += inT && inE ? 1 : 0;
                        boolean same = inT == inE && (!inT || ta == ea && t.markAt(b, a) == e.markAt(b, a));
                        shd += same ? 0 : 1;
                    }
                }
            }
            assertEquals(shd, c.differingPairs(), "seed " + seed);
            assertEquals(common, c.edges().common());
            assertEquals(trueArrows, c.arrows().inTruth());
            assertEquals(estArrows, c.arrows().inEstimate());
            assertEquals(correctArrows, c.arrows().correct());
            assertEquals(correctTails, c.tails().correct());
            assertEquals(trueTails, c.tails().inTruth());
            assertEquals(estTails, c.tails().inEstimate());
            assertEquals(t.edgeCount(), c.edges().inTruth());
            assertEquals(e.edgeCount(), c.edges().inEstimate());
        }
    }

    @Test
    @DisplayName("adjacency_fpr, wrong_arrowheads and undirected_edges equal a pair-by-pair count from their definitions (Kalisch and Bühlmann 2007; Ramsey, Zhang and Spirtes 2006), seeded random DAG truths and PDAG estimates")
    void newCountsMatchDefinitions() {
        for (int seed = 0; seed < 200; seed++) {
            int n = 2 + seed % 12;
            Graph truth = RandomDags.erdosRenyi(n, 2, seed);
            // an estimate with directed and undirected edges (a PDAG): a random DAG with every third edge undirected
            MutableGraph m = Graph.builder(truth.names());
            List<Edge> edges = RandomDags.erdosRenyi(n, 2.5, 50_000 + seed).edges();
            for (int k = 0; k < edges.size(); k++) {
                Edge x = edges.get(k);
                m.addEdge(x.a(), x.b(), k % 3 == 0 ? Mark.TAIL : x.atA(), k % 3 == 0 ? Mark.TAIL : x.atB());
            }
            Graph est = m.freeze();
            long extra = 0;
            long nonAdjacent = 0;
            long wrong = 0;
            long undirected = 0;
            for (int a = 0; a < n; a++) {
                for (int b = 0; b < n; b++) {
                    if (a == b) {
                        continue;
                    }
                    if (est.markAt(b, a) == Mark.ARROW && !(truth.adjacent(a, b) && truth.markAt(b, a) == Mark.ARROW)) {
                        wrong++;
                    }
                    if (a < b) {
                        nonAdjacent += truth.adjacent(a, b) ? 0 : 1;
                        extra += est.adjacent(a, b) && !truth.adjacent(a, b) ? 1 : 0;
                        undirected += est.hasUndirected(a, b) ? 1 : 0;
                    }
                }
            }
            Map<String, Double> v = Scorer.scoreAll(Truth.of(truth, GraphClass.DAG), est, GraphClass.CPDAG);
            assertEquals(nonAdjacent == 0 ? null : (double) extra / nonAdjacent, v.get("adjacency_fpr"), "seed " + seed);
            assertEquals((double) wrong, v.get("wrong_arrowheads"), "seed " + seed);
            assertEquals((double) undirected, v.get("undirected_edges"), "seed " + seed);
        }
    }

    @Test
    @DisplayName("SHD is a metric on graphs of one class: zero iff equal, symmetric, triangle inequality (seeded random DAGs and mixed graphs)")
    void shdIsAMetric() {
        for (int seed = 0; seed < 300; seed++) {
            int n = 3 + seed % 10;
            Graph[] g = seed % 2 == 0
                    ? new Graph[] {RandomDags.erdosRenyi(n, 2, seed), RandomDags.erdosRenyi(n, 2, seed + 1),
                                   RandomDags.erdosRenyi(n, 2, seed + 2)}
                    : new Graph[] {randomMarks(n, 0.3, seed), randomMarks(n, 0.3, seed + 1), randomMarks(n, 0.3, seed + 2)};
            long ab = shd(g[0], g[1]);
            long ba = shd(g[1], g[0]);
            long bc = shd(g[1], g[2]);
            long ac = shd(g[0], g[2]);
            assertEquals(ab, ba, "symmetry, seed " + seed);
            assertTrue(ac <= ab + bc, "triangle inequality, seed " + seed);
            assertEquals(0, shd(g[0], g[0]));
            assertEquals(g[0].sameEdges(g[1]), ab == 0, "zero iff equal, seed " + seed);
        }
    }

    private static long shd(Graph t, Graph e) {
        return EdgeCounts.of(t, e).differingPairs();
    }

    @Test
    @DisplayName("different variable sets are refused with the names that differ")
    void refusesDifferentVariables() {
        Graph t = Graph.empty(List.of("A", "B", "C"));
        Graph e = Graph.empty(List.of("A", "B", "D"));
        IllegalArgumentException x = assertThrows(IllegalArgumentException.class,
                () -> GraphComparison.of(Truth.of(t, GraphClass.DAG), e, GraphClass.DAG));
        assertEquals("the estimate and the truth are over different variables (only in the truth: C; only in the estimate: D)",
                x.getMessage());
    }

    @Test
    @DisplayName("the same variables in another order give the same scores")
    void reorderedVariables() {
        Graph t = Graph.builder(List.of("A", "B", "C")).addDirected(0, 1).addDirected(1, 2).freeze();
        Graph same = Graph.builder(List.of("A", "B", "C")).addDirected(0, 1).addDirected(2, 1).freeze();
        Graph shuffled = Graph.builder(List.of("C", "A", "B")).addDirected(1, 2).addDirected(0, 2).freeze();
        Map<String, Double> a = Scorer.scoreAll(Truth.of(t, GraphClass.DAG), same, GraphClass.DAG);
        Map<String, Double> b = Scorer.scoreAll(Truth.of(t, GraphClass.DAG), shuffled, GraphClass.DAG);
        assertEquals(a, b);
        assertNotEquals(0.0, a.get("shd"));
    }

    @Test
    @DisplayName("an edge the declared class cannot have is refused, naming the edge")
    void refusesEdgesOutsideTheClass() {
        Graph t = Graph.empty(List.of("A", "B"));
        Graph e = Graph.builder(List.of("A", "B")).addUndirected(0, 1).freeze();
        IllegalArgumentException x = assertThrows(IllegalArgumentException.class,
                () -> GraphComparison.of(Truth.of(t, GraphClass.DAG), e, GraphClass.DAG));
        assertTrue(x.getMessage().contains("A tail-tail B"), x.getMessage());
    }

    @Test
    @DisplayName("the registry lists every defined metric once, each with a direction, a range and classes")
    void registry() {
        for (String name : List.of("shd", "adjacency_precision", "adjacency_recall", "adjacency_f1", "orientation_precision",
                "orientation_recall", "orientation_f1", "directed_tpr", "directed_fdr", "directed_fpr", "sid", "sid_lower",
                "sid_upper", "exact", "edges", "seconds", "cpu_seconds", "allocated_mb", "tests", "scores",
                "tail_precision", "tail_recall", "adjacency_fpr", "wrong_arrowheads", "undirected_edges")) {
            Metric m = MetricRegistry.get(name);
            assertEquals(name, m.name());
            assertTrue(!m.appliesTo().isEmpty() && !m.definition().isBlank());
        }
        assertEquals(MetricRegistry.names().size(), new java.util.HashSet<>(MetricRegistry.names()).size());
        IllegalArgumentException x = assertThrows(IllegalArgumentException.class, () -> MetricRegistry.get("accuracy"));
        assertTrue(x.getMessage().startsWith("unknown metric 'accuracy' (known: shd, "), x.getMessage());
    }

    @Test
    @DisplayName("every value lies in its metric's declared range on seeded random DAG pairs")
    void valuesInRange() {
        for (int seed = 0; seed < 50; seed++) {
            int n = 3 + seed % 8;
            Graph t = RandomDags.erdosRenyi(n, 2, seed);
            Graph e = RandomDags.erdosRenyi(n, 2, 777 + seed);
            Map<String, Double> m = Scorer.scoreAll(Truth.of(t, GraphClass.DAG), e, GraphClass.DAG);
            for (StructuralMetric metric : MetricRegistry.structural()) {
                Double x = m.get(metric.name());
                if (x != null) {
                    assertTrue(metric.range().contains(x), metric.name() + " = " + x);
                }
            }
            assertTrue(m.get("shd") <= n * (n - 1) / 2.0 && m.get("sid") <= n * (n - 1));
        }
    }
}
