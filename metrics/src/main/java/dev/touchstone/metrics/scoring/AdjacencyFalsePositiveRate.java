package dev.touchstone.metrics.scoring;

/**
 * {@code adjacency_fpr}: pairs adjacent in the estimate but not in the truth / pairs not adjacent in the truth
 * (null when the truth joins every pair)
 *
 * <p>The skeleton's false positive rate as Kalisch and Bühlmann (2007, JMLR 8, §4) report it
 * beside the true positive rate ({@code adjacency_recall}): marks are ignored, only adjacency
 * counts, so it is defined for every graph class.
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class AdjacencyFalsePositiveRate extends BaseMetric {

    /** The one instance. */
    public static final AdjacencyFalsePositiveRate INSTANCE = new AdjacencyFalsePositiveRate();

    private AdjacencyFalsePositiveRate() {
        super("adjacency_fpr", Direction.LOWER_IS_BETTER, MetricRange.UNIT, ALL,
                "pairs adjacent in the estimate but not in the truth / pairs not adjacent in the truth, the skeleton's "
                        + "false positive rate of Kalisch and Bühlmann (2007) (null when the truth joins every pair)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return EdgeCounts.ratio(n.extraEdges(), n.pairs() - n.edges().inTruth());
    }
}
