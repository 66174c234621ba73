package dev.touchstone.core.graph;

import java.util.Arrays;
import java.util.List;
import java.util.Map;

/**
 * A mutable mixed graph for algorithms that add, remove and re-mark edges, with the same
 * index-based view as {@link Graph}. Not thread-safe. {@link #freeze()} gives the
 * immutable value.
 *
 * <p>Each variable keeps an unsorted list of its neighbours with the mark at its own end,
 * so adjacency tests cost O(degree), which is what sparse causal graphs need.
 */
public final class MutableGraph {

    private static final Mark[] MARKS = Mark.values();
    private static final int[] NO_INTS = new int[0];
    private static final byte[] NO_BYTES = new byte[0];

    private final List<String> names;
    private final Map<String, Integer> indexByName;
    private final boolean[] hidden;
    private final int[][] nbr;
    private final byte[][] here;
    private final int[] degree;
    private int edgeCount;

    MutableGraph(List<String> names) {
        this.names = List.copyOf(names);
        this.indexByName = Graph.indexNames(this.names);
        int n = this.names.size();
        this.hidden = new boolean[n];
        this.nbr = new int[n][];
        this.here = new byte[n][];
        this.degree = new int[n];
        Arrays.fill(nbr, NO_INTS);
        Arrays.fill(here, NO_BYTES);
    }

    /** A copy of {@code other}. */
    public MutableGraph(MutableGraph other) {
        this.names = other.names;
        this.indexByName = other.indexByName;
        this.hidden = other.hidden.clone();
        int n = names.size();
        this.nbr = new int[n][];
        this.here = new byte[n][];
        this.degree = other.degree.clone();
        for (int v = 0; v < n; v++) {
            nbr[v] = Arrays.copyOf(other.nbr[v], degree[v]);
            here[v] = Arrays.copyOf(other.here[v], degree[v]);
        }
        this.edgeCount = other.edgeCount;
    }

    public int size() {
        return names.size();
    }

    public List<String> names() {
        return names;
    }

    public String name(int index) {
        return names.get(index);
    }

    /** The index of {@code name}, or −1. */
    public int indexOf(String name) {
        Integer i = indexByName.get(name);
        return i == null ? -1 : i;
    }

    public boolean isHidden(int v) {
        return hidden[v];
    }

    public MutableGraph setHidden(int v, boolean isHidden) {
        hidden[v] = isHidden;
        return this;
    }

    public int edgeCount() {
        return edgeCount;
    }

    public int degree(int v) {
        return degree[v];
    }

    /** The {@code k}-th neighbour of {@code v} (0 ≤ k &lt; degree), in no particular order. */
    public int neighbour(int v, int k) {
        return nbr[v][k];
    }

    /** The neighbours of {@code v} (a fresh array, in no particular order). */
    public int[] neighbours(int v) {
        return Arrays.copyOf(nbr[v], degree[v]);
    }

    private int slot(int v, int w) {
        int[] row = nbr[v];
        for (int k = 0, d = degree[v]; k < d; k++) {
            if (row[k] == w) {
                return k;
            }
        }
        return -1;
    }

    public boolean adjacent(int a, int b) {
        return slot(a, b) >= 0;
    }

    /** The mark at {@code node} on its edge with {@code other}, or null. */
    public Mark markAt(int node, int other) {
        int k = slot(node, other);
        return k < 0 ? null : MARKS[here[node][k]];
    }

    /** The edge between {@code a} and {@code b} written with {@code a} first, or null. */
    public Edge edge(int a, int b) {
        int k = slot(a, b);
        return k < 0 ? null : new Edge(a, b, MARKS[here[a][k]], markAt(b, a));
    }

    public boolean hasDirected(int from, int to) {
        return markAt(from, to) == Mark.TAIL && markAt(to, from) == Mark.ARROW;
    }

    public boolean hasUndirected(int a, int b) {
        return markAt(a, b) == Mark.TAIL && markAt(b, a) == Mark.TAIL;
    }

    /**
     * Adds an edge between two non-adjacent variables.
     *
     * @throws IllegalArgumentException if they are already adjacent or the same variable
     */
    public MutableGraph addEdge(int a, int b, Mark atA, Mark atB) {
        if (a == b) {
            throw new IllegalArgumentException("self-loop at '" + names.get(a) + "'");
        }
        if (adjacent(a, b)) {
            throw new IllegalArgumentException("'" + names.get(a) + "' and '" + names.get(b) + "' are already adjacent");
        }
        append(a, b, atA);
        append(b, a, atB);
        edgeCount++;
        return this;
    }

