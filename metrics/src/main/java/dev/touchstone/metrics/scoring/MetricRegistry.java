package dev.touchstone.metrics.scoring;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Every metric Touchstone knows, by name, in the order listings and tables show them. Study
 * validation asks it whether a metric name exists before anything runs.
 */
public final class MetricRegistry {

    private static final List<StructuralMetric> STRUCTURAL = List.of(
            StructuralHammingDistance.INSTANCE,
            AdjacencyPrecision.INSTANCE, AdjacencyRecall.INSTANCE, AdjacencyF1.INSTANCE, AdjacencyFalsePositiveRate.INSTANCE,
            OrientationPrecision.INSTANCE, OrientationRecall.INSTANCE, OrientationF1.INSTANCE, WrongArrowheads.INSTANCE,
            TailPrecision.INSTANCE, TailRecall.INSTANCE,
            DirectedTruePositiveRate.INSTANCE, DirectedFalseDiscoveryRate.INSTANCE, DirectedFalsePositiveRate.INSTANCE,
            Sid.INSTANCE, SidLower.INSTANCE, SidUpper.INSTANCE,
            ExactMatch.INSTANCE, EdgeCount.INSTANCE, UndirectedEdges.INSTANCE);

    private static final List<Measurement> MEASUREMENTS = List.of(
            Measurement.SECONDS, Measurement.CPU_SECONDS, Measurement.ALLOCATED_MB, Measurement.TESTS, Measurement.SCORES);

    private static final Map<String, Metric> BY_NAME;

    static {
        Map<String, Metric> m = new LinkedHashMap<>();
        for (Metric x : STRUCTURAL) {
            m.put(x.name(), x);
        }
        for (Metric x : MEASUREMENTS) {
            m.put(x.name(), x);
        }
        for (Metric x : SearchGapMeasure.ALL) {
            m.put(x.name(), x);
        }
        BY_NAME = Collections.unmodifiableMap(m);
    }

    private MetricRegistry() {
    }

    /** All metrics, structural first, then measurements, then the search-gap measures. */
    public static List<Metric> all() {
        return List.copyOf(BY_NAME.values());
    }

    /** The metrics computed by comparing graphs. */
    public static List<StructuralMetric> structural() {
        return STRUCTURAL;
    }

    /** The metrics measured while a run runs. */
    public static List<Measurement> measurements() {
        return MEASUREMENTS;
    }

    /** All metric names, in listing order. */
    public static List<String> names() {
        return new ArrayList<>(BY_NAME.keySet());
    }

    /** The metric of this name, if there is one. */
    public static Optional<Metric> find(String name) {
        return Optional.ofNullable(BY_NAME.get(name));
    }

    /**
     * The metric of this name.
     *
     * @throws IllegalArgumentException naming the unknown metric and the known names
     */
    public static Metric get(String name) {
        Metric m = BY_NAME.get(name);
        if (m == null) {
            throw new IllegalArgumentException("unknown metric '" + name + "' (known: " + String.join(", ", BY_NAME.keySet()) + ")");
        }
        return m;
    }
}
