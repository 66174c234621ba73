package dev.touchstone.metrics.scoring;

/**
 * {@code orientation_precision}: estimated arrowheads at x on {x, y} where the truth has an edge on {x, y} with an arrowhead at x / estimated arrowheads; arrowheads on pairs the truth does not join count as wrong (null without estimated arrowheads)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class OrientationPrecision extends BaseMetric {

    /** The one instance. */
    public static final OrientationPrecision INSTANCE = new OrientationPrecision();

    private OrientationPrecision() {
        super("orientation_precision", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, ALL,
                "estimated arrowheads at x on {x, y} where the truth has an edge on {x, y} with an arrowhead at x / estimated arrowheads; arrowheads on pairs the truth does not join count as wrong (null without estimated arrowheads)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.arrows().correct(), n.arrows().inEstimate());
    }
}
