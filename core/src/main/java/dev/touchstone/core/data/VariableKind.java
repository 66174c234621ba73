package dev.touchstone.core.data;

import dev.touchstone.core.param.Worded;

/** Whether a variable's values are real numbers or category codes. */
public enum VariableKind implements Worded {
    CONTINUOUS,
    DISCRETE;
}
