package dev.touchstone.metrics.scoring;

/**
 * {@code adjacency_precision}: pairs adjacent in both graphs / pairs adjacent in the estimate (null when the estimate has no edge)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class AdjacencyPrecision extends BaseMetric {

    /** The one instance. */
    public static final AdjacencyPrecision INSTANCE = new AdjacencyPrecision();

    private AdjacencyPrecision() {
        super("adjacency_precision", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, ALL,
                "pairs adjacent in both graphs / pairs adjacent in the estimate (null when the estimate has no edge)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.edges().common(), n.edges().inEstimate());
    }
}
