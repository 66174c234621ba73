package dev.touchstone.core.learner;

import java.util.Locale;

/** The family a learner belongs to, for grouping in listings and reports. */
public enum LearnerFamily {
    BASELINE,
    CONSTRAINT,
    SCORE,
    HYBRID,
    FUNCTIONAL,
    CONTINUOUS,
    EXTERNAL;

    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }
}
