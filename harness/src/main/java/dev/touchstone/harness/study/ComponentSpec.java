package dev.touchstone.harness.study;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One sub-section of a study's truth as written: its kinds (one, or several that form an axis; and the key
 * that names them) and, for each parameter given,
 * the list of values it takes (one value, or several that become an axis of the grid).
 * Values are already checked and converted by their {@code ParameterSpec}. Immutable.
 */
public record ComponentSpec(String section, String kindField, List<String> kinds, Map<String, List<Object>> axes) {

    public ComponentSpec(String section, String kindField, String kind, Map<String, List<Object>> axes) {
        this(section, kindField, List.of(kind), axes);
    }

    public ComponentSpec {
        Map<String, List<Object>> copy = new LinkedHashMap<>();
        axes.forEach((k, v) -> copy.put(k, List.copyOf(v)));
        axes = Collections.unmodifiableMap(copy);
        kinds = List.copyOf(kinds);
    }

    /** The first (often only) kind. */
    public String kind() {
        return kinds.get(0);
    }

    /** The number of combinations of this section's values. */
    public long combinations() {
        long n = kinds.size();
        for (List<Object> v : axes.values()) {
            n = Math.multiplyExact(n, v.size());
        }
        return n;
    }
}
