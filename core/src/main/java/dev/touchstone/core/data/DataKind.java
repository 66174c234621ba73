package dev.touchstone.core.data;

import dev.touchstone.core.param.Worded;

/** The kind of a whole data set: all continuous, all discrete, or a mix of both. */
public enum DataKind implements Worded {
    CONTINUOUS,
    DISCRETE,
    MIXED;
}
