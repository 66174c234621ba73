package dev.touchstone.metrics.scoring;

/**
 * {@code edges}: the number of edges in the estimate
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class EdgeCount extends BaseMetric {

    /** The one instance. */
    public static final EdgeCount INSTANCE = new EdgeCount();

    private EdgeCount() {
        super("edges", Direction.NONE, MetricRange.upTo("p(p−1)/2"), ALL,
                "the number of edges in the estimate");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return (double) n.edges().inEstimate();
    }
}
