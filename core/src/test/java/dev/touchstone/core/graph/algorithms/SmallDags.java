package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * All DAGs on n ≤ 5 variables, enumerated once per test run, and their Markov equivalence
 * classes grouped by skeleton and v-structures (Verma and Pearl 1990), which is independent
 * of both CPDAG constructions under test.
 */
final class SmallDags {

    private static final Map<Integer, List<Graph>> DAGS = new LinkedHashMap<>();
    private static final Map<Integer, List<List<Graph>>> CLASSES = new LinkedHashMap<>();

    private SmallDags() {
    }

    static synchronized List<Graph> dags(int n) {
        return DAGS.computeIfAbsent(n, DagEnumeration::all);
    }

    /** The Markov equivalence classes on n variables, each a list of its DAGs. */
    static synchronized List<List<Graph>> classes(int n) {
        return CLASSES.computeIfAbsent(n, k -> {
            Map<String, List<Graph>> byKey = new LinkedHashMap<>();
            for (Graph d : dags(k)) {
                byKey.computeIfAbsent(vermaPearlKey(d), x -> new ArrayList<>()).add(d);
            }
            return new ArrayList<>(byKey.values());
        });
    }

    /** Skeleton plus v-structures, written out. */
    static String vermaPearlKey(Graph d) {
        StringBuilder sb = new StringBuilder();
        for (Edge e : d.edges()) {
            sb.append(e.a()).append('-').append(e.b()).append(' ');
        }
        sb.append('|');
        for (VStructures.VStructure v : VStructures.of(d)) {
            sb.append(' ').append(v.a()).append('>').append(v.collider()).append('<').append(v.b());
        }
        return sb.toString();
    }

    /**
     * The essential graph of a class by its definition (Andersson, Madigan and Perlman
     * 1997): an edge is directed when all members orient it the same way, else undirected.
     */
    static Graph essentialGraph(List<Graph> members) {
        Graph first = members.get(0);
        var m = Graph.builder(first.names());
        for (Edge e : first.edges()) {
            boolean same = true;
            for (Graph d : members) {
                if (!d.edge(e.a(), e.b()).equals(e)) {
                    same = false;
                    break;
                }
            }
            if (same) {
                m.addEdge(e);
            } else {
                m.addUndirected(e.a(), e.b());
            }
        }
        return m.freeze();
    }
}
