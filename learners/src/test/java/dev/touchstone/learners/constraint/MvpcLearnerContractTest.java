package dev.touchstone.learners.constraint;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** MVPC passes the learner contract of core. */
class MvpcLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new MvpcLearner();
    }
}
