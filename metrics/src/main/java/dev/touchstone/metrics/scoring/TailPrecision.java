package dev.touchstone.metrics.scoring;

/**
 * {@code tail_precision}: for MAG and PAG estimates: estimated tails at x on {x, y} where the truth has an edge on {x, y} with a tail at x / estimated tails; tails on pairs the truth does not join count as wrong (null without estimated tails)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class TailPrecision extends BaseMetric {

    /** The one instance. */
    public static final TailPrecision INSTANCE = new TailPrecision();

    private TailPrecision() {
        super("tail_precision", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, ANCESTRAL,
                "for MAG and PAG estimates: estimated tails at x on {x, y} where the truth has an edge on {x, y} with a tail at x / estimated tails; tails on pairs the truth does not join count as wrong (null without estimated tails)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.tails().correct(), n.tails().inEstimate());
    }
}
