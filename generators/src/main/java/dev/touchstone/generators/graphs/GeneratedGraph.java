package dev.touchstone.generators.graphs;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;

import java.util.List;
import java.util.Objects;

/**
 * What a graph family produced: the DAG, the background knowledge the family implies
 * (tiers for layered graphs, none otherwise), and the causal order it was built along.
 *
 * @param dag         the true DAG over the variables, in column (name) order
 * @param knowledge   knowledge implied by the construction ({@link Knowledge#none()} if none)
 * @param causalOrder the variable names in the order the DAG was built along (a topological order)
 */
public record GeneratedGraph(Graph dag, Knowledge knowledge, List<String> causalOrder) {

    public GeneratedGraph {
        Objects.requireNonNull(dag, "dag");
        Objects.requireNonNull(knowledge, "knowledge");
        causalOrder = List.copyOf(causalOrder);
        if (causalOrder.size() != dag.size()) {
            throw new IllegalArgumentException("causal order has " + causalOrder.size() + " names for a graph of "
                    + dag.size());
        }
    }
}
