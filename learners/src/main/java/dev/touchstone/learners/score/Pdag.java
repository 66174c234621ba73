package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.Arrays;
import java.util.List;

/**
 * A mutable partially directed graph for the score-based searches: an edge state per
 * ordered pair (O(1) adjacency and orientation tests) plus neighbour lists (O(degree)
 * iteration). Not thread-safe; the searches mutate it from one thread and read it from
 * several only between mutations. Memory O(p²) bytes, which is 1 MB at p = 1,000.
 */
final class Pdag {

    static final byte NONE = 0;
    /** Row a, column b: a → b. */
    static final byte OUT = 1;
    /** Row a, column b: b → a. */
    static final byte IN = 2;
    static final byte UNDIRECTED = 3;

    private final int p;
    private final byte[] state;
    private final int[][] nbr;
    private final int[] degree;

    Pdag(int p) {
        this.p = p;
        this.state = new byte[p * p];
        this.nbr = new int[p][4];
        this.degree = new int[p];
    }

    Pdag(Pdag other) {
        this.p = other.p;
        this.state = other.state.clone();
        this.nbr = new int[p][];
        for (int v = 0; v < p; v++) {
            nbr[v] = other.nbr[v].clone();
        }
        this.degree = other.degree.clone();
    }

    /** The PDAG of a graph whose edges are directed or undirected. */
    static Pdag of(Graph g) {
        Pdag d = new Pdag(g.size());
        for (Edge e : g.edges()) {
            if (e.isUndirected()) {
                d.addUndirected(e.a(), e.b());
            } else if (e.isDirectedFrom(e.a())) {
                d.addDirected(e.a(), e.b());
            } else if (e.isDirectedFrom(e.b())) {
                d.addDirected(e.b(), e.a());
            } else {
                throw new IllegalArgumentException("not a PDAG edge: " + g.name(e.a()) + " " + e.atA().word() + "/"
                        + e.atB().word() + " " + g.name(e.b()));
            }
        }
        return d;
    }

    /** This PDAG as an immutable graph over these names. */
    Graph toGraph(List<String> names) {
        MutableGraph g = Graph.builder(names);
        for (int a = 0; a < p; a++) {
            for (int k = 0; k < degree[a]; k++) {
                int b = nbr[a][k];
                byte s = state[a * p + b];
                if (s == OUT) {
                    g.addDirected(a, b);
                } else if (s == UNDIRECTED && a < b) {
                    g.addEdge(a, b, Mark.TAIL, Mark.TAIL);
                }
            }
        }
        return g.freeze();
    }

    int size() {
        return p;
    }

    byte state(int a, int b) {
        return state[a * p + b];
    }

    boolean adjacent(int a, int b) {
        return state[a * p + b] != NONE;
    }

    boolean directed(int from, int to) {
        return state[from * p + to] == OUT;
    }

    boolean undirected(int a, int b) {
        return state[a * p + b] == UNDIRECTED;
    }

    int degree(int v) {
        return degree[v];
    }

    /** The k-th neighbour of v (any edge type), in no particular order. */
    int neighbour(int v, int k) {
        return nbr[v][k];
    }

    void addDirected(int from, int to) {
        link(from, to);
        state[from * p + to] = OUT;
        state[to * p + from] = IN;
    }

    void addUndirected(int a, int b) {
        link(a, b);
        state[a * p + b] = UNDIRECTED;
        state[b * p + a] = UNDIRECTED;
    }

    /** Directs an existing edge as from → to. */
    void orient(int from, int to) {
        if (state[from * p + to] == NONE) {
            throw new IllegalStateException("no edge to orient between " + from + " and " + to);
        }
        state[from * p + to] = OUT;
        state[to * p + from] = IN;
    }

    void remove(int a, int b) {
        if (state[a * p + b] == NONE) {
            return;
        }
        state[a * p + b] = NONE;
        state[b * p + a] = NONE;
        unlinkOne(a, b);
        unlinkOne(b, a);
    }

