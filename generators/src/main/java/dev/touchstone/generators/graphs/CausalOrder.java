package dev.touchstone.generators.graphs;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.random.Shuffles;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.List;

/**
 * A random assignment of variables to causal positions: position {@code k} of the order
 * holds variable {@code variableAt(k)}. Families build edges between positions (always from
 * the earlier to the later one, which makes the result acyclic by construction) and this
 * class maps them onto the variables {@code X1 … Xp}, so that column order never leaks the
 * causal order. Cost O(p) to draw.
 */
final class CausalOrder {

    /** The {@code nodes} parameter every random family declares. */
    static final ParameterSpec NODES = ParameterSpec.integer("nodes", 10, 1, 100_000,
            "number of variables, named X1, X2, … in column order");

    private final List<String> names;
    private final int[] variableAt;

    private CausalOrder(List<String> names, int[] variableAt) {
        this.names = names;
        this.variableAt = variableAt;
    }

    /** A uniformly random order of the variables {@code X1 … Xp} (Fisher–Yates shuffle). */
    static CausalOrder random(int nodes, UniformRandomProvider random) {
        return new CausalOrder(defaultNames(nodes), Shuffles.permutation(random, nodes));
    }

    /** The names {@code X1 … Xp}. */
    static List<String> defaultNames(int nodes) {
        List<String> out = new ArrayList<>(nodes);
        for (int i = 1; i <= nodes; i++) {
            out.add("X" + i);
        }
        return List.copyOf(out);
    }

    int size() {
        return variableAt.length;
    }

    int variableAt(int position) {
        return variableAt[position];
    }

    /** A builder over the variables with no edges. */
    MutableGraph newGraph() {
        return Graph.builder(names);
    }

    /** Adds the edge from the variable at position {@code earlier} to the one at {@code later}. */
    void addEdge(MutableGraph g, int earlier, int later) {
        if (earlier == later) {
            throw new IllegalArgumentException("no self loops");
        }
        int a = Math.min(earlier, later);
        int b = Math.max(earlier, later);
        g.addDirected(variableAt[a], variableAt[b]);
    }

    /** The names in causal order. */
    List<String> namesInOrder() {
        List<String> out = new ArrayList<>(variableAt.length);
        for (int v : variableAt) {
            out.add(names.get(v));
        }
        return out;
    }

    GeneratedGraph result(MutableGraph g, Knowledge knowledge) {
        return new GeneratedGraph(g.freeze(), knowledge, namesInOrder());
    }
}
