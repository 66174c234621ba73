package dev.touchstone.metrics.scoring;

/**
 * {@code tail_recall}: for MAG and PAG estimates: true tails matched by an estimated tail at the same end of the same pair / true tails (null without true tails)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class TailRecall extends BaseMetric {

    /** The one instance. */
    public static final TailRecall INSTANCE = new TailRecall();

    private TailRecall() {
        super("tail_recall", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, ANCESTRAL,
                "for MAG and PAG estimates: true tails matched by an estimated tail at the same end of the same pair / true tails (null without true tails)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.tails().correct(), n.tails().inTruth());
    }
}
