package dev.touchstone.core.param;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Checked values for a list of declared parameters, defaults filled in. Immutable.
 * Build with {@link #resolve(String, List, Map)}.
 */
public final class ParameterValues {

    private final Map<String, Object> values;

    private ParameterValues(Map<String, Object> values) {
        this.values = Collections.unmodifiableMap(values);
    }

    /** No parameters at all. */
    public static ParameterValues none() {
        return new ParameterValues(new LinkedHashMap<>());
    }

    /**
     * Checks raw values against the declarations and fills in defaults.
     *
     * @param owner what the parameters belong to (e.g. "learner pc"), used in messages
     * @throws ParameterException for an unknown name (listing the known ones), a bad value,
     *     or a parameter without a default that was not given
     */
    public static ParameterValues resolve(String owner, List<ParameterSpec> specs, Map<String, ?> raw) {
        Map<String, ParameterSpec> byName = new LinkedHashMap<>();
        for (ParameterSpec s : specs) {
            byName.put(s.name(), s);
        }
        for (String key : raw.keySet()) {
            if (!byName.containsKey(key)) {
                String known = byName.isEmpty() ? "it has none" : "allowed: " + String.join(", ", byName.keySet());
                throw new ParameterException(key, "unknown parameter '" + key + "' for " + owner + " (" + known + ")"
                        + FormerNames.hint(key, byName.keySet()));
            }
        }
        Map<String, Object> out = new LinkedHashMap<>();
        for (ParameterSpec s : specs) {
            Object v = raw.get(s.name());
            if (v == null) {
                if (s.defaultValue() == null) {
                    throw new ParameterException(s.name(), "parameter '" + s.name() + "' of " + owner
                            + " is required (allowed: " + s.allowed() + ")");
                }
                v = s.defaultValue();
            }
            out.put(s.name(), s.parse(v));
        }
        return new ParameterValues(out);
    }

    /** All values by name, in declaration order. */
    public Map<String, Object> asMap() {
        return values;
    }

    public Object get(String name) {
        Object v = values.get(name);
        if (v == null && !values.containsKey(name)) {
            throw new IllegalArgumentException("no parameter '" + name + "' was declared");
        }
        return v;
    }

    /**
     * The typed value of a declared parameter.
     *
     * @throws IllegalArgumentException when {@code parameter} is not among the declarations these values were resolved from
     */
    public <T> T get(Parameter<T> parameter) {
        return parameter.convert(get(parameter.name()));
    }

    public int getInt(String name) {
        return ((Number) get(name)).intValue();
    }

    public double getDouble(String name) {
        return ((Number) get(name)).doubleValue();
    }

    public boolean getBoolean(String name) {
        return (Boolean) get(name);
    }

    public String getString(String name) {
        return get(name).toString();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ParameterValues && ((ParameterValues) o).values.equals(values);
    }

    @Override
    public int hashCode() {
        return values.hashCode();
    }

    @Override
    public String toString() {
        return values.toString();
    }
}
