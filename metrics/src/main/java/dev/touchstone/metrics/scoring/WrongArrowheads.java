package dev.touchstone.metrics.scoring;

/**
 * {@code wrong_arrowheads}: estimated arrowheads that {@code orientation_precision} counts as wrong
 *
 * <p>The count behind the comparison of Ramsey, Zhang and Spirtes (2006, UAI), who report the
 * arrowhead errors of PC and of its conservative variant: an arrowhead at x on {x, y} is wrong
 * when the truth has no edge on {x, y} or no arrowhead at x there. A count rather than a
 * ratio, so that a learner cannot look better merely by placing fewer arrowheads without
 * that showing in {@code undirected_edges} or {@code orientation_recall}.
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class WrongArrowheads extends BaseMetric {

    /** The one instance. */
    public static final WrongArrowheads INSTANCE = new WrongArrowheads();

    private WrongArrowheads() {
        super("wrong_arrowheads", Direction.LOWER_IS_BETTER, MetricRange.upTo("p(p−1)"), ALL,
                "estimated arrowheads at x on {x, y} where the truth has no edge on {x, y} or no arrowhead at x "
                        + "(Ramsey, Zhang and Spirtes 2006 count these arrowhead errors)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return (double) (n.arrows().inEstimate() - n.arrows().correct());
    }
}
