package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

import java.util.Arrays;

/**
 * Ancestors, descendants, topological order and directed cycles over the directed edges
 * of a graph (undirected, bidirected and circle-marked edges are ignored). Each call is a
 * single O(|V| + |E|) traversal (Cormen et al., Introduction to Algorithms, §22.3–22.4),
 * except {@link #topologicalOrder}, which is O(|V| log |V| + |E|) to make the order unique.
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
                int w = g.neighbour(v, k);
                if (!seen[w] && (up ? isParentSlot(g, v, k) : isChildSlot(g, v, k))) {
                    seen[w] = true;
                    stack[top++] = w;
                }
            }
        }
        return seen;
    }

    /** Whether the k-th neighbour of v is a parent of v (tail there, arrow at v). */
    static boolean isParentSlot(Graph g, int v, int k) {
        return g.markHere(v, k) == Mark.ARROW && g.markThere(v, k) == Mark.TAIL;
    }

    /** Whether the k-th neighbour of v is a child of v (tail at v, arrow there). */
    static boolean isChildSlot(Graph g, int v, int k) {
        return g.markHere(v, k) == Mark.TAIL && g.markThere(v, k) == Mark.ARROW;
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
            for (int k = 0, d = g.degree(v); k < d; k++) {
                if (isParentSlot(g, v, k)) {
                    indegree[v]++;
                }
            }
        }
        // A primitive binary min-heap of ready variables: no boxing on large graphs.
        int[] heap = new int[n];
        int size = 0;
        for (int v = 0; v < n; v++) {
            if (indegree[v] == 0) {
                heap[size++] = v; // ascending, so already a valid heap
            }
        }
        int[] order = new int[n];
        int count = 0;
        while (size > 0) {
            int v = heap[0];
            heap[0] = heap[--size];
            siftDown(heap, size);
            order[count++] = v;
            for (int k = 0, d = g.degree(v); k < d; k++) {
                if (isChildSlot(g, v, k)) {
                    int c = g.neighbour(v, k);
                    if (--indegree[c] == 0) {
                        heap[size] = c;
                        siftUp(heap, size++);
                    }
                }
            }
        }
        return count == n ? order : null;
    }

    private static void siftDown(int[] heap, int size) {
        int i = 0;
        int x = heap[0];
        while (true) {
            int c = 2 * i + 1;
            if (c >= size) {
                break;
            }
            if (c + 1 < size && heap[c + 1] < heap[c]) {
                c++;
            }
            if (heap[c] >= x) {
                break;
            }
            heap[i] = heap[c];
            i = c;
        }
        if (size > 0) {
            heap[i] = x;
        }
    }

    private static void siftUp(int[] heap, int i) {
        int x = heap[i];
        while (i > 0) {
            int p = (i - 1) >>> 1;
            if (heap[p] <= x) {
                break;
            }
            heap[i] = heap[p];
            i = p;
        }
        heap[i] = x;
    }

    /** Whether the directed edges of {@code g} form no cycle. */
    public static boolean isAcyclic(Graph g) {
        return topologicalOrder(g) != null;
    }

    /**
     * A directed cycle of {@code g} as the variables along it, first one repeated at the
     * end (so {@code [a, b, c, a]} for a → b → c → a), or an empty array if there is none.
     * Iterative depth-first search, O(|V| + |E|); the cycle found is the first one met
     * searching from the smallest index.
     */
    public static int[] directedCycle(Graph g) {
        int n = g.size();
        byte[] colour = new byte[n]; // 0 unseen, 1 on the current path, 2 finished
        int[] parent = new int[n];
        int[] next = new int[n];
        int[] stack = new int[n];
        for (int root = 0; root < n; root++) {
            if (colour[root] != 0) {
                continue;
            }
            int top = 0;
            stack[top++] = root;
            colour[root] = 1;
            next[root] = 0;
            parent[root] = -1;
            while (top > 0) {
                int v = stack[top - 1];
                if (next[v] == g.degree(v)) {
                    colour[v] = 2;
                    top--;
                    continue;
                }
                int k = next[v]++;
                if (!isChildSlot(g, v, k)) {
                    continue;
                }
                int w = g.neighbour(v, k);
                if (colour[w] == 0) {
                    colour[w] = 1;
                    parent[w] = v;
                    next[w] = 0;
                    stack[top++] = w;
                } else if (colour[w] == 1) {
                    int[] back = new int[n + 1];
                    int len = 0;
                    back[len++] = w;
                    for (int u = v; u != w; u = parent[u]) {
                        back[len++] = u;
                    }
                    back[len++] = w;
                    int[] cycle = new int[len];
                    for (int i = 0; i < len; i++) {
                        cycle[i] = back[len - 1 - i];
                    }
                    return cycle;
                }
            }
        }
        return new int[0];
    }

    /** The cycle as text, {@code a -> b -> c -> a}. */
    static String describeCycle(Graph g, int[] cycle) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < cycle.length; i++) {
            if (i > 0) {
                sb.append(" -> ");
            }
            sb.append(g.name(cycle[i]));
        }
        return sb.toString();
    }

    static int[] positions(int[] order) {
        int[] pos = new int[order.length];
        Arrays.fill(pos, -1);
        for (int i = 0; i < order.length; i++) {
            pos[order[i]] = i;
        }
        return pos;
    }
}
