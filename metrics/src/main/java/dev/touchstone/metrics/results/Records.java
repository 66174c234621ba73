package dev.touchstone.metrics.results;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/** Argument checks and defensive copies shared by the records of this package. */
final class Records {

    private Records() {
    }

    /** An unmodifiable ordered copy whose keys are non-blank and whose values are non-null. */
    static Map<String, String> textMap(Map<String, String> in, String what) {
        Objects.requireNonNull(in, what);
        Map<String, String> out = new LinkedHashMap<>();
        for (Map.Entry<String, String> e : in.entrySet()) {
            String k = requireName(e.getKey(), what + " name");
            out.put(k, Objects.requireNonNull(e.getValue(), what + " '" + k + "' has no value"));
        }
        return Collections.unmodifiableMap(out);
    }

    /** An unmodifiable ordered copy whose keys are non-blank and whose values may be null (undefined). */
    static Map<String, Double> valueMap(Map<String, Double> in, String what) {
        Objects.requireNonNull(in, what);
        Map<String, Double> out = new LinkedHashMap<>();
        for (Map.Entry<String, Double> e : in.entrySet()) {
            String k = requireName(e.getKey(), what + " name");
            out.put(k, finiteOrNull(e.getValue(), what + " '" + k + "'"));
        }
        return Collections.unmodifiableMap(out);
    }

    static String requireName(String s, String what) {
        if (s == null || s.isBlank()) {
            throw new IllegalArgumentException(what + " is empty");
        }
        return s;
    }

    /** Null stays null (undefined); NaN and infinities are refused, since tidy files cannot carry them. */
    static Double finiteOrNull(Double v, String what) {
        if (v != null && !Double.isFinite(v)) {
            throw new IllegalArgumentException(what + " must be finite or undefined (null), got " + v);
        }
        return v;
    }

    static int nonNegative(int v, String what) {
        if (v < 0) {
            throw new IllegalArgumentException(what + " must be ≥ 0, got " + v);
        }
        return v;
    }

    static <T> List<T> list(List<T> in, String what) {
        Objects.requireNonNull(in, what);
        for (T t : in) {
            Objects.requireNonNull(t, what + " has a null element");
        }
        return List.copyOf(in);
    }

    /** An unmodifiable copy that allows null elements (undefined values). */
    static List<Double> values(List<Double> in, String what) {
        Objects.requireNonNull(in, what);
        java.util.ArrayList<Double> out = new java.util.ArrayList<>(in.size());
        for (Double d : in) {
            out.add(finiteOrNull(d, what));
        }
        return Collections.unmodifiableList(out);
    }
}
