package dev.touchstone.learners.hybrid;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** MMHC passes the learner contract of core. */
class MmhcLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new MmhcLearner();
    }
}
