package dev.touchstone.harness.study;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One sub-section of a study's truth as written: its kind and, for each parameter given,
 * the list of values it takes (one value, or several that become an axis of the grid).
 * Values are already checked and converted by their {@code ParameterSpec}. Immutable.
 */
public record ComponentSpec(String section, String kind, Map<String, List<Object>> axes) {

    public ComponentSpec {
        Map<String, List<Object>> copy = new LinkedHashMap<>();
        axes.forEach((k, v) -> copy.put(k, List.copyOf(v)));
        axes = Collections.unmodifiableMap(copy);
    }

    /** The number of combinations of this section's values. */
    public long combinations() {
        long n = 1;
        for (List<Object> v : axes.values()) {
            n = Math.multiplyExact(n, v.size());
        }
        return n;
    }
}
