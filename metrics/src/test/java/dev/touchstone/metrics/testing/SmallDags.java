package dev.touchstone.metrics.testing;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.testing.RandomDags;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;

/**
 * Test helper: every labelled DAG on n nodes (each pair absent, a → b or b → a; keep the acyclic
 * ones), and their Markov equivalence classes grouped by skeleton and v-structures (Verma and
 * Pearl 1990). The CPDAG of a class is built from its definition: an edge is directed when all
 * members agree on it, undirected otherwise (Andersson, Madigan and Perlman 1997).
 */
public final class SmallDags {

    private SmallDags() {
    }

    /** All labelled DAGs on n ≤ 5 nodes over X1 … Xn. */
    public static List<Graph> all(int n) {
        List<int[]> pairs = new ArrayList<>();
        for (int a = 0; a < n; a++) {
            for (int b = a + 1; b < n; b++) {
                pairs.add(new int[] {a, b});
            }
        }
        List<Graph> out = new ArrayList<>();
        int total = (int) Math.pow(3, pairs.size());
        for (int code = 0; code < total; code++) {
            MutableGraph g = Graph.builder(RandomDags.names(n));
            int c = code;
            for (int[] pr : pairs) {
                int d = c % 3;
                c /= 3;
                if (d == 1) {
                    g.addDirected(pr[0], pr[1]);
                } else if (d == 2) {
                    g.addDirected(pr[1], pr[0]);
                }
            }
            Graph f = g.freeze();
            if (Ancestry.isAcyclic(f)) {
                out.add(f);
            }
        }
        return out;
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
