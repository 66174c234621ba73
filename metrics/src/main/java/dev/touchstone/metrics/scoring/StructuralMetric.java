package dev.touchstone.metrics.scoring;

/** A metric computed from the comparison of an estimate with its truth. */
public interface StructuralMetric extends Metric {

    /**
     * The value for this comparison, or null when undefined (a zero denominator, a truth
     * that lacks what the metric needs). Callers check {@link #appliesTo(dev.touchstone.core.graph.GraphClass)}
     * first; {@link Scorer} does.
     */
    Double value(GraphComparison comparison);
}
