package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;

import java.util.ArrayList;
import java.util.List;

/** Slow, obviously correct reference versions of the algorithms, for tests only. */
final class BruteForce {

    private BruteForce() {
    }

    /**
     * Every consistent extension of a small PDAG: each orientation of its undirected edges
     * that is acyclic and has exactly the PDAG's v-structures (Dor and Tarsi 1992, definition).
     */
    static List<Graph> extensions(Graph pdag) {
        List<Edge> undirected = new ArrayList<>();
        for (Edge e : pdag.edges()) {
            if (e.isUndirected()) {
                undirected.add(e);
            }
        }
        if (undirected.size() > 20) {
            throw new IllegalArgumentException("too many undirected edges for brute force");
        }
        var vs = VStructures.of(pdag);
        List<Graph> out = new ArrayList<>();
        for (int mask = 0; mask < 1 << undirected.size(); mask++) {
            MutableGraph g = pdag.toMutable();
            for (int i = 0; i < undirected.size(); i++) {
                Edge e = undirected.get(i);
                if ((mask >>> i & 1) == 0) {
                    g.orient(e.a(), e.b());
                } else {
                    g.orient(e.b(), e.a());
                }
            }
            Graph d = g.freeze();
            if (Ancestry.isAcyclic(d) && VStructures.of(d).equals(vs)) {
                out.add(d);
            }
        }
        return out;
    }

    /** The edges shared by all consistent extensions directed, the rest undirected (null if none). */
    static Graph maximalOrientation(Graph pdag) {
        List<Graph> ext = extensions(pdag);
        return ext.isEmpty() ? null : SmallDags.essentialGraph(ext);
    }

    /** Applies R1–R4 by full sweeps over all undirected edges until nothing changes. */
    static void sweepToClosure(MutableGraph g) {
        boolean changed = true;
        while (changed) {
            changed = false;
            for (int a = 0; a < g.size(); a++) {
                for (int b : g.undirectedNeighbours(a)) {
                    if (g.hasUndirected(a, b) && implies(g, a, b)) {
                        g.orient(a, b);
                        changed = true;
                    }
                }
            }
        }
    }

    /** Each rule checked literally over the neighbours of a (c) and of b (d). */
    private static boolean implies(MutableGraph g, int a, int b) {
        for (int c : g.neighbours(a)) {
            if (c == b) {
                continue;
            }
            if (g.hasDirected(c, a) && !g.adjacent(c, b)) {
                return true; // R1
            }
            if (g.hasDirected(a, c) && g.hasDirected(c, b)) {
                return true; // R2
            }
            for (int d : g.neighbours(b)) {
                if (d == a || d == c) {
                    continue;
                }
                if (g.hasUndirected(a, c) && g.hasDirected(c, b) && g.hasUndirected(a, d) && g.hasDirected(d, b)
                        && !g.adjacent(c, d)) {
                    return true; // R3
                }
                if (g.hasUndirected(a, c) && g.hasDirected(c, d) && g.hasDirected(d, b) && g.adjacent(a, d)
                        && !g.adjacent(c, b)) {
                    return true; // R4
                }
            }
        }
        return false;
    }
}
