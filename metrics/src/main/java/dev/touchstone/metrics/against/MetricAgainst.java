package dev.touchstone.metrics.against;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.scoring.Metric;
import dev.touchstone.metrics.scoring.MetricRegistry;
import dev.touchstone.metrics.truth.TruthSelection;

import java.util.Optional;

/**
 * A metric measured against the truth of a requested class instead of the one
 * {@link TruthSelection#forEstimate} picks (a study's {@code score_against}), named
 * {@code METRIC_vs_CLASS}: {@code shd_vs_cpdag} is the SHD of the estimate, as returned,
 * against the true CPDAG. It has its base metric's direction, range and definition, so
 * summaries, paired comparisons and rankings treat it as they treat the base metric
 * ({@link #resolve}). Immutable; parsing costs O(length of the name).
 *
 * @param base    the metric, e.g. {@code shd}
 * @param against the class of the truth, e.g. CPDAG
 */
public record MetricAgainst(String base, GraphClass against) {

    /** What joins a metric and a class in the name. */
    public static final String JOIN = "_vs_";

    /** The column name, {@code METRIC_vs_CLASS}. */
    public String name() {
        return base + JOIN + against.word();
    }

    /** The metric a name stands for, or null when it is a plain metric (or the class is unknown). */
    public static MetricAgainst parse(String name) {
        int at = name.lastIndexOf(JOIN);
        if (at <= 0) {
            return null;
        }
        try {
            return new MetricAgainst(name.substring(0, at), GraphClass.parse(name.substring(at + JOIN.length())));
        } catch (IllegalArgumentException e) {
            return null;
        }
    }

    /**
     * The metric that decides how values of this name are treated: the registry's metric of a
     * plain name, or the base metric of a {@code METRIC_vs_CLASS} name.
     */
    public static Optional<Metric> find(String name) {
        MetricAgainst x = parse(name);
        return MetricRegistry.find(x == null ? name : x.base());
    }

    /**
     * Like {@link #find}, refusing an unknown name.
     *
     * @throws IllegalArgumentException naming the unknown metric and the known names
     */
    public static Metric resolve(String name) {
        MetricAgainst x = parse(name);
        if (x == null) {
            return MetricRegistry.get(name);
        }
        return MetricRegistry.find(x.base()).orElseThrow(() -> new IllegalArgumentException("unknown metric '"
                + x.base() + "' in '" + name + "' (known: " + String.join(", ", MetricRegistry.names()) + ")"));
    }
}
