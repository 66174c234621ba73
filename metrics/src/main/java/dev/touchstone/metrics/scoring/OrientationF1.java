package dev.touchstone.metrics.scoring;

/**
 * {@code orientation_f1}: 2 · matched arrowheads / (estimated arrowheads + true arrowheads), the harmonic mean of orientation precision and recall (null when neither graph has an arrowhead)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class OrientationF1 extends BaseMetric {

    /** The one instance. */
    public static final OrientationF1 INSTANCE = new OrientationF1();

    private OrientationF1() {
        super("orientation_f1", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, ALL,
                "2 · matched arrowheads / (estimated arrowheads + true arrowheads), the harmonic mean of orientation precision and recall (null when neither graph has an arrowhead)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return f1(n.arrows().correct(), n.arrows().inEstimate(), n.arrows().inTruth());
    }
}