    public MutableGraph addEdge(Edge e) {
        return addEdge(e.a(), e.b(), e.atA(), e.atB());
    }

    public MutableGraph addDirected(int from, int to) {
        return addEdge(from, to, Mark.TAIL, Mark.ARROW);
    }

    public MutableGraph addUndirected(int a, int b) {
        return addEdge(a, b, Mark.TAIL, Mark.TAIL);
    }

    public MutableGraph addBidirected(int a, int b) {
        return addEdge(a, b, Mark.ARROW, Mark.ARROW);
    }

    private void append(int v, int w, Mark m) {
        int d = degree[v];
        if (d == nbr[v].length) {
            int cap = Math.max(4, d * 2);
            nbr[v] = Arrays.copyOf(nbr[v], cap);
            here[v] = Arrays.copyOf(here[v], cap);
        }
        nbr[v][d] = w;
        here[v][d] = (byte) m.ordinal();
        degree[v] = d + 1;
    }

    /** Removes the edge between {@code a} and {@code b}; returns whether there was one. */
    public boolean removeEdge(int a, int b) {
        int ka = slot(a, b);
        if (ka < 0) {
            return false;
        }
        drop(a, ka);
        drop(b, slot(b, a));
        edgeCount--;
        return true;
    }

    private void drop(int v, int k) {
        int last = degree[v] - 1;
        nbr[v][k] = nbr[v][last];
        here[v][k] = here[v][last];
        degree[v] = last;
    }

    /**
     * Sets the mark at {@code node} on its existing edge with {@code other}.
     *
     * @throws IllegalArgumentException if they are not adjacent
     */
    public MutableGraph setMark(int node, int other, Mark mark) {
        int k = slot(node, other);
        if (k < 0) {
            throw new IllegalArgumentException("'" + names.get(node) + "' and '" + names.get(other) + "' are not adjacent");
        }
        here[node][k] = (byte) mark.ordinal();
        return this;
    }

    /** Makes the existing edge between the two variables {@code from → to}. */
    public MutableGraph orient(int from, int to) {
        setMark(from, to, Mark.TAIL);
        return setMark(to, from, Mark.ARROW);
    }

    /** Sets both marks of the existing edge between {@code a} and {@code b}. */
    public MutableGraph setMarks(int a, int b, Mark atA, Mark atB) {
        setMark(a, b, atA);
        return setMark(b, a, atB);
    }

    public int[] parents(int v) {
        return select(v, Mark.ARROW, Mark.TAIL);
    }

    public int[] children(int v) {
        return select(v, Mark.TAIL, Mark.ARROW);
    }

    public int[] undirectedNeighbours(int v) {
        return select(v, Mark.TAIL, Mark.TAIL);
    }

    private int[] select(int v, Mark atV, Mark atOther) {
        int[] out = new int[degree[v]];
        int n = 0;
        for (int k = 0; k < degree[v]; k++) {
            int w = nbr[v][k];
            if (here[v][k] == atV.ordinal() && markAt(w, v) == atOther) {
                out[n++] = w;
            }
        }
        return Arrays.copyOf(out, n);
    }

    /** The immutable graph with the current variables, hidden flags and edges. */
    public Graph freeze() {
        int n = size();
        int[] offsets = new int[n + 1];
        for (int v = 0; v < n; v++) {
            offsets[v + 1] = offsets[v] + degree[v];
        }
        int total = offsets[n];
        int[] allNbr = new int[total];
        byte[] allHere = new byte[total];
        byte[] allThere = new byte[total];
        long[] packed = new long[0];
        for (int v = 0; v < n; v++) {
            int d = degree[v];
            if (packed.length < d) {
                packed = new long[Math.max(d, 2 * packed.length)];
            }
            for (int k = 0; k < d; k++) {
                packed[k] = ((long) nbr[v][k] << 8) | here[v][k];
            }
            Arrays.sort(packed, 0, d);
            int base = offsets[v];
            for (int k = 0; k < d; k++) {
                allNbr[base + k] = (int) (packed[k] >>> 8);
                allHere[base + k] = (byte) (packed[k] & 0xff);
            }
        }
        for (int v = 0; v < n; v++) {
            for (int k = offsets[v]; k < offsets[v + 1]; k++) {
                int w = allNbr[k];
                int j = Arrays.binarySearch(allNbr, offsets[w], offsets[w + 1], v);
                allThere[k] = allHere[j];
            }
        }
        return new Graph(names, indexByName, hidden.clone(), offsets, allNbr, allHere, allThere);
    }

    @Override
    public String toString() {
        return freeze().toString();
    }
}
