package dev.touchstone.generators.graphs;

import org.jgrapht.Graph;
import org.jgrapht.graph.DefaultEdge;
import org.jgrapht.graph.SimpleGraph;
import org.jgrapht.util.SupplierUtil;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** Helpers for JGraphT's undirected generators, whose vertices we read as causal positions. */
final class UndirectedGraphs {

    private UndirectedGraphs() {
    }

    /** An empty simple undirected graph with integer vertices created in order. */
    static Graph<Integer, DefaultEdge> empty() {
        return new SimpleGraph<>(SupplierUtil.createIntegerSupplier(), SupplierUtil.createDefaultEdgeSupplier(), false);
    }

    /**
     * The edges as pairs of positions, where a vertex's position is its rank in creation
     * order (JGraphT's vertex set iterates in insertion order).
     */
    static List<int[]> positionPairs(Graph<Integer, DefaultEdge> g) {
        Map<Integer, Integer> position = new HashMap<>();
        for (Integer v : g.vertexSet()) {
            position.put(v, position.size());
        }
        List<int[]> out = new ArrayList<>(g.edgeSet().size());
        for (DefaultEdge e : g.edgeSet()) {
            out.add(new int[] {position.get(g.getEdgeSource(e)), position.get(g.getEdgeTarget(e))});
        }
        return out;
    }
}
