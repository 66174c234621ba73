package dev.touchstone.reports.charts;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GraphLayoutTest {

    /** A random DAG over n variables: each pair i &lt; j joined i → j with probability p (Erdős–Rényi over an order). */
    private static Graph randomDag(Random rnd, int n, double p, boolean cpdagLike) {
        List<String> names = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            names.add("X" + i);
        }
        MutableGraph g = Graph.builder(names);
        int[] perm = rnd.ints(0, 1_000_000).limit(n).toArray();
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        java.util.Arrays.sort(order, (a, b) -> Integer.compare(perm[a], perm[b]));
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                if (rnd.nextDouble() < p) {
                    if (cpdagLike && rnd.nextBoolean()) {
                        g.addUndirected(order[i], order[j]);
                    } else {
                        g.addDirected(order[i], order[j]);
                    }
                }
            }
        }
        return g.freeze();
    }

    /** Distance from a point to a segment, computed here independently of the layout's own helper (plain geometry). */
    private static double distance(double px, double py, double ax, double ay, double bx, double by) {
        double vx = bx - ax;
        double vy = by - ay;
        double t = ((px - ax) * vx + (py - ay) * vy) / (vx * vx + vy * vy);
        t = Math.max(0, Math.min(1, t));
        double cx = ax + t * vx;
        double cy = ay + t * vy;
        return Math.sqrt((px - cx) * (px - cx) + (py - cy) * (py - cy));
    }

    @Test
    void noEdgePassesWithinANodeRadiusOfAThirdNodeOnFiftyRandomTruths() {
        Random rnd = new Random(20261203);
        for (int t = 0; t < 50; t++) {
            int n = 4 + rnd.nextInt(17);
            double p = (1.5 + rnd.nextDouble() * 1.5) / (n - 1);
            Graph g = randomDag(rnd, n, p, t % 3 == 0);
            GraphLayout layout = GraphLayout.of(g);
            for (Edge e : g.edges()) {
                for (int w = 0; w < n; w++) {
                    if (w == e.a() || w == e.b()) {
                        continue;
                    }
                    double d = distance(layout.x(w), layout.y(w), layout.x(e.a()), layout.y(e.a()),
                            layout.x(e.b()), layout.y(e.b()));
                    assertTrue(d > GraphLayout.RADIUS, "truth " + t + " (" + n + " nodes): edge " + g.name(e.a())
                            + "-" + g.name(e.b()) + " passes " + d + " from " + g.name(w));
                }
            }
            for (int v = 0; v < n; v++) {
                assertTrue(layout.x(v) >= 0 && layout.x(v) <= layout.width() && layout.y(v) >= 0
                        && layout.y(v) <= layout.height(), "inside the box");
                for (int w = v + 1; w < n; w++) {
                    assertTrue(Math.hypot(layout.x(v) - layout.x(w), layout.y(v) - layout.y(w)) >= 2 * GraphLayout.RADIUS,
                            "nodes do not overlap");
                }
            }
        }
    }

    @Test
    void layersFollowTheCausalOrder() {
        // A → B → C and A → C: every directed edge points down the page (layered by longest path, Sugiyama et al. 1981).
        Graph g = Graph.builder(List.of("A", "B", "C")).addDirected(0, 1).addDirected(1, 2).addDirected(0, 2).freeze();
        GraphLayout l = GraphLayout.of(g);
        assertTrue(l.y(0) < l.y(1) && l.y(1) < l.y(2), "parents above children");
        // a chain's nodes are staggered, never on one vertical line
        assertTrue(l.x(0) != l.x(1) || l.x(1) != l.x(2), "not on one line");
    }

    @Test
    void oneLayoutPerTruthIsReused() {
        Graph g = randomDag(new Random(7), 9, 0.3, false);
        GraphLayout.Cache cache = new GraphLayout.Cache();
        GraphLayout first = cache.of(g);
        assertTrue(first == cache.of(g), "the same truth gets the same layout object");
        GraphLayout fresh = GraphLayout.of(g);
        for (int v = 0; v < g.size(); v++) {
            assertEquals(first.x(v), fresh.x(v));
            assertEquals(first.y(v), fresh.y(v));
        }
    }

    @Test
    void estimateEdgesTheLayoutDidNotPlanForBendAroundNodes() {
        Random rnd = new Random(99);
        int bent = 0;
        for (int t = 0; t < 50; t++) {
            int n = 5 + rnd.nextInt(12);
            Graph truth = randomDag(rnd, n, 2.0 / (n - 1), false);
            Graph estimate = randomDag(rnd, n, 3.0 / (n - 1), t % 2 == 0);
            GraphLayout layout = GraphLayout.of(truth);
            GraphPicture picture = new GraphPicture(truth, estimate, layout);
            for (Edge e : estimate.edges()) {
                java.awt.geom.Point2D.Double a = new java.awt.geom.Point2D.Double(layout.x(e.a()), layout.y(e.a()));
                java.awt.geom.Point2D.Double b = new java.awt.geom.Point2D.Double(layout.x(e.b()), layout.y(e.b()));
                var c = picture.control(e.a(), e.b());
                bent += c == null ? 0 : 1;
                // sample the drawn line or quadratic Bezier B(t) = (1-t)^2 a + 2t(1-t) c + t^2 b at 400 points
                for (int w = 0; w < n; w++) {
                    if (w == e.a() || w == e.b()) {
                        continue;
                    }
                    double least = Double.MAX_VALUE;
                    for (int k = 0; k <= 400; k++) {
                        double u = k / 400.0;
                        double cx = c == null ? (a.x + b.x) / 2 : c.getX();
                        double cy = c == null ? (a.y + b.y) / 2 : c.getY();
                        double x = (1 - u) * (1 - u) * a.x + 2 * u * (1 - u) * cx + u * u * b.x;
                        double y = (1 - u) * (1 - u) * a.y + 2 * u * (1 - u) * cy + u * u * b.y;
                        least = Math.min(least, Math.hypot(x - layout.x(w), y - layout.y(w)));
                    }
                    assertTrue(least > GraphLayout.RADIUS, "truth " + t + ": estimate edge " + e + " passes " + least
                            + " from node " + w);
                }
            }
        }
        assertTrue(bent > 0, "some extra edges needed a bend, so the check above was exercised");
    }
}
