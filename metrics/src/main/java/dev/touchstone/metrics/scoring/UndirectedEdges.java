package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

/**
 * {@code undirected_edges}: edges of the estimate with a tail at both ends (x — y)
 *
 * <p>The edges a DAG or CPDAG estimate leaves unoriented. Ramsey, Zhang and Spirtes (2006,
 * UAI) describe the price of conservative collider orientation as more unoriented edges; this
 * counts them. A DAG has none; for other classes circles are not tails, so it is declared for
 * DAG and CPDAG estimates only.
 *
 * <p>Cost: O(p + E) over the estimate's adjacency rows.
 */
public final class UndirectedEdges extends BaseMetric {

    /** The one instance. */
    public static final UndirectedEdges INSTANCE = new UndirectedEdges();

    private UndirectedEdges() {
        super("undirected_edges", Direction.NONE, MetricRange.upTo("p(p−1)/2"), DAG_OR_CPDAG,
                "edges of the estimate with a tail at both ends, left unoriented (for DAG and CPDAG estimates)");
    }

    @Override
    public Double value(GraphComparison c) {
        Graph g = c.estimate();
        long count = 0;
        for (int v = 0; v < g.size(); v++) {
            for (int k = 0; k < g.degree(v); k++) {
                // each pair once, at its lower end
                if (v < g.neighbour(v, k) && g.markHere(v, k) == Mark.TAIL && g.markThere(v, k) == Mark.TAIL) {
                    count++;
                }
            }
        }
        return (double) count;
    }
}
