package dev.touchstone.core.param;

import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * The declaration of one parameter of a learner or generator: name, type, default,
 * allowed range or choices, and a one-line meaning. Study files, the command line and
 * the {@code learners} listing all read these, so they cannot disagree. Learners and
 * generators usually declare a typed {@link Parameter}, which wraps one of these.
 *
 * @param name         the parameter's name as written in files and on the command line
 * @param domain       its type with the allowed range or choices
 * @param defaultValue the value used when none is given (Integer, Double, Boolean or String), or null when required
 * @param meaning      one line saying what it does
 */
public record ParameterSpec(String name, Domain domain, Object defaultValue, String meaning) {

    static final String UNKNOWN_CHOICE = "parameter '%s': '%s' is not allowed (allowed: %s)";
    static final String OUT_OF_RANGE = "parameter '%s': %s is outside the allowed range %s";
    static final String NOT_A = "parameter '%s': '%s' is not %s";

    /**
     * What values a parameter takes.
     *
     * @param type    its type
     * @param min     the smallest allowed value (numbers only), or null
     * @param max     the largest allowed value (numbers only), or null
     * @param choices the allowed words ({@link ParameterType#CHOICE} only)
     */
    public record Domain(ParameterType type, Double min, Double max, List<String> choices) {
        public Domain {
            Objects.requireNonNull(type, "type");
            choices = choices == null ? List.of() : List.copyOf(choices);
            if (type == ParameterType.CHOICE && choices.isEmpty()) {
                throw new IllegalArgumentException("a choice parameter needs choices");
            }
            if (min != null && max != null && min > max) {
                throw new IllegalArgumentException("min " + min + " > max " + max);
            }
        }

        /** A type without range or choices (boolean, text). */
        public static Domain of(ParameterType type) {
            return new Domain(type, null, null, List.of());
        }

        /** A number type within [min, max]. */
        public static Domain range(ParameterType type, double min, double max) {
            return new Domain(type, min, max, List.of());
        }

        /** One of these words. */
        public static Domain choices(List<String> choices) {
            return new Domain(ParameterType.CHOICE, null, null, choices);
        }
    }

    public ParameterSpec {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(domain, "domain");
        Objects.requireNonNull(meaning, "meaning");
    }

    /** An integer parameter in [min, max]. */
    public static ParameterSpec integer(String name, int defaultValue, int min, int max, String meaning) {
        return checked(new ParameterSpec(name, Domain.range(ParameterType.INTEGER, min, max), defaultValue, meaning));
    }

    /** A real parameter in [min, max]; pass infinities for an open side. */
    public static ParameterSpec real(String name, double defaultValue, double min, double max, String meaning) {
        return checked(new ParameterSpec(name, Domain.range(ParameterType.REAL, min, max), defaultValue, meaning));
    }

    public static ParameterSpec bool(String name, boolean defaultValue, String meaning) {
        return new ParameterSpec(name, Domain.of(ParameterType.BOOLEAN), defaultValue, meaning);
    }

    public static ParameterSpec choice(String name, String defaultValue, List<String> choices, String meaning) {
        return checked(new ParameterSpec(name, Domain.choices(choices), defaultValue, meaning));
    }

    public static ParameterSpec text(String name, String defaultValue, String meaning) {
        return new ParameterSpec(name, Domain.of(ParameterType.TEXT), defaultValue, meaning);
    }

    private static ParameterSpec checked(ParameterSpec s) {
        s.parse(s.defaultValue());
        return s;
    }

    /** The same declaration under another name with another meaning (e.g. prefixed by a step's name). */
    public ParameterSpec renamed(String newName, String newMeaning) {
        return new ParameterSpec(newName, domain, defaultValue, newMeaning);
    }

    /** The same declaration without a default: a value must be given. */
    public ParameterSpec required() {
        return new ParameterSpec(name, domain, null, meaning);
    }

    public ParameterType type() {
        return domain.type();
    }

