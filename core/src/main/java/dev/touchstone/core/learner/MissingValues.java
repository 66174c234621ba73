package dev.touchstone.core.learner;

import dev.touchstone.core.param.Worded;

/** How a learner treats missing cells. */
public enum MissingValues implements Worded {
    /** Refuses data with missing cells. */
    REJECTS,
    /** Drops every row with a missing cell before learning (list-wise deletion). */
    LIST_WISE,
    /** Each test or score uses the rows complete for its own variables (test-wise deletion, Tu et al. 2019). */
    TEST_WISE,
    /** Chosen by a parameter of the learner. */
    CONFIGURABLE,
    /** Handles them by a method of its own, described in its summary. */
    OWN_METHOD;
}
