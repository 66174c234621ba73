package dev.touchstone.core.data;

import java.util.Locale;

/** The kind of a whole data set: all continuous, all discrete, or a mix of both. */
public enum DataKind {
    CONTINUOUS,
    DISCRETE,
    MIXED;

    /** The lower-case word used in files and listings. */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }
}
