package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.GraphClass;

import java.util.Set;

/**
 * A named quantity recorded for every run: either computed by comparing the estimate with the
 * truth ({@link StructuralMetric}) or measured while the run ran ({@link Measurement}).
 *
 * <p>Each metric declares what a report and a comparison need to treat it correctly: its
 * direction, its range and the classes of estimate it applies to. For estimates of other
 * classes its value is undefined (null), never 0.
 */
public interface Metric {

    /** The plain name used in study files and column headers, such as {@code adjacency_f1}. */
    String name();

    /** Which way the metric improves. */
    Direction direction();

    /** The values it can take. */
    MetricRange range();

    /** The classes of estimate it is defined for. */
    Set<GraphClass> appliesTo();

    /** One line saying exactly what is computed, with its source. */
    String definition();

    /** Whether it is defined for an estimate of this class. */
    default boolean appliesTo(GraphClass estimateClass) {
        return appliesTo().contains(estimateClass);
    }
}
