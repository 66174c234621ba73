package dev.touchstone.harness.study;

import dev.touchstone.metrics.scoring.Metric;
import dev.touchstone.metrics.scoring.MetricRegistry;

import java.util.ArrayList;
import java.util.List;

/** The metric catalogue over the metrics module's registry. */
public final class RegistryMetricCatalog implements MetricCatalog {

    /** What a study gets when it lists no metrics (those the registry knows, in this order). */
    static final List<String> PREFERRED_DEFAULTS = List.of("shd", "adjacency_f1", "orientation_f1", "sid", "seconds");

    @Override
    public List<String> names() {
        return MetricRegistry.names();
    }

    @Override
    public String meaning(String name) {
        return MetricRegistry.find(name).map(Metric::definition).orElse("");
    }

    @Override
    public List<String> defaults() {
        List<String> out = new ArrayList<>();
        for (String m : PREFERRED_DEFAULTS) {
            if (MetricRegistry.find(m).isPresent()) {
                out.add(m);
            }
        }
        return out;
    }
}
