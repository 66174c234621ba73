package dev.touchstone.learners.independence;

import dev.touchstone.core.param.Worded;

/** How independence tests treat rows with missing cells. */
public enum MissingPolicy implements Worded {
    /** Each test uses the rows complete for its own variables (Tu et al. 2019, "Causal discovery in the presence of missing data", AISTATS). */
    TEST_WISE,
    /** Every row with any missing cell is dropped before testing (list-wise deletion, the naive baseline). */
    LIST_WISE
}
