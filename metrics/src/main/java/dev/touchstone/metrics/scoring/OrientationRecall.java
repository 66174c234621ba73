package dev.touchstone.metrics.scoring;

/**
 * {@code orientation_recall}: true arrowheads matched by an estimated arrowhead at the same end of the same pair / true arrowheads (null without true arrowheads)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class OrientationRecall extends BaseMetric {

    /** The one instance. */
    public static final OrientationRecall INSTANCE = new OrientationRecall();

    private OrientationRecall() {
        super("orientation_recall", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, ALL,
                "true arrowheads matched by an estimated arrowhead at the same end of the same pair / true arrowheads (null without true arrowheads)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.arrows().correct(), n.arrows().inTruth());
    }
}