    /** The smallest allowed value (numbers only), or null. */
    public Double min() {
        return domain.min();
    }

    /** The largest allowed value (numbers only), or null. */
    public Double max() {
        return domain.max();
    }

    /** The allowed words ({@link ParameterType#CHOICE} only). */
    public List<String> choices() {
        return domain.choices();
    }

    /** The allowed values in words, e.g. {@code [0, 1]}, {@code fisher-z, g-square} or {@code true, false}. */
    public String allowed() {
        switch (type()) {
            case CHOICE:
                return String.join(", ", choices());
            case BOOLEAN:
                return "true, false";
            case TEXT:
                return "any text";
            default:
                return "[" + bound(min(), "-inf") + ", " + bound(max(), "inf") + "]";
        }
    }

    private String bound(Double b, String open) {
        if (b == null || b.isInfinite()) {
            return open;
        }
        if (type() == ParameterType.INTEGER) {
            return Long.toString(b.longValue());
        }
        return Double.toString(b);
    }

    /**
     * Checks and converts a raw value (a String from the command line, or a number,
     * boolean or string from a study file) to this parameter's Java type.
     *
     * @throws ParameterException naming the parameter, the value and what is allowed
     */
    public Object parse(Object raw) {
        if (raw == null) {
            throw new ParameterException(name, "parameter '" + name + "' needs a value (allowed: " + allowed() + ")");
        }
        switch (type()) {
            case INTEGER:
                return checkRange(toLong(raw));
            case REAL:
                return checkRange(toDouble(raw));
            case BOOLEAN:
                return toBoolean(raw);
            case CHOICE: {
                String s = raw.toString().trim();
                for (String c : choices()) {
                    if (c.equalsIgnoreCase(s)) {
                        return c;
                    }
                }
                throw new ParameterException(name, String.format(Locale.ROOT, UNKNOWN_CHOICE, name, s, allowed())
                        + FormerNames.hint(s, choices()));
            }
            default:
                return raw.toString();
        }
    }

    private Object checkRange(Number v) {
        double d = v.doubleValue();
        if ((min() != null && d < min()) || (max() != null && d > max())) {
            throw new ParameterException(name, String.format(Locale.ROOT, OUT_OF_RANGE, name, v, allowed()));
        }
        return v instanceof Long ? (Object) Math.toIntExact((Long) v) : v;
    }

    private Long toLong(Object raw) {
        if (raw instanceof Integer || raw instanceof Long || raw instanceof Short) {
            return ((Number) raw).longValue();
        }
        if (raw instanceof Number) {
            double d = ((Number) raw).doubleValue();
            if (d == Math.rint(d) && !Double.isInfinite(d)) {
                return (long) d;
            }
        } else {
            try {
                return Long.parseLong(raw.toString().trim());
            } catch (NumberFormatException e) {
                // reported below
            }
        }
        throw new ParameterException(name, String.format(Locale.ROOT, NOT_A, name, raw, "a whole number"));
    }

    private Double toDouble(Object raw) {
        double d;
        if (raw instanceof Number) {
            d = ((Number) raw).doubleValue();
        } else {
            try {
                d = Double.parseDouble(raw.toString().trim());
            } catch (NumberFormatException e) {
                throw new ParameterException(name, String.format(Locale.ROOT, NOT_A, name, raw, "a number"));
            }
        }
        if (Double.isNaN(d) || Double.isInfinite(d)) {
            throw new ParameterException(name, String.format(Locale.ROOT, NOT_A, name, raw, "a finite number"));
        }
        return d;
    }

    private Boolean toBoolean(Object raw) {
        if (raw instanceof Boolean) {
            return (Boolean) raw;
        }
        String s = raw.toString().trim().toLowerCase(Locale.ROOT);
        if (s.equals("true")) {
            return true;
        }
        if (s.equals("false")) {
            return false;
        }
        throw new ParameterException(name, String.format(Locale.ROOT, NOT_A, name, raw, "true or false"));
    }
}
