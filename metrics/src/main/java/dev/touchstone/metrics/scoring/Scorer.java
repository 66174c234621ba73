package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.truth.Truth;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Scores an estimate against its truth on a list of metrics, giving an ordered map from metric
 * name to value. A metric that does not apply to the estimate's class, or is undefined for this
 * pair, maps to null. Measurements (seconds, tests …) are not computed here and are skipped.
 *
 * <p>Cost: O(p + E) for the structural counts, plus the SID's cost when an SID metric is asked for.
 */
public final class Scorer {

    private Scorer() {
    }

    /** The values of the given metrics (by name; unknown names are refused) for this estimate. */
    public static Map<String, Double> score(Truth truth, Graph estimate, GraphClass estimateClass, List<String> metricNames) {
        GraphComparison c = GraphComparison.of(truth, estimate, estimateClass);
        Map<String, Double> out = new LinkedHashMap<>();
        for (String name : metricNames) {
            Metric m = MetricRegistry.get(name);
            if (m instanceof StructuralMetric) {
                out.put(name, value((StructuralMetric) m, c));
            }
        }
        return Collections.unmodifiableMap(out);
    }

    /** The values of every structural metric for this estimate. */
    public static Map<String, Double> scoreAll(Truth truth, Graph estimate, GraphClass estimateClass) {
        GraphComparison c = GraphComparison.of(truth, estimate, estimateClass);
        Map<String, Double> out = new LinkedHashMap<>();
        for (StructuralMetric m : MetricRegistry.structural()) {
            out.put(m.name(), value(m, c));
        }
        return Collections.unmodifiableMap(out);
    }

    /** One metric's value for one comparison: null when it does not apply to the estimate's class. */
    public static Double value(StructuralMetric m, GraphComparison c) {
        return m.appliesTo(c.estimateClass()) ? m.value(c) : null;
    }
}
