package dev.touchstone.learners.constraint;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** FCI passes the learner contract of core. */
class FciLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new FciLearner();
    }
}
