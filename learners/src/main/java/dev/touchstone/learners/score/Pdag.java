package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.Arrays;
import java.util.List;

/**
 * A mutable partially directed graph for the score-based searches, stored sparsely: per node
 * a list of its neighbours with the state of each edge seen from that node, so memory and a
 * copy cost O(p + edges) and an adjacency or orientation test O(min degree) of its two ends.
 * This is what lets the searches run at p = 10,000, where a p × p edge table would be 100 MB
 * per copy. Not thread-safe; the searches mutate it from one thread and read it from several
 * only between mutations.
 */
final class Pdag {

    static final byte NONE = 0;
    /** Seen from a towards b: a → b. */
    static final byte OUT = 1;
    /** Seen from a towards b: b → a. */
    static final byte IN = 2;
    static final byte UNDIRECTED = 3;

    private final int p;
    private final int[][] nbr;
    private final byte[][] kind;
    private final int[] degree;

    Pdag(int p) {
        this.p = p;
        this.nbr = new int[p][];
        this.kind = new byte[p][];
        this.degree = new int[p];
    }

    Pdag(Pdag other) {
        this.p = other.p;
        this.nbr = new int[p][];
        this.kind = new byte[p][];
        for (int v = 0; v < p; v++) {
            if (other.degree[v] > 0) {
                nbr[v] = Arrays.copyOf(other.nbr[v], other.degree[v]);
                kind[v] = Arrays.copyOf(other.kind[v], other.degree[v]);
            }
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

    /**
     * The PDAG whose node v has the neighbours {@code neighbours[offsets[v] .. offsets[v + 1])}
     * with the edge states seen from v in {@code states} (this class's codes), kept in that
     * order; the caller gives each edge once in both ends' rows. No check, so no O(degree)
     * adjacency test per edge as {@link #addDirected} makes.
     */
    static Pdag ofSortedRows(int[] offsets, int[] neighbours, byte[] states) {
        Pdag d = new Pdag(offsets.length - 1);
        for (int v = 0; v < d.p; v++) {
            int from = offsets[v];
            int to = offsets[v + 1];
            if (to > from) {
                d.nbr[v] = Arrays.copyOfRange(neighbours, from, to);
                d.kind[v] = Arrays.copyOfRange(states, from, to);
                d.degree[v] = to - from;
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
                byte s = kind[a][k];
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

    /** The slot of b in a's list, or −1. */
    private int slot(int a, int b) {
        int[] list = nbr[a];
        for (int k = 0, d = degree[a]; k < d; k++) {
            if (list[k] == b) {
                return k;
            }
        }
        return -1;
    }

    /** The state of the edge between a and b seen from a; scans the shorter of the two lists. */
    byte state(int a, int b) {
        if (degree[a] <= degree[b]) {
            int k = slot(a, b);
            return k < 0 ? NONE : kind[a][k];
        }
        int k = slot(b, a);
        return k < 0 ? NONE : mirror(kind[b][k]);
    }

    private static byte mirror(byte s) {
        return s == OUT ? IN : s == IN ? OUT : s;
    }

    boolean adjacent(int a, int b) {
        return state(a, b) != NONE;
    }

    boolean directed(int from, int to) {
        return state(from, to) == OUT;
    }

    boolean undirected(int a, int b) {
        return state(a, b) == UNDIRECTED;
    }

    int degree(int v) {
        return degree[v];
    }

    /** The k-th neighbour of v (any edge type), in no particular order. */
    int neighbour(int v, int k) {
        return nbr[v][k];
    }

    /** The state of the edge to v's k-th neighbour, seen from v. */
    byte neighbourState(int v, int k) {
        return kind[v][k];
    }

    void addDirected(int from, int to) {
        link(from, to, OUT);
    }

    void addUndirected(int a, int b) {
        link(a, b, UNDIRECTED);
    }

    /** Directs an existing edge as from → to. */
    void orient(int from, int to) {
        int k = slot(from, to);
        if (k < 0) {
            throw new IllegalStateException("no edge to orient between " + from + " and " + to);
        }
        kind[from][k] = OUT;
        kind[to][slot(to, from)] = IN;
    }

    void remove(int a, int b) {
        int k = slot(a, b);
        if (k < 0) {
            return;
        }
        unlink(a, k);
        unlink(b, slot(b, a));
    }

    private void link(int a, int b, byte seenFromA) {
        if (a == b) {
            throw new IllegalArgumentException("no self loops: " + a);
        }
        if (slot(a, b) >= 0) {
            throw new IllegalStateException("already adjacent: " + a + ", " + b);
        }
        push(a, b, seenFromA);
        push(b, a, mirror(seenFromA));
    }

    private void push(int a, int b, byte s) {
        if (nbr[a] == null) {
            nbr[a] = new int[4];
            kind[a] = new byte[4];
        } else if (degree[a] == nbr[a].length) {
            int size = Math.max(4, 2 * degree[a]);
            nbr[a] = Arrays.copyOf(nbr[a], size);
            kind[a] = Arrays.copyOf(kind[a], size);
        }
        nbr[a][degree[a]] = b;
        kind[a][degree[a]] = s;
        degree[a]++;
    }

    private void unlink(int a, int k) {
        int last = --degree[a];
        nbr[a][k] = nbr[a][last];
        kind[a][k] = kind[a][last];
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
            if (this.kind[v][k] == kind) {
                out[n++] = nbr[v][k];
            }
        }
        out = n == out.length ? out : Arrays.copyOf(out, n);
        Arrays.sort(out);
        return out;
    }

    /** Whether v has the same edges with the same orientations in both. O(degree²), degrees being small. */
    boolean sameNeighbourhood(Pdag other, int v) {
        if (degree[v] != other.degree[v]) {
            return false;
        }
        for (int k = 0; k < degree[v]; k++) {
            int j = other.slot(v, nbr[v][k]);
            if (j < 0 || other.kind[v][j] != kind[v][k]) {
                return false;
            }
        }
        return true;
    }

    /** Whether every two of these variables are adjacent. */
    boolean isClique(int[] vars, int count) {
        for (int i = 0; i < count; i++) {
            for (int j = i + 1; j < count; j++) {
                if (!adjacent(vars[i], vars[j])) {
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
                if (seen[w] || kind[u][k] != OUT || (u == skipFrom && w == skipTo)) {
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
