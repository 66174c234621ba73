package dev.touchstone.core.learner;

import dev.touchstone.core.param.Worded;

/** The family a learner belongs to, for grouping in listings and reports. */
public enum LearnerFamily implements Worded {
    BASELINE,
    CONSTRAINT,
    SCORE,
    HYBRID,
    FUNCTIONAL,
    CONTINUOUS,
    EXTERNAL;
}
