package dev.touchstone.core.data;

import java.util.Locale;

/** Whether a variable's values are real numbers or category codes. */
public enum VariableKind {
    CONTINUOUS,
    DISCRETE;

    /** The lower-case word used in files. */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }
}
