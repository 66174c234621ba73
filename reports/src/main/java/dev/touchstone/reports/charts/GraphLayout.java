package dev.touchstone.reports.charts;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

/**
 * Node positions for pictures of one truth, computed once from the truth alone and reused for
 * every estimate of it. Layered by causal order in the manner of Sugiyama, Tagawa and Toda
 * (1981, "Methods for visual understanding of hierarchical system structures", IEEE SMC 11):
 * each variable sits on the layer of its longest directed path from a source (undirected and
 * other edges follow the variables' order where no direction is known), layers are ordered by
 * the barycentre heuristic, alternate nodes of a layer are staggered so that no three sit on
 * one line, and a final pass moves any node that lies within {@link #CLEARANCE} of an edge
 * between two other nodes away from it, so no edge is hidden behind a node.
 */
public final class GraphLayout {

    /** Node radius in the picture. */
    public static final double RADIUS = 13;
    /** The least distance kept between a node's centre and any edge between two other nodes. */
    public static final double CLEARANCE = RADIUS + 4;
    private static final double MARGIN = 30;
    private static final double LAYER_GAP = 70;
    private static final double NODE_GAP = 56;

    private final double[] x;
    private final double[] y;
    private final double width;
    private final double height;

    private GraphLayout(double[] x, double[] y, double width, double height) {
        this.x = x;
        this.y = y;
        this.width = width;
        this.height = height;
    }

    public double x(int v) {
        return x[v];
    }

    public double y(int v) {
        return y[v];
    }

    /** Width of the box the nodes lie in, margins included. */
    public double width() {
        return width;
    }

    public double height() {
        return height;
    }

    public int size() {
        return x.length;
    }

    /** The layout of a truth (deterministic: the same graph always gets the same positions). */
    public static GraphLayout of(Graph truth) {
        int n = truth.size();
        int[] order = order(truth);
        int[] rank = new int[n];
        for (int i = 0; i < n; i++) {
            rank[order[i]] = i;
        }
        int[] layer = new int[n];
        for (int v : order) {
            for (int u : truth.neighbours(v)) {
                if (rank[u] < rank[v]) {
                    layer[v] = Math.max(layer[v], layer[u] + 1);
                }
            }
        }
        int layers = n == 0 ? 0 : Arrays.stream(layer).max().getAsInt() + 1;
        List<List<Integer>> byLayer = new ArrayList<>();
        for (int l = 0; l < layers; l++) {
            byLayer.add(new ArrayList<>());
        }
        for (int v : order) {
            byLayer.get(layer[v]).add(v);
        }
        barycentre(truth, byLayer);
        GraphLayout best = null;
        int bestConflicts = Integer.MAX_VALUE;
        // Wider spacing gives the repair room; the first spacing that leaves every edge clear is kept.
        for (double spread : new double[] {1, 1.3, 1.7, 2.2, 3}) {
            GraphLayout l = place(truth, byLayer, spread);
            int c = l.conflicts(truth);
            if (best == null || c < bestConflicts) {
                best = l;
                bestConflicts = c;
            }
            if (bestConflicts == 0) {
                break;
            }
        }
        return best;
    }

    private static GraphLayout place(Graph truth, List<List<Integer>> byLayer, double spread) {
        int n = truth.size();
        int layers = byLayer.size();
        double gap = NODE_GAP * spread;
        int widest = byLayer.stream().mapToInt(List::size).max().orElse(1);
        double width = Math.max(300, 2 * MARGIN + (widest - 1) * gap + gap / 2);
        double height = Math.max(200, 2 * MARGIN + (layers - 1) * LAYER_GAP + LAYER_GAP / 2);
        double[] x = new double[n];
        double[] y = new double[n];
        for (int l = 0; l < layers; l++) {
            List<Integer> row = byLayer.get(l);
            double span = (row.size() - 1) * gap;
            double start = (width - span) / 2 + (l % 2 == 1 ? gap / 4 : -gap / 4);
            for (int i = 0; i < row.size(); i++) {
                int v = row.get(i);
                x[v] = start + i * gap;
                y[v] = MARGIN + l * LAYER_GAP + (i % 2 == 1 ? LAYER_GAP / 4 : 0);
            }
        }
        repair(truth, x, y, width, height);
        return new GraphLayout(x, y, width, height);
    }

    /** Node–edge pairs closer than {@link #CLEARANCE}, plus node pairs that overlap. */
    int conflicts(Graph g) {
        int count = 0;
        List<Edge> edges = g.edges();
        for (int w = 0; w < x.length; w++) {
            for (Edge e : edges) {
                if (e.a() != w && e.b() != w && distanceToSegment(x[w], y[w], x[e.a()], y[e.a()], x[e.b()],
                        y[e.b()]) < CLEARANCE) {
                    count++;
                }
            }
            for (int v = w + 1; v < x.length; v++) {
                if (Math.hypot(x[w] - x[v], y[w] - y[v]) < 2 * RADIUS + 4) {
                    count++;
                }
            }
        }
        return count;
    }

