package dev.touchstone.core.graph;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * An immutable mixed graph over named variables, each edge carrying a {@link Mark} at
 * each end, with some variables possibly flagged hidden.
 *
 * <p>Variables are addressed by index (0 … size−1) for speed and by name for people.
 * Adjacency is stored in compressed rows sorted by neighbour, so adjacency tests cost
 * O(log degree) and iterating a neighbourhood allocates nothing. Which {@link GraphClass}
 * a graph belongs to is not stored: it is a property checked by the graph algorithms.
 * Build one with {@link MutableGraph#freeze()} or {@link #builder(List)}.
 */
public final class Graph {

    private static final Mark[] MARKS = Mark.values();

    private final List<String> names;
    private final Map<String, Integer> indexByName;
    private final boolean[] hidden;
    private final int[] offsets;
    private final int[] neighbours;
    private final byte[] marksHere;
    private final byte[] marksThere;
    private final int edgeCount;
    private int hash;

    Graph(List<String> names, Map<String, Integer> indexByName, boolean[] hidden,
          int[] offsets, int[] neighbours, byte[] marksHere, byte[] marksThere) {
        this.names = names;
        this.indexByName = indexByName;
        this.hidden = hidden;
        this.offsets = offsets;
        this.neighbours = neighbours;
        this.marksHere = marksHere;
        this.marksThere = marksThere;
        this.edgeCount = neighbours.length / 2;
    }

    /** A builder (a {@link MutableGraph}) over these variable names, with no edges and nothing hidden. */
    public static MutableGraph builder(List<String> names) {
        return new MutableGraph(names);
    }

    /** The graph with these variables and no edges. */
    public static Graph empty(List<String> names) {
        return new MutableGraph(names).freeze();
    }

    /** The number of variables, hidden ones included. */
    public int size() {
        return names.size();
    }

    /** The variable names in index order (unmodifiable). */
    public List<String> names() {
        return names;
    }

    /** The name of the variable at {@code index}. */
    public String name(int index) {
        return names.get(index);
    }

    /** The index of {@code name}, or −1 if the graph has no such variable. */
    public int indexOf(String name) {
        Integer i = indexByName.get(name);
        return i == null ? -1 : i;
    }

    /**
     * The index of {@code name}.
     *
     * @throws IllegalArgumentException if there is no such variable
     */
    public int index(String name) {
        int i = indexOf(name);
        if (i < 0) {
            throw new IllegalArgumentException("unknown variable '" + name + "'");
        }
        return i;
    }

    /** Whether the variable at {@code index} is hidden (latent). */
    public boolean isHidden(int index) {
        return hidden[index];
    }

    /** Whether any variable is hidden. */
    public boolean hasHidden() {
        for (boolean h : hidden) {
            if (h) {
                return true;
            }
        }
        return false;
    }

    /** The names of the hidden variables, in index order. */
    public Set<String> hiddenNames() {
        Set<String> out = new LinkedHashSet<>();
        for (int i = 0; i < hidden.length; i++) {
            if (hidden[i]) {
                out.add(names.get(i));
            }
        }
        return Collections.unmodifiableSet(out);
    }

    /** The indices of the observed (not hidden) variables, ascending. */
    public int[] observedIndices() {
        int[] out = new int[size()];
        int k = 0;
        for (int i = 0; i < hidden.length; i++) {
            if (!hidden[i]) {
                out[k++] = i;
            }
        }
        return Arrays.copyOf(out, k);
    }

    /** The number of edges. */
    public int edgeCount() {
        return edgeCount;
    }

    /** The number of edges at {@code v}. */
    public int degree(int v) {
        return offsets[v + 1] - offsets[v];
    }

    /** The {@code k}-th neighbour of {@code v} (0 ≤ k &lt; degree), neighbours ascending. */
    public int neighbour(int v, int k) {
        return neighbours[offsets[v] + k];
    }

    /** The mark at {@code v} on the edge to its {@code k}-th neighbour. */
    public Mark markHere(int v, int k) {
        return MARKS[marksHere[offsets[v] + k]];
    }

    /** The mark at the {@code k}-th neighbour of {@code v} on their edge. */
    public Mark markThere(int v, int k) {
        return MARKS[marksThere[offsets[v] + k]];
    }

    /** The neighbours of {@code v}, ascending (a fresh array). */
    public int[] neighbours(int v) {
        return Arrays.copyOfRange(neighbours, offsets[v], offsets[v + 1]);
    }

    private int slot(int v, int w) {
        int k = Arrays.binarySearch(neighbours, offsets[v], offsets[v + 1], w);
        return k >= 0 ? k : -1;
    }

    /** Whether {@code a} and {@code b} are joined by an edge. */
    public boolean adjacent(int a, int b) {
        return slot(a, b) >= 0;
    }

    /** The mark at {@code node} on its edge with {@code other}, or null if they are not adjacent. */
    public Mark markAt(int node, int other) {
        int k = slot(node, other);
        return k < 0 ? null : MARKS[marksHere[k]];
    }

    /** The edge between {@code a} and {@code b}, written with {@code a} first, or null. */
    public Edge edge(int a, int b) {
        int k = slot(a, b);
        return k < 0 ? null : new Edge(a, b, MARKS[marksHere[k]], MARKS[marksThere[k]]);
    }

    /** Whether the graph has the edge {@code from → to}. */
    public boolean hasDirected(int from, int to) {
        int k = slot(from, to);
        return k >= 0 && marksHere[k] == Mark.TAIL.ordinal() && marksThere[k] == Mark.ARROW.ordinal();
    }

    /** Whether the graph has the edge {@code a — b}. */
    public boolean hasUndirected(int a, int b) {
        int k = slot(a, b);
        return k >= 0 && marksHere[k] == Mark.TAIL.ordinal() && marksThere[k] == Mark.TAIL.ordinal();
    }

    /** The variables {@code p} with {@code p → v}, ascending. */
    public int[] parents(int v) {
        return select(v, Mark.ARROW, Mark.TAIL);
    }

    /** The variables {@code c} with {@code v → c}, ascending. */
    public int[] children(int v) {
        return select(v, Mark.TAIL, Mark.ARROW);
    }

    /** The variables joined to {@code v} by an undirected edge, ascending. */
    public int[] undirectedNeighbours(int v) {
        return select(v, Mark.TAIL, Mark.TAIL);
    }

    /** The variables {@code s} with {@code v ↔ s}, ascending. */
    public int[] spouses(int v) {
        return select(v, Mark.ARROW, Mark.ARROW);
    }

    private int[] select(int v, Mark here, Mark there) {
        int from = offsets[v];
        int to = offsets[v + 1];
        int[] out = new int[to - from];
        int n = 0;
        for (int k = from; k < to; k++) {
            if (marksHere[k] == here.ordinal() && marksThere[k] == there.ordinal()) {
                out[n++] = neighbours[k];
            }
        }
        return n == out.length ? out : Arrays.copyOf(out, n);
    }

    /** All edges, each once with {@code a < b}, sorted by (a, b). */
    public List<Edge> edges() {
        List<Edge> out = new ArrayList<>(edgeCount);
        for (int v = 0; v < size(); v++) {
            for (int k = offsets[v]; k < offsets[v + 1]; k++) {
                int w = neighbours[k];
                if (v < w) {
                    out.add(new Edge(v, w, MARKS[marksHere[k]], MARKS[marksThere[k]]));
                }
            }
        }
        return Collections.unmodifiableList(out);
    }

    /** Whether every edge is directed. */
    public boolean isFullyDirected() {
        for (int k = 0; k < neighbours.length; k++) {
            if (marksHere[k] == marksThere[k] || marksHere[k] == Mark.CIRCLE.ordinal()
                    || marksThere[k] == Mark.CIRCLE.ordinal()) {
                return false;
            }
        }
        return true;
    }

    /** A mutable copy, for algorithms that change the graph. */
    public MutableGraph toMutable() {
        MutableGraph g = new MutableGraph(names);
        for (int v = 0; v < size(); v++) {
            if (hidden[v]) {
                g.setHidden(v, true);
            }
        }
        for (Edge e : edges()) {
            g.addEdge(e);
        }
        return g;
    }

    /** The same graph with the variables of these names flagged hidden and all others observed. */
    public Graph withHidden(Set<String> hiddenNames) {
        MutableGraph g = toMutable();
        for (int v = 0; v < size(); v++) {
            g.setHidden(v, hiddenNames.contains(names.get(v)));
        }
        for (String name : hiddenNames) {
            index(name);
        }
        return g.freeze();
    }

    /** Same variables (in order), same hidden flags, same edges with the same marks. */
    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof Graph)) {
            return false;
        }
        Graph g = (Graph) o;
        return names.equals(g.names) && Arrays.equals(hidden, g.hidden) && Arrays.equals(offsets, g.offsets)
                && Arrays.equals(neighbours, g.neighbours) && Arrays.equals(marksHere, g.marksHere)
                && Arrays.equals(marksThere, g.marksThere);
    }

    /** Same edges with the same marks, ignoring hidden flags (variables must match in order). */
    public boolean sameEdges(Graph g) {
        return names.equals(g.names) && Arrays.equals(offsets, g.offsets)
                && Arrays.equals(neighbours, g.neighbours) && Arrays.equals(marksHere, g.marksHere)
                && Arrays.equals(marksThere, g.marksThere);
    }

    @Override
    public int hashCode() {
        int h = hash;
        if (h == 0) {
            h = names.hashCode();
            h = 31 * h + Arrays.hashCode(hidden);
            h = 31 * h + Arrays.hashCode(neighbours);
            h = 31 * h + Arrays.hashCode(marksHere);
            h = 31 * h + Arrays.hashCode(marksThere);
            hash = h;
        }
        return h;
    }

    /** A readable one-line form such as {@code A --> B; B o-o C}. */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        for (Edge e : edges()) {
            if (sb.length() > 0) {
                sb.append("; ");
            }
            sb.append(name(e.a())).append(' ').append(left(e.atA())).append('-').append(right(e.atB()))
                    .append(' ').append(name(e.b()));
        }
        return sb.length() == 0 ? "(no edges over " + size() + " variables)" : sb.toString();
    }

    private static char left(Mark m) {
        return m == Mark.ARROW ? '<' : m == Mark.CIRCLE ? 'o' : '-';
    }

    private static char right(Mark m) {
        return m == Mark.ARROW ? '>' : m == Mark.CIRCLE ? 'o' : '-';
    }

    static Map<String, Integer> indexNames(List<String> names) {
        Map<String, Integer> map = new HashMap<>(names.size() * 2);
        for (int i = 0; i < names.size(); i++) {
            String n = names.get(i);
            if (n == null || n.isBlank()) {
                throw new IllegalArgumentException("variable " + (i + 1) + " has an empty name");
            }
            if (map.put(n, i) != null) {
                throw new IllegalArgumentException("variable name '" + n + "' appears twice");
            }
        }
        return map;
    }
}
