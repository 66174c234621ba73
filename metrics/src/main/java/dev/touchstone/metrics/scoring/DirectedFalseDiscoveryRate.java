package dev.touchstone.metrics.scoring;

/**
 * {@code directed_fdr}: (reversed + false positives) / estimated edges, as in Zheng et al. (2018): reversed = directed x → y on a true-adjacent pair with a true arrowhead at x; false positive = estimated edge on a pair the truth does not join (null when the estimate has no edge)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class DirectedFalseDiscoveryRate extends BaseMetric {

    /** The one instance. */
    public static final DirectedFalseDiscoveryRate INSTANCE = new DirectedFalseDiscoveryRate();

    private DirectedFalseDiscoveryRate() {
        super("directed_fdr", Direction.LOWER_IS_BETTER, MetricRange.UNIT, DAG_OR_CPDAG,
                "(reversed + false positives) / estimated edges, as in Zheng et al. (2018): reversed = directed x → y on a true-adjacent pair with a true arrowhead at x; false positive = estimated edge on a pair the truth does not join (null when the estimate has no edge)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.directed().reversed() + n.extraEdges(), n.edges().inEstimate());
    }
}