    /**
     * A causal order: Kahn's topological sort over the directed edges, smallest index first;
     * edges without a direction are taken from the smaller index to the larger where that
     * keeps the order acyclic (a cycle is broken at the smallest remaining index).
     */
    private static int[] order(Graph g) {
        int n = g.size();
        boolean[][] before = new boolean[n][n];
        for (Edge e : g.edges()) {
            if (e.isDirected()) {
                int from = e.tail();
                before[from][e.other(from)] = true;
            }
        }
        for (Edge e : g.edges()) {
            if (!e.isDirected()) {
                int lo = Math.min(e.a(), e.b());
                int hi = Math.max(e.a(), e.b());
                if (!before[hi][lo]) {
                    before[lo][hi] = true;
                }
            }
        }
        int[] out = new int[n];
        boolean[] done = new boolean[n];
        for (int k = 0; k < n; k++) {
            int pick = -1;
            for (int v = 0; v < n && pick < 0; v++) {
                if (!done[v]) {
                    boolean free = true;
                    for (int u = 0; u < n && free; u++) {
                        free = done[u] || !before[u][v];
                    }
                    if (free) {
                        pick = v;
                    }
                }
            }
            if (pick < 0) {
                for (int v = 0; v < n && pick < 0; v++) {
                    pick = done[v] ? -1 : v;
                }
            }
            done[pick] = true;
            out[k] = pick;
        }
        return out;
    }

    /** Four down-and-up sweeps ordering each layer by the mean position of its neighbours in the layer before. */
    private static void barycentre(Graph g, List<List<Integer>> layers) {
        Map<Integer, Double> pos = new HashMap<>();
        for (List<Integer> row : layers) {
            for (int i = 0; i < row.size(); i++) {
                pos.put(row.get(i), (double) i);
            }
        }
        for (int sweep = 0; sweep < 4; sweep++) {
            boolean down = sweep % 2 == 0;
            for (int k = 1; k < layers.size(); k++) {
                int l = down ? k : layers.size() - 1 - k;
                int ref = down ? l - 1 : l + 1;
                List<Integer> refRow = layers.get(ref);
                List<Integer> row = layers.get(l);
                Map<Integer, Double> key = new HashMap<>();
                for (int v : row) {
                    double sum = 0;
                    int count = 0;
                    for (int u : g.neighbours(v)) {
                        if (refRow.contains(u)) {
                            sum += pos.get(u);
                            count++;
                        }
                    }
                    key.put(v, count == 0 ? pos.get(v) : sum / count);
                }
                row.sort((a, b) -> Double.compare(key.get(a), key.get(b)));
                for (int i = 0; i < row.size(); i++) {
                    pos.put(row.get(i), (double) i);
                }
            }
        }
    }

    /** Distance from (px, py) to the segment (ax, ay)–(bx, by). */
    public static double distanceToSegment(double px, double py, double ax, double ay, double bx, double by) {
        double dx = bx - ax;
        double dy = by - ay;
        double len2 = dx * dx + dy * dy;
        double t = len2 == 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / len2));
        return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
    }

    /**
     * Moves nodes lying too near an edge between two other nodes (or too near another node)
     * sideways, away from it; seeded jitter breaks a stalemate. Deterministic for a graph.
     */
    private static void repair(Graph g, double[] x, double[] y, double width, double height) {
        int n = g.size();
        List<Edge> edges = g.edges();
        Random jitter = new Random(31L * n + edges.size());
        for (int round = 0; round < 400; round++) {
            boolean moved = false;
            for (int w = 0; w < n; w++) {
                for (int v = 0; v < n; v++) {
                    double d = Math.hypot(x[w] - x[v], y[w] - y[v]);
                    if (v != w && d < 2 * RADIUS + 6) {
                        double push = (2 * RADIUS + 8 - d) / 2;
                        double sign = x[w] > x[v] || (x[w] == x[v] && w > v) ? 1 : -1;
                        x[w] = clamp(x[w] + sign * push, width);
                        moved = true;
                    }
                }
                for (Edge e : edges) {
                    if (e.a() == w || e.b() == w) {
                        continue;
                    }
                    double d = distanceToSegment(x[w], y[w], x[e.a()], y[e.a()], x[e.b()], y[e.b()]);
                    if (d < CLEARANCE) {
                        double ex = x[e.b()] - x[e.a()];
                        double ey = y[e.b()] - y[e.a()];
                        double len = Math.hypot(ex, ey);
                        // unit normal of the edge, turned towards the node
                        double nx = -ey / len;
                        double ny = ex / len;
                        double side = (x[w] - x[e.a()]) * nx + (y[w] - y[e.a()]) * ny;
                        if (Math.abs(side) < 1e-9) {
                            side = jitter.nextBoolean() ? 1 : -1;
                        }
                        double step = CLEARANCE - d + 2 + (round > 100 ? jitter.nextDouble() * 6 : 0);
                        x[w] = clamp(x[w] + Math.signum(side) * nx * step, width);
                        y[w] = Math.max(MARGIN / 2, Math.min(height - MARGIN / 2, y[w] + Math.signum(side) * ny * step));
                        moved = true;
                    }
                }
            }
            if (!moved) {
                return;
            }
        }
    }

    private static double clamp(double v, double width) {
        return Math.max(MARGIN / 2, Math.min(width - MARGIN / 2, v));
    }

    /** Layouts by truth, so every estimate of one truth is drawn over the same positions. */
    public static final class Cache {
        private final Map<String, GraphLayout> byTruth = new HashMap<>();

        /** The layout of this truth's variables and skeleton, computed on first use. */
        public GraphLayout of(Graph truth) {
            StringBuilder key = new StringBuilder(String.join("\u0000", truth.names())).append('\u0001');
            for (Edge e : truth.edges()) {
                key.append(Math.min(e.a(), e.b())).append('-').append(Math.max(e.a(), e.b())).append(',');
            }
            return byTruth.computeIfAbsent(key.toString(), k -> GraphLayout.of(truth));
        }
    }
}
