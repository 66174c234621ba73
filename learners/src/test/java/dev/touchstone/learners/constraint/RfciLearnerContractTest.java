package dev.touchstone.learners.constraint;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** RFCI passes the learner contract of core. */
class RfciLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new RfciLearner();
    }
}
