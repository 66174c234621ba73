package dev.touchstone.metrics.scoring;

import dev.touchstone.metrics.sid.SidResult;

/**
 * {@code sid_lower}: for DAG and CPDAG estimates: the lower bound of the SID over the DAGs the estimate stands for (Peters and Bühlmann 2015); equals sid for a DAG; null when the truth has hidden variables
 *
 * <p>Cost: that of {@link dev.touchstone.metrics.sid.StructuralInterventionDistance}, shared by the three SID metrics of
 * one comparison.
 */
public final class SidLower extends BaseMetric {

    /** The one instance. */
    public static final SidLower INSTANCE = new SidLower();

    private SidLower() {
        super("sid_lower", Direction.LOWER_IS_BETTER, MetricRange.upTo("p(p−1)"), DAG_OR_CPDAG,
                "for DAG and CPDAG estimates: the lower bound of the SID over the DAGs the estimate stands for (Peters and Bühlmann 2015); equals sid for a DAG; null when the truth has hidden variables");
    }

    @Override
    public Double value(GraphComparison c) {
        SidResult s = c.sid();
        return s == null ? null : (double) s.lower();
    }
}
