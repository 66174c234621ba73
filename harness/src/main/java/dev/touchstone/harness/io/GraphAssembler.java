package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Builds a graph from the parts read from a graph file, with the checks every graph format
 * shares, each failure naming the file and the edge: unknown variable, self-loop, a pair
 * given twice, an unknown mark, marks the expected class does not allow, and a directed
 * cycle where a DAG is expected (found with {@link Ancestry#topologicalOrder}). Cost
 * O(V + E) plus one topological sort.
 */
final class GraphAssembler {

    private final Path file;
    private final MutableGraph graph;
    private final GraphClass expected;
    private final Map<Long, String> placeOfPair = new HashMap<>();

    /**
     * @param variables the names, in order (checked: none empty, none repeated)
     * @param expected  the class the graph must belong to, or null for any
     */
    GraphAssembler(Path file, List<String> variables, GraphClass expected, String variablesPlace) {
        this.file = file;
        this.expected = expected;
        Map<String, Integer> seen = new HashMap<>();
        for (int i = 0; i < variables.size(); i++) {
            String v = variables.get(i);
            if (v == null || v.isBlank()) {
                throw new FileFormatException(file, variablesPlace, "variable " + (i + 1) + " has an empty name");
            }
            Integer prev = seen.put(v, i);
            if (prev != null) {
                throw new FileFormatException(file, variablesPlace, "variable '" + v + "' is listed twice");
            }
        }
        this.graph = Graph.builder(variables);
    }

    /** Flags these variables hidden; an unknown name is refused. */
    void hide(List<String> hidden, String place) {
        for (String h : hidden) {
            int i = graph.indexOf(h);
            if (i < 0) {
                throw new FileFormatException(file, place, "hidden variable '" + h + "' is not among the variables");
            }
            graph.setHidden(i, true);
        }
    }

    /** Adds the edge a (mark at a) — b (mark at b) read at {@code place}. */
    void add(String a, String b, String markA, String markB, String place) {
        String where = place + " (" + a + ", " + b + ")";
        int ia = index(a, where);
        int ib = index(b, where);
        if (ia == ib) {
            throw new FileFormatException(file, where, "an edge from '" + a + "' to itself (self-loop)");
        }
        Mark ma = mark(markA, where);
        Mark mb = mark(markB, where);
        long key = ia < ib ? ((long) ia << 32) | ib : ((long) ib << 32) | ia;
        String earlier = placeOfPair.putIfAbsent(key, place);
        if (earlier != null) {
            throw new FileFormatException(file, where, "'" + a + "' and '" + b + "' are joined twice (also "
                    + earlier + ")");
        }
        Edge e = new Edge(ia, ib, ma, mb);
        if (expected != null && !expected.allows(e)) {
            throw new FileFormatException(file, where, "marks " + ma.word() + "/" + mb.word()
                    + " are not allowed in a " + expected.word().toUpperCase(java.util.Locale.ROOT));
        }
        graph.addEdge(e);
    }

    private int index(String name, String where) {
        int i = graph.indexOf(name);
        if (i < 0) {
            throw new FileFormatException(file, where, "unknown variable '" + name + "'");
        }
        return i;
    }

    /** The mark spelled exactly as files write it (lower case); anything else is refused with the spellings. */
    private Mark mark(String word, String where) {
        for (Mark m : Mark.values()) {
            if (m.word().equals(word)) {
                return m;
            }
        }
        throw new FileFormatException(file, where, "unknown mark '" + word + "' (allowed: tail, arrow, circle)");
    }

    /** The graph, after the whole-graph checks of the expected class. */
    Graph build() {
        Graph g = graph.freeze();
        // No class a graph file can hold (DAG, CPDAG, MAG, PAG) has a directed cycle.
        if (Ancestry.topologicalOrder(g) == null) {
            throw new FileFormatException(file, null, "the edges form a directed cycle ("
                    + describeCycle(g) + "), but " + (expected == null ? "a causal graph" : "a "
                    + expected.word().toUpperCase(java.util.Locale.ROOT)) + " has none; remove or reverse one of its edges");
        }
        return g;
    }

    /** One directed cycle, found by walking back along parents inside the part that cannot be sorted. */
    private static String describeCycle(Graph g) {
        int n = g.size();
        // Peel off variables with no parents (then no children) until only cycles and what hangs between them remain.
        int[] indegree = new int[n];
        for (int v = 0; v < n; v++) {
            indegree[v] = g.parents(v).length;
        }
        boolean[] removed = new boolean[n];
        java.util.ArrayDeque<Integer> queue = new java.util.ArrayDeque<>();
        for (int v = 0; v < n; v++) {
            if (indegree[v] == 0) {
                queue.add(v);
            }
        }
        while (!queue.isEmpty()) {
            int v = queue.poll();
            removed[v] = true;
            for (int c : g.children(v)) {
                if (--indegree[c] == 0) {
                    queue.add(c);
                }
            }
        }
        int start = -1;
        for (int v = 0; v < n && start < 0; v++) {
            if (!removed[v]) {
                start = v;
            }
        }
        // Every remaining variable has a remaining parent, so walking to parents must revisit one.
        List<Integer> walk = new ArrayList<>();
        Map<Integer, Integer> at = new HashMap<>();
        int v = start;
        while (!at.containsKey(v)) {
            at.put(v, walk.size());
            walk.add(v);
            int next = -1;
            for (int p : g.parents(v)) {
                if (!removed[p]) {
                    next = p;
                    break;
                }
            }
            v = next;
        }
        List<Integer> cycle = new ArrayList<>(walk.subList(at.get(v), walk.size()));
        java.util.Collections.reverse(cycle);
        // Start at the smallest index so the message does not depend on where the walk began.
        java.util.Collections.rotate(cycle, -cycle.indexOf(java.util.Collections.min(cycle)));
        StringBuilder sb = new StringBuilder();
        for (int u : cycle) {
            sb.append(g.name(u)).append(" -> ");
        }
        return sb.append(g.name(cycle.get(0))).toString();
    }
}
