package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

import java.util.PriorityQueue;

/**
 * Ancestors, descendants and topological order over the directed edges of a graph
 * (undirected, bidirected and circle-marked edges are ignored). Each call is a single
 * O(|V| + |E|) traversal (Cormen et al., Introduction to Algorithms, §22.4).
 */
public final class Ancestry {

    private Ancestry() {
    }

    /** The ancestors of the given variables, the variables themselves included. */
    public static boolean[] ancestors(Graph g, int... of) {
        return reach(g, of, true);
    }

    /** The descendants of the given variables, the variables themselves included. */
    public static boolean[] descendants(Graph g, int... of) {
        return reach(g, of, false);
    }

    /** Whether {@code a} is an ancestor of {@code b} (every variable is its own ancestor). */
    public static boolean isAncestor(Graph g, int a, int b) {
        return reach(g, new int[] {b}, true)[a];
    }

    private static boolean[] reach(Graph g, int[] start, boolean up) {
        int n = g.size();
        boolean[] seen = new boolean[n];
        int[] stack = new int[n];
        int top = 0;
        for (int s : start) {
            if (!seen[s]) {
                seen[s] = true;
                stack[top++] = s;
            }
        }
        while (top > 0) {
            int v = stack[--top];
            for (int k = 0, d = g.degree(v); k < d; k++) {
                // Parent of v: tail at the neighbour, arrow at v. Child: the reverse.
                boolean step = up
                        ? g.markHere(v, k) == Mark.ARROW
                          && g.markThere(v, k) == Mark.TAIL
                        : g.markHere(v, k) == Mark.TAIL
                          && g.markThere(v, k) == Mark.ARROW;
                int w = g.neighbour(v, k);
                if (step && !seen[w]) {
                    seen[w] = true;
                    stack[top++] = w;
                }
            }
        }
        return seen;
    }

    /**
     * A topological order of the directed edges (every parent before its children), by
     * Kahn's algorithm with the smallest available index first, so the order is unique for
     * a graph; or null if the directed edges form a cycle.
     */
    public static int[] topologicalOrder(Graph g) {
        int n = g.size();
        int[] indegree = new int[n];
        for (int v = 0; v < n; v++) {
            indegree[v] = g.parents(v).length;
        }
        PriorityQueue<Integer> ready = new PriorityQueue<>();
        for (int v = 0; v < n; v++) {
            if (indegree[v] == 0) {
                ready.add(v);
            }
        }
        int[] order = new int[n];
        int k = 0;
        while (!ready.isEmpty()) {
            int v = ready.poll();
            order[k++] = v;
            for (int c : g.children(v)) {
                if (--indegree[c] == 0) {
                    ready.add(c);
                }
            }
        }
        return k == n ? order : null;
    }

    /** Whether the directed edges of {@code g} form no cycle. */
    public static boolean isAcyclic(Graph g) {
        return topologicalOrder(g) != null;
    }
}
