package dev.touchstone.core.param;

/** The type of a declared parameter. */
public enum ParameterType implements Worded {
    /** A whole number, within an optional range. */
    INTEGER,
    /** A real number, within an optional range; NaN and infinities are refused. */
    REAL,
    /** {@code true} or {@code false}. */
    BOOLEAN,
    /** One of a fixed list of words. */
    CHOICE,
    /** Free text. */
    TEXT;
}
