package dev.touchstone.metrics.scoring;

/**
 * {@code exact}: 1 when the estimate has exactly the truth's edges with the same marks, else 0
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class ExactMatch extends BaseMetric {

    /** The one instance. */
    public static final ExactMatch INSTANCE = new ExactMatch();

    private ExactMatch() {
        super("exact", Direction.HIGHER_IS_BETTER, MetricRange.ZERO_ONE, ALL,
                "1 when the estimate has exactly the truth's edges with the same marks, else 0");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return n.differingPairs() == 0 ? 1.0 : 0.0;
    }
}
