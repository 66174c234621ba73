package dev.touchstone.metrics.scoring;

/**
 * {@code adjacency_f1}: 2 · pairs adjacent in both / (edges in the estimate + edges in the truth), the harmonic mean of adjacency precision and recall (null when neither graph has an edge)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class AdjacencyF1 extends BaseMetric {

    /** The one instance. */
    public static final AdjacencyF1 INSTANCE = new AdjacencyF1();

    private AdjacencyF1() {
        super("adjacency_f1", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, ALL,
                "2 · pairs adjacent in both / (edges in the estimate + edges in the truth), the harmonic mean of adjacency precision and recall (null when neither graph has an edge)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return f1(n.edges().common(), n.edges().inEstimate(), n.edges().inTruth());
    }
}