    private void link(int a, int b) {
        if (a == b) {
            throw new IllegalArgumentException("no self loops: " + a);
        }
        if (state[a * p + b] != NONE) {
            throw new IllegalStateException("already adjacent: " + a + ", " + b);
        }
        push(a, b);
        push(b, a);
    }

    private void push(int a, int b) {
        if (degree[a] == nbr[a].length) {
            nbr[a] = Arrays.copyOf(nbr[a], Math.max(4, 2 * degree[a]));
        }
        nbr[a][degree[a]++] = b;
    }

    private void unlinkOne(int a, int b) {
        int[] list = nbr[a];
        for (int k = 0; k < degree[a]; k++) {
            if (list[k] == b) {
                list[k] = list[--degree[a]];
                return;
            }
        }
    }

    /** The variables u with u → v, ascending. */
    int[] parents(int v) {
        return select(v, IN);
    }

    /** The variables c with v → c, ascending. */
    int[] children(int v) {
        return select(v, OUT);
    }

    /** The variables u with u — v, ascending. */
    int[] undirectedNeighbours(int v) {
        return select(v, UNDIRECTED);
    }

    private int[] select(int v, byte kind) {
        int[] out = new int[degree[v]];
        int n = 0;
        for (int k = 0; k < degree[v]; k++) {
            int w = nbr[v][k];
            if (state[v * p + w] == kind) {
                out[n++] = w;
            }
        }
        out = n == out.length ? out : Arrays.copyOf(out, n);
        Arrays.sort(out);
        return out;
    }

    /** Whether the rows of v (its edges and their orientations) are the same in both. */
    boolean sameNeighbourhood(Pdag other, int v) {
        return Arrays.equals(state, v * p, v * p + p, other.state, v * p, v * p + p);
    }

    /** Whether every two of these variables are adjacent. */
    boolean isClique(int[] vars, int count) {
        for (int i = 0; i < count; i++) {
            int row = vars[i] * p;
            for (int j = i + 1; j < count; j++) {
                if (state[row + vars[j]] == NONE) {
                    return false;
                }
            }
        }
        return true;
    }

    /**
     * Whether a directed path from → … → to exists (edges u → w only), not using the edge
     * skipFrom → skipTo (−1 for none); true when from = to. Depth-first, O(p + edges).
     */
    boolean directedPath(int from, int to, int skipFrom, int skipTo) {
        if (from == to) {
            return true;
        }
        boolean[] seen = new boolean[p];
        int[] stack = new int[p];
        int top = 0;
        stack[top++] = from;
        seen[from] = true;
        while (top > 0) {
            int u = stack[--top];
            for (int k = 0; k < degree[u]; k++) {
                int w = nbr[u][k];
                if (seen[w] || state[u * p + w] != OUT || (u == skipFrom && w == skipTo)) {
                    continue;
                }
                if (w == to) {
                    return true;
                }
                seen[w] = true;
                stack[top++] = w;
            }
        }
        return false;
    }

    /** One random change a search's perturbation may make at an ordered pair; see {@link #perturb}. */
    interface PairMove {
        /** Makes the change at (x, y) when it is allowed there and says whether it did. */
        boolean tryAt(Pdag g, int x, int y);
    }

    /**
     * The random restarts' perturbation shared by the searches: draws ordered pairs x ≠ y
     * uniformly and lets {@code move} try a change at each, until {@code moves} changes are
     * made or 100·moves + 100 pairs were drawn (so that a graph with few legal changes ends).
     */
    void perturb(UniformRandomProvider rng, int moves, PairMove move) {
        int done = 0;
        for (int tries = 0; done < moves && tries < 100 * moves + 100 && p > 1; tries++) {
            int x = rng.nextInt(p);
            int y = rng.nextInt(p);
            if (x != y && move.tryAt(this, x, y)) {
                done++;
            }
        }
    }

    /** The number of edges. */
    int edgeCount() {
        int s = 0;
        for (int v = 0; v < p; v++) {
            s += degree[v];
        }
        return s / 2;
    }
}
