package dev.touchstone.learners.constraint;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** PC passes the learner contract of core. */
class PcLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new PcLearner();
    }
}
