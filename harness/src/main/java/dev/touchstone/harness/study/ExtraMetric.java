package dev.touchstone.harness.study;

import dev.touchstone.core.graph.GraphClass;

import java.util.ArrayList;
import java.util.List;

/**
 * A metric computed against a truth of a requested class besides the default one (a study's
 * {@code score_against}), named {@code METRIC_vs_CLASS}: {@code shd_vs_cpdag} is the SHD of
 * the estimate, as returned, against the true CPDAG. Immutable.
 *
 * @param base    the metric, e.g. {@code shd}
 * @param against the class of the truth, e.g. CPDAG
 */
public record ExtraMetric(String base, GraphClass against) {

    /** What joins a metric and a class in the name. */
    public static final String JOIN = "_vs_";

    public String name() {
        return base + JOIN + against.word();
    }

    /** The extra metric a name stands for, or null when it is a plain metric. */
    public static ExtraMetric parse(String name) {
        int at = name.lastIndexOf(JOIN);
        if (at <= 0) {
            return null;
        }
        try {
            return new ExtraMetric(name.substring(0, at), GraphClass.parse(name.substring(at + JOIN.length())));
        } catch (IllegalArgumentException e) {
            return null;
        }
    }

    /**
     * The study's metrics followed by, for each class in {@code against}, every structural
     * metric (not one the runner measures itself) against that class.
     */
    public static List<String> expand(List<String> metrics, List<GraphClass> against) {
        List<String> out = new ArrayList<>(metrics);
        for (GraphClass c : against) {
            for (String m : metrics) {
                if (!MetricCatalog.MEASURED.contains(m)) {
                    out.add(new ExtraMetric(m, c).name());
                }
            }
        }
        return out;
    }
}
