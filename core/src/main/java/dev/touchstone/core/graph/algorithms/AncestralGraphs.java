package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

import java.util.ArrayDeque;
import java.util.Arrays;

/**
 * Checks that a mixed graph is an ancestral graph and a maximal one (a MAG), after
 * Richardson and Spirtes (2002, "Ancestral graph Markov models", Annals of Statistics 30).
 *
 * <p>Ancestral (their Definition 3.1, restated): marks are tails and arrows only; there is
 * no directed cycle; there is no almost directed cycle (no {@code a <-> b} with {@code a} an
 * ancestor of {@code b}); and the end points of an undirected edge have no arrowhead on
 * any edge (no parents, no spouses). Cost O(|V| + |E|) plus one directed reachability
 * search per bidirected edge, O(|E_bidirected| · (|V| + |E|)) in all.
 *
 * <p>Maximal (their §3.7): every pair of non-adjacent variables is m-separated by some set;
 * equivalently no inducing path joins two non-adjacent variables (their inducing-path theorem; numbering here and below from memory). For
 * an ancestral graph it is enough to test the set {@code ant({a, b}) \ {a, b}}: if an
 * m-connecting path given that set exists, every non-end vertex on it is anterior to
 * {@code a} or {@code b} and so must be a collider that is an ancestor of an end, which is
 * an inducing path. Cost one m-separation query per non-adjacent pair,
 * O(|V|² · (|V| + |E|)).
 */
public final class AncestralGraphs {

    private AncestralGraphs() {
    }

    /** Whether {@code g} is an ancestral graph (tails and arrows only; see the class comment). */
    public static boolean isAncestral(Graph g) {
        return ancestralViolation(g) == null;
    }

    /**
     * Whether the ancestral graph {@code g} is maximal.
     *
     * @throws IllegalArgumentException if {@code g} is not ancestral, saying why
     */
    public static boolean isMaximal(Graph g) {
        String why = ancestralViolation(g);
        if (why != null) {
            throw new IllegalArgumentException("maximality is defined for ancestral graphs only: " + why);
        }
        return maximalityViolation(g) == null;
    }

    /**
     * Checks that {@code g} is a maximal ancestral graph.
     *
     * @throws IllegalArgumentException with one line naming the offending edge, cycle or pair
     */
    public static void checkMag(Graph g) {
        String why = ancestralViolation(g);
        if (why == null) {
            why = maximalityViolation(g);
        }
        if (why != null) {
            throw new IllegalArgumentException("not a maximal ancestral graph: " + why);
        }
    }

    /** Why {@code g} is not ancestral, or null if it is. */
    static String ancestralViolation(Graph g) {
        for (Edge e : g.edges()) {
            if (e.atA() == Mark.CIRCLE || e.atB() == Mark.CIRCLE) {
                return "edge " + GraphText.edge(g, e) + " has a circle mark (only tails and arrows are allowed)";
            }
        }
        int[] cycle = directedCycle(g);
        if (cycle != null) {
            return "directed cycle " + GraphText.directedPath(g, cycle);
        }
        for (Edge e : g.edges()) {
            if (e.isBidirected()) {
                for (int[] ends : new int[][] {{e.a(), e.b()}, {e.b(), e.a()}}) {
                    int[] path = directedPath(g, ends[0], ends[1]);
                    if (path != null) {
                        return "almost directed cycle: " + GraphText.edge(g, e) + " while "
                                + GraphText.directedPath(g, path);
                    }
                }
            } else if (e.isUndirected()) {
                for (int end : new int[] {e.a(), e.b()}) {
                    for (int k = 0, d = g.degree(end); k < d; k++) {
                        if (g.markHere(end, k) == Mark.ARROW) {
                            Edge into = g.edge(g.neighbour(end, k), end);
                            return "undirected edge " + GraphText.edge(g, e) + " but '" + g.name(end)
                                    + "' has an arrowhead on " + GraphText.edge(g, into);
                        }
                    }
                }
            }
        }
        return null;
    }

    /** Why the ancestral graph {@code g} is not maximal, or null if it is. */
    static String maximalityViolation(Graph g) {
        MSeparation msep = new MSeparation(g);
        int n = g.size();
        for (int a = 0; a < n; a++) {
            for (int b = a + 1; b < n; b++) {
                if (!g.adjacent(a, b) && !msep.separated(a, b, anteriorsExcept(g, a, b))) {
                    return "'" + g.name(a) + "' and '" + g.name(b)
                            + "' are not adjacent but joined by an inducing path (no set m-separates them)";
                }
            }
        }
        return null;
    }

    /** The variables anterior to a or b (reach a or b along tails-first edges), a and b excluded. */
    private static int[] anteriorsExcept(Graph g, int a, int b) {
        int n = g.size();
        boolean[] seen = new boolean[n];
        int[] stack = new int[n];
        int top = 0;
        seen[a] = true;
        seen[b] = true;
        stack[top++] = a;
        stack[top++] = b;
        int count = 0;
        int[] out = new int[n];
        while (top > 0) {
            int v = stack[--top];
            for (int k = 0, d = g.degree(v); k < d; k++) {
                // w is anterior-adjacent to v when the edge carries a tail at w (w --> v or w --- v).
                int w = g.neighbour(v, k);
                if (!seen[w] && g.markThere(v, k) == Mark.TAIL) {
                    seen[w] = true;
                    stack[top++] = w;
                    out[count++] = w;
                }
            }
        }
        return Arrays.copyOf(out, count);
    }

    /** A directed cycle as its nodes with the first repeated at the end, or null. */
    static int[] directedCycle(Graph g) {
        int[] cycle = Ancestry.directedCycle(g);
        return cycle.length == 0 ? null : cycle;
    }

    /** A shortest directed path from {@code from} to {@code to} (at least one edge), or null. */
    static int[] directedPath(Graph g, int from, int to) {
        int n = g.size();
        int[] parent = new int[n];
        Arrays.fill(parent, -2);
        int[] queue = new int[n];
        int head = 0;
        int tail = 0;
        queue[tail++] = from;
        parent[from] = -1;
        while (head < tail) {
            int v = queue[head++];
            for (int k = 0, d = g.degree(v); k < d; k++) {
                if (g.markHere(v, k) != Mark.TAIL || g.markThere(v, k) != Mark.ARROW) {
                    continue;
                }
                int w = g.neighbour(v, k);
                if (w == to) {
                    ArrayDeque<Integer> path = new ArrayDeque<>();
                    path.addFirst(to);
                    for (int u = v; u != -1; u = parent[u]) {
                        path.addFirst(u);
                    }
                    return path.stream().mapToInt(Integer::intValue).toArray();
                }
                if (parent[w] == -2) {
                    parent[w] = v;
                    queue[tail++] = w;
                }
            }
        }
        return null;
    }
}
