package dev.touchstone.metrics.testing;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;

/**
 * Test helper: Markov equivalence classes of DAGs grouped by skeleton and v-structures (Verma and
 * Pearl 1990), independently of core's CPDAG construction. The CPDAG of a class is built from its definition: an edge is directed when all
 * members agree on it, undirected otherwise (Andersson, Madigan and Perlman 1997).
 */
public final class SmallDags {

    private SmallDags() {
    }

    /** The key of a DAG's Markov equivalence class: its skeleton and its v-structures. */
    public static String classKey(Graph dag) {
        TreeSet<String> parts = new TreeSet<>();
        for (Edge e : dag.edges()) {
            parts.add("s" + e.a() + "-" + e.b());
        }
        for (int v = 0; v < dag.size(); v++) {
            int[] pa = dag.parents(v);
            for (int x = 0; x < pa.length; x++) {
                for (int y = x + 1; y < pa.length; y++) {
                    if (!dag.adjacent(pa[x], pa[y])) {
                        parts.add("v" + pa[x] + ">" + v + "<" + pa[y]);
                    }
                }
            }
        }
        return String.join(",", parts);
    }

    /** The DAGs grouped into Markov equivalence classes, in first-seen order. */
    public static List<List<Graph>> classes(List<Graph> dags) {
        Map<String, List<Graph>> byKey = new LinkedHashMap<>();
        for (Graph g : dags) {
            byKey.computeIfAbsent(classKey(g), k -> new ArrayList<>()).add(g);
        }
        return new ArrayList<>(byKey.values());
    }

    /** The CPDAG of a class from its members: directed where all agree, undirected elsewhere. */
    public static Graph cpdag(List<Graph> members) {
        Graph first = members.get(0);
        MutableGraph g = Graph.builder(first.names());
        for (Edge e : first.edges()) {
            boolean same = true;
            for (Graph m : members) {
                same &= m.hasDirected(e.isDirectedFrom(e.a()) ? e.a() : e.b(), e.isDirectedFrom(e.a()) ? e.b() : e.a());
            }
            if (same) {
                g.addEdge(e);
            } else {
                g.addUndirected(e.a(), e.b());
            }
        }
        return g.freeze();
    }
}
