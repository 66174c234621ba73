package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.GraphClass;

import java.util.EnumSet;
import java.util.Set;

/**
 * A quantity measured while a run ran rather than computed from its estimate: wall-clock and
 * CPU seconds, allocated megabytes, independence tests and score evaluations. The values live in
 * {@link dev.touchstone.metrics.results.Timings}; these descriptors give them a name, a direction and a range
 * so that studies can ask for them and comparisons can treat them like any metric.
 */
public final class Measurement implements Metric {

    public static final Measurement SECONDS = new Measurement("seconds", "wall-clock seconds of the learner's run");
    public static final Measurement CPU_SECONDS = new Measurement("cpu_seconds", "CPU seconds used by the run's threads");
    public static final Measurement ALLOCATED_MB = new Measurement("allocated_mb", "megabytes allocated by the run's threads");
    public static final Measurement TESTS = new Measurement("tests", "independence tests the learner performed");
    public static final Measurement SCORES = new Measurement("scores", "local score evaluations the learner performed");

    private final String name;
    private final String definition;

    private Measurement(String name, String definition) {
        this.name = name;
        this.definition = definition;
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public Direction direction() {
        return Direction.LOWER_IS_BETTER;
    }

    @Override
    public MetricRange range() {
        return MetricRange.NON_NEGATIVE;
    }

    @Override
    public Set<GraphClass> appliesTo() {
        return EnumSet.allOf(GraphClass.class);
    }

    @Override
    public String definition() {
        return definition;
    }

    @Override
    public String toString() {
        return name;
    }
}
