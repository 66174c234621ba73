package dev.touchstone.core.learner;

import dev.touchstone.core.param.Worded;

/** What a learner can do with an infinite sample size (the oracle). */
public enum OracleUse implements Worded {
    /** Cannot use it: runs with oracle sample size are skipped with a recorded reason. */
    NONE,
    /** Uses d-separation (or m-separation) answers in place of independence tests. */
    INDEPENDENCE,
    /** Uses the exact population covariance in place of the sample covariance. */
    COVARIANCE;
}
