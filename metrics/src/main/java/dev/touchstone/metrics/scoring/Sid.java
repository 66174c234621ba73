package dev.touchstone.metrics.scoring;

import dev.touchstone.metrics.sid.SidResult;

/**
 * {@code sid}: for DAG estimates: ordered pairs (i, j) whose intervention distribution p(x_j | do(x_i)) is wrongly inferred by adjusting for the estimate's parents of i (Peters and Bühlmann 2015); null when the truth has hidden variables
 *
 * <p>Cost: that of {@link dev.touchstone.metrics.sid.StructuralInterventionDistance}, shared by the three SID metrics of
 * one comparison.
 */
public final class Sid extends BaseMetric {

    /** The one instance. */
    public static final Sid INSTANCE = new Sid();

    private Sid() {
        super("sid", Direction.LOWER_IS_BETTER, MetricRange.upTo("p(p−1)"), DAG_ONLY,
                "for DAG estimates: ordered pairs (i, j) whose intervention distribution p(x_j | do(x_i)) is wrongly inferred by adjusting for the estimate's parents of i (Peters and Bühlmann 2015); null when the truth has hidden variables");
    }

    @Override
    public Double value(GraphComparison c) {
        SidResult s = c.sid();
        return s == null || s.sid() == null ? null : s.sid().doubleValue();
    }
}
