package dev.touchstone.harness.study;

import java.util.List;

/**
 * The metric names a study may ask for, with one-line meanings, and the default list used
 * when a study names none. Implemented over the metrics module's registry.
 */
public interface MetricCatalog {

    /** The metrics the runner measures itself (time, memory, counters), not computed from graphs. */
    List<String> MEASURED = List.of("seconds", "cpu_seconds", "allocated_mb", "tests", "scores");

    /** Every known metric name, in a stable order. */
    List<String> names();

    /** One line saying what the metric measures. */
    String meaning(String name);

    /** The metrics used when a study does not list any. */
    List<String> defaults();

    default boolean contains(String name) {
        return names().contains(name);
    }
}
