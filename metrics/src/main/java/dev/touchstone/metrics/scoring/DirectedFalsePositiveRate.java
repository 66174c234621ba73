package dev.touchstone.metrics.scoring;

/**
 * {@code directed_fpr}: (reversed + false positives) / (p(p−1)/2 − true edges), as in Zheng et al. (2018) (null when the truth joins every pair)
 *
 * <p>As in Zheng et al. (2018), reversed edges are counted among the errors but the denominator counts
 * only the pairs the truth does not join, so the rate can exceed 1 when many edges are reversed.
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class DirectedFalsePositiveRate extends BaseMetric {

    /** The one instance. */
    public static final DirectedFalsePositiveRate INSTANCE = new DirectedFalsePositiveRate();

    private DirectedFalsePositiveRate() {
        super("directed_fpr", Direction.LOWER_IS_BETTER,
                new MetricRange(0, null, "≥ 0 (reversed edges count above the line but not below it, so it can exceed 1)"), DAG_OR_CPDAG,
                "(reversed + false positives) / (p(p−1)/2 − true edges), as in Zheng et al. (2018) (null when the truth joins every pair)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.directed().reversed() + n.extraEdges(), n.pairs() - n.edges().inTruth());
    }
}
