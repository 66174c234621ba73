package dev.touchstone.core.data;

import java.util.List;
import java.util.Objects;

/**
 * A named column of a data set: continuous, or discrete with its categories in code order
 * (code {@code k} means {@code categories.get(k)}).
 */
public record Variable(String name, VariableKind kind, List<String> categories) {

    public Variable {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(kind, "kind");
        if (name.isBlank()) {
            throw new IllegalArgumentException("a variable needs a non-empty name");
        }
        categories = List.copyOf(categories);
        if (kind == VariableKind.CONTINUOUS && !categories.isEmpty()) {
            throw new IllegalArgumentException("continuous variable '" + name + "' cannot have categories");
        }
        if (kind == VariableKind.DISCRETE && categories.isEmpty()) {
            throw new IllegalArgumentException("discrete variable '" + name + "' needs at least one category");
        }
    }

    public static Variable continuous(String name) {
        return new Variable(name, VariableKind.CONTINUOUS, List.of());
    }

    public static Variable discrete(String name, List<String> categories) {
        return new Variable(name, VariableKind.DISCRETE, categories);
    }

    /** A discrete variable with categories "0", "1", …, "cardinality − 1". */
    public static Variable discrete(String name, int cardinality) {
        String[] c = new String[cardinality];
        for (int i = 0; i < cardinality; i++) {
            c[i] = Integer.toString(i);
        }
        return discrete(name, List.of(c));
    }

    public boolean isDiscrete() {
        return kind == VariableKind.DISCRETE;
    }

    /** The number of categories (0 for continuous variables). */
    public int cardinality() {
        return categories.size();
    }
}
