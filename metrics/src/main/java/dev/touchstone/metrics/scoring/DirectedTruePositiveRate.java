package dev.touchstone.metrics.scoring;

/**
 * {@code directed_tpr}: true positives / true edges, as in Zheng et al. (2018): an estimated edge on a true-adjacent pair is a true positive when it is undirected or directed x → y with no true arrowhead at x (null when the truth has no edge)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class DirectedTruePositiveRate extends BaseMetric {

    /** The one instance. */
    public static final DirectedTruePositiveRate INSTANCE = new DirectedTruePositiveRate();

    private DirectedTruePositiveRate() {
        super("directed_tpr", Direction.HIGHER_IS_BETTER, MetricRange.UNIT, DAG_OR_CPDAG,
                "true positives / true edges, as in Zheng et al. (2018): an estimated edge on a true-adjacent pair is a true positive when it is undirected or directed x → y with no true arrowhead at x (null when the truth has no edge)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.directed().hits(), n.edges().inTruth());
    }
}
