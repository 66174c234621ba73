package dev.touchstone.learners.hybrid;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** GFCI passes the learner contract of core. */
class GfciLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new GfciLearner();
    }
}
