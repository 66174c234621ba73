package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.algorithms.PagRules;
import dev.touchstone.core.param.Worded;

/**
 * Whether FCI's orientation rules may assume there is no selection bias (Zhang 2008, "On the
 * completeness of orientation rules for causal discovery in the presence of latent confounders
 * and selection bias", Artificial Intelligence 172): the {@code selection_bias} choice of FCI,
 * RFCI and GFCI's constraint half, in one place.
 */
enum SelectionBias implements Worded {
    /** Rules R1-R4 and R8-R10, complete when there is no selection bias. */
    ABSENT,
    /** All of R1-R10. */
    POSSIBLE;

    /** The rules this choice runs. */
    PagRules rules() {
        return this == POSSIBLE ? PagRules.complete() : PagRules.withoutSelectionBias();
    }
}
