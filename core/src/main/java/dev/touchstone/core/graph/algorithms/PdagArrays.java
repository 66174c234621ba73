package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;

import java.util.Arrays;

/**
 * The working form of a partially directed graph for the orientation algorithms: fixed
 * adjacency in compressed rows (neighbours ascending, so an adjacency test is a binary
 * search) with a mutable state per slot. Each edge has two slots, one in each end's row,
 * kept consistent through {@link #twin}.
 *
 * <p>Adjacencies never change in Meek's rules, Chickering's labelling or Dor and Tarsi's
 * extension; only orientations do, which is why the rows can be fixed and sorted once.
 * Building costs O(|V| + |E| log Δ). Not thread-safe.
 */
final class PdagArrays {

    /** Slot state: v — w. */
    static final byte UNDIRECTED = 0;
    /** Slot state: v → w (seen from v's row). */
    static final byte OUT = 1;
    /** Slot state: w → v (seen from v's row). */
    static final byte IN = 2;

    final Graph source;
    final int n;
    final int[] offsets;
    final int[] neighbours;
    final int[] owner;
    final int[] twin;
    final byte[] state;

    private PdagArrays(Graph g, boolean forgetDirections) {
        this.source = g;
        this.n = g.size();
        this.offsets = new int[n + 1];
        for (int v = 0; v < n; v++) {
            offsets[v + 1] = offsets[v] + g.degree(v);
        }
        int slots = offsets[n];
        this.neighbours = new int[slots];
        this.owner = new int[slots];
        this.twin = new int[slots];
        this.state = new byte[slots];
        for (int v = 0; v < n; v++) {
            for (int k = 0, d = g.degree(v); k < d; k++) {
                int s = offsets[v] + k;
                neighbours[s] = g.neighbour(v, k);
                owner[s] = v;
                Mark here = g.markHere(v, k);
                Mark there = g.markThere(v, k);
                if (here == Mark.TAIL && there == Mark.TAIL) {
                    state[s] = UNDIRECTED;
                } else if (here == Mark.TAIL && there == Mark.ARROW) {
                    state[s] = forgetDirections ? UNDIRECTED : OUT;
                } else if (here == Mark.ARROW && there == Mark.TAIL) {
                    state[s] = forgetDirections ? UNDIRECTED : IN;
                } else {
                    Edge e = g.edge(v, g.neighbour(v, k));
                    throw new IllegalArgumentException("edge " + describe(g, e)
                            + " is neither directed nor undirected; a partially directed graph has only"
                            + " tails and arrows");
                }
            }
        }
        for (int s = 0; s < slots; s++) {
            int v = owner[s];
            int w = neighbours[s];
            if (v < w) {
                int t = slot(w, v);
                twin[s] = t;
                twin[t] = s;
            }
        }
    }

    /** The graph's edges with their orientations. */
    static PdagArrays of(Graph g) {
        return new PdagArrays(g, false);
    }

    /** The skeleton of {@code g}, every edge undirected. */
    static PdagArrays skeletonOf(Graph g) {
        return new PdagArrays(g, true);
    }

    /** The slot of {@code w} in the row of {@code v}, or −1 if they are not adjacent. */
    int slot(int v, int w) {
        // rows are sorted and hold each neighbour once
        int at = Arrays.binarySearch(neighbours, offsets[v], offsets[v + 1], w);
        return at >= 0 ? at : -1;
    }

    boolean adjacent(int v, int w) {
        return slot(v, w) >= 0;
    }

    boolean isUndirected(int v, int w) {
        int s = slot(v, w);
        return s >= 0 && state[s] == UNDIRECTED;
    }

    boolean isDirected(int from, int to) {
        int s = slot(from, to);
        return s >= 0 && state[s] == OUT;
    }

    /** Orients the edge of slot {@code s} away from its owner: owner → neighbour. */
    void orientOut(int s) {
        state[s] = OUT;
        state[twin[s]] = IN;
    }

    /** The current graph: the source's variables and hidden flags, these orientations. */
    Graph toGraph() {
        MutableGraph m = Graph.builder(source.names());
        for (int v = 0; v < n; v++) {
            if (source.isHidden(v)) {
                m.setHidden(v, true);
            }
        }
        for (int s = 0; s < neighbours.length; s++) {
            int v = owner[s];
            int w = neighbours[s];
            if (v < w) {
                if (state[s] == UNDIRECTED) {
                    m.addUndirected(v, w);
                } else if (state[s] == OUT) {
                    m.addDirected(v, w);
                } else {
                    m.addDirected(w, v);
                }
            }
        }
        return m.freeze();
    }

    static String describe(Graph g, Edge e) {
        return g.name(e.a()) + " " + left(e.atA()) + "-" + right(e.atB()) + " " + g.name(e.b());
    }

    private static char left(Mark m) {
        return m == Mark.ARROW ? '<' : m == Mark.CIRCLE ? 'o' : '-';
    }

    private static char right(Mark m) {
        return m == Mark.ARROW ? '>' : m == Mark.CIRCLE ? 'o' : '-';
    }
}
