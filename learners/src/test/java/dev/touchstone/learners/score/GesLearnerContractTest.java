package dev.touchstone.learners.score;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** GES passes the learner contract (core's LearnerContractTest). */
class GesLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new GesLearner();
    }
}
