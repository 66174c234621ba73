package dev.touchstone.core.param;

import java.util.List;
import java.util.Objects;
import java.util.function.Function;

/**
 * A declared parameter together with its Java type: a learner or generator declares each of
 * its parameters once as one of these, lists them in its description (which holds the
 * {@link #spec()} that study files, the command line and listings read), and reads the checked
 * value back typed with {@link ParameterValues#get(Parameter)}, instead of looking a name up
 * and converting it in every place that needs it. Choices are enums implementing
 * {@link Worded}, so a learner receives the constant, never the word. Immutable.
 *
 * @param <T> the type of the value: Integer, Double, Boolean, String or an enum
 */
public final class Parameter<T> {

    private final ParameterSpec spec;
    private final Function<Object, T> convert;

    private Parameter(ParameterSpec spec, Function<Object, T> convert) {
        this.spec = Objects.requireNonNull(spec, "spec");
        this.convert = convert;
    }

    /** A whole number in [min, max]. */
    public static Parameter<Integer> integer(String name, int defaultValue, int min, int max, String meaning) {
        return new Parameter<>(ParameterSpec.integer(name, defaultValue, min, max, meaning),
                v -> ((Number) v).intValue());
    }

    /** A real number in [min, max]; pass infinities for an open side. */
    public static Parameter<Double> real(String name, double defaultValue, double min, double max, String meaning) {
        return new Parameter<>(ParameterSpec.real(name, defaultValue, min, max, meaning),
                v -> ((Number) v).doubleValue());
    }

    /** {@code true} or {@code false}. */
    public static Parameter<Boolean> bool(String name, boolean defaultValue, String meaning) {
        return new Parameter<>(ParameterSpec.bool(name, defaultValue, meaning), v -> (Boolean) v);
    }

    /** Free text. */
    public static Parameter<String> text(String name, String defaultValue, String meaning) {
        return new Parameter<>(ParameterSpec.text(name, defaultValue, meaning), Object::toString);
    }

    /** One of the constants of {@code defaultValue}'s enum, written as their {@link Worded#word() words}. */
    public static <E extends Enum<E> & Worded> Parameter<E> choice(String name, E defaultValue, String meaning) {
        Class<E> type = defaultValue.getDeclaringClass();
        return new Parameter<>(ParameterSpec.choice(name, defaultValue.word(), Worded.words(type), meaning),
                v -> Worded.parse(type, v.toString(), "value of '" + name + "'"));
    }

    /**
     * One of a list of words that name no enum (for example an open family such as the
     * independence tests, with {@code auto} among them); the value is the word as declared.
     */
    public static Parameter<String> oneOf(String name, String defaultValue, List<String> choices, String meaning) {
        return new Parameter<>(ParameterSpec.choice(name, defaultValue, choices, meaning), Object::toString);
    }

    /** The declaration that study files, the command line and listings read. */
    public ParameterSpec spec() {
        return spec;
    }

    /** The parameter's name as written in files and on the command line. */
    public String name() {
        return spec.name();
    }

    /** The typed value of an already checked raw value (as held by {@link ParameterValues}). */
    T convert(Object checked) {
        return convert.apply(checked);
    }

    @Override
    public String toString() {
        return spec.toString();
    }
}
