package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.GraphClass;

import java.util.Collections;
import java.util.EnumSet;
import java.util.Set;

/** The declared properties shared by every structural metric; subclasses add only the value. */
abstract class BaseMetric implements StructuralMetric {

    static final Set<GraphClass> ALL = Collections.unmodifiableSet(EnumSet.allOf(GraphClass.class));
    static final Set<GraphClass> DAG_OR_CPDAG = Collections.unmodifiableSet(EnumSet.of(GraphClass.DAG, GraphClass.CPDAG));
    static final Set<GraphClass> DAG_ONLY = Collections.unmodifiableSet(EnumSet.of(GraphClass.DAG));
    static final Set<GraphClass> ANCESTRAL = Collections.unmodifiableSet(EnumSet.of(GraphClass.MAG, GraphClass.PAG));

    private final String name;
    private final Direction direction;
    private final MetricRange range;
    private final Set<GraphClass> classes;
    private final String definition;

    BaseMetric(String name, Direction direction, MetricRange range, Set<GraphClass> classes, String definition) {
        this.name = name;
        this.direction = direction;
        this.range = range;
        this.classes = classes;
        this.definition = definition;
    }

    @Override
    public final String name() {
        return name;
    }

    @Override
    public final Direction direction() {
        return direction;
    }

    @Override
    public final MetricRange range() {
        return range;
    }

    @Override
    public final Set<GraphClass> appliesTo() {
        return classes;
    }

    @Override
    public final String definition() {
        return definition;
    }

    @Override
    public String toString() {
        return name;
    }

    /** F1 as 2·hits / (estimated + true): the harmonic mean of precision and recall when both are defined. */
    static Double f1(long hits, long estimated, long truth) {
        return EdgeCounts.ratio(2 * hits, estimated + truth);
    }
}
