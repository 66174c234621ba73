package dev.touchstone.learners.score;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** BOSS passes the learner contract (core's LearnerContractTest). */
class BossLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new BossLearner();
    }
}
