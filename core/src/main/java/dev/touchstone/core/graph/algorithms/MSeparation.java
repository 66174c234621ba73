package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

/**
 * m-separation in a mixed graph with directed, bidirected and undirected edges, such as a
 * maximal ancestral graph (Richardson and Spirtes 2002, "Ancestral graph Markov models",
 * Annals of Statistics 30, §3.4): a path is m-connecting given Z when every non-collider on
 * it is outside Z and every collider on it is an ancestor of Z; x and y are m-separated
 * given Z when no path between them is m-connecting.
 *
 * <p>The test is a reachability search over (variable, arrived-with-an-arrowhead) states,
 * the mixed-graph form of "Bayes-ball" used by van der Zander, Liśkiewicz and Textor (2019,
 * "Separators and adjustment sets in causal graphs", Artificial Intelligence 270): a
 * variable entered through an arrowhead and left through an arrowhead is a collider. One
 * query costs O(|V| + |E|). On a DAG it coincides with d-separation. Circle marks have no
 * meaning here and are refused when the instance is made.
 *
 * <p>Instances keep no per-query state and are thread-safe.
 */
public final class MSeparation {

    private final Graph graph;
    private final int[][] parents;

    /**
     * Prepares queries on {@code graph}.
     *
     * @throws IllegalArgumentException naming the first edge with a circle mark
     */
    public MSeparation(Graph graph) {
        for (Edge e : graph.edges()) {
            if (e.atA() == Mark.CIRCLE || e.atB() == Mark.CIRCLE) {
                throw new IllegalArgumentException("m-separation needs tails and arrows only, but edge "
                        + GraphText.edge(graph, e) + " has a circle mark");
            }
        }
        this.graph = graph;
        int n = graph.size();
        this.parents = new int[n][];
        for (int v = 0; v < n; v++) {
            parents[v] = graph.parents(v);
        }
    }

    /** The graph queried. */
    public Graph graph() {
        return graph;
    }

    /**
     * Whether {@code x} and {@code y} are m-separated given {@code given} (which must not
     * contain x or y).
     */
    public boolean separated(int x, int y, int[] given) {
        int n = graph.size();
        if (x == y) {
            throw new IllegalArgumentException("x and y must differ, got " + graph.name(x) + " twice");
        }
        boolean[] inZ = new boolean[n];
        for (int z : given) {
            inZ[z] = true;
        }
        if (inZ[x] || inZ[y]) {
            throw new IllegalArgumentException("x and y must not be in the conditioning set");
        }
        boolean[] anZ = ancestorsOf(given, n);
        // State s = 2v + (1 if v was entered through an arrowhead at v).
        boolean[] seen = new boolean[2 * n];
        int[] queue = new int[2 * n];
        int tail = 0;
        for (int k = 0, d = graph.degree(x); k < d; k++) {
            int s = 2 * graph.neighbour(x, k) + (graph.markThere(x, k) == Mark.ARROW ? 1 : 0);
            if (!seen[s]) {
                seen[s] = true;
                queue[tail++] = s;
            }
        }
        int head = 0;
        while (head < tail) {
            int s = queue[head++];
            int v = s >>> 1;
            if (v == y) {
                return false;
            }
            boolean enteredByArrow = (s & 1) == 1;
            for (int k = 0, d = graph.degree(v); k < d; k++) {
                boolean collider = enteredByArrow && graph.markHere(v, k) == Mark.ARROW;
                boolean passes = collider ? anZ[v] : !inZ[v];
                if (passes) {
                    int t = 2 * graph.neighbour(v, k) + (graph.markThere(v, k) == Mark.ARROW ? 1 : 0);
                    if (!seen[t]) {
                        seen[t] = true;
                        queue[tail++] = t;
                    }
                }
            }
        }
        return true;
    }

    private boolean[] ancestorsOf(int[] given, int n) {
        boolean[] an = new boolean[n];
        int[] stack = new int[n];
        int top = 0;
        for (int z : given) {
            if (!an[z]) {
                an[z] = true;
                stack[top++] = z;
            }
        }
        while (top > 0) {
            int v = stack[--top];
            for (int p : parents[v]) {
                if (!an[p]) {
                    an[p] = true;
                    stack[top++] = p;
                }
            }
        }
        return an;
    }
}
