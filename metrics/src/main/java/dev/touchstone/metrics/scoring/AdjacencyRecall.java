package dev.touchstone.metrics.scoring;

/**
 * {@code adjacency_recall}: pairs adjacent in both graphs / pairs adjacent in the truth (null when the truth has no edge)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class AdjacencyRecall extends BaseMetric {

    /** The one instance. */
    public static final AdjacencyRecall INSTANCE = new AdjacencyRecall();

    private AdjacencyRecall() {
        super("adjacency_recall", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, ALL,
                "pairs adjacent in both graphs / pairs adjacent in the truth (null when the truth has no edge)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.edges().common(), n.edges().inTruth());
    }
}
