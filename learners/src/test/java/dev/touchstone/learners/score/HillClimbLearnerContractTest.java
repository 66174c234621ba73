package dev.touchstone.learners.score;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** Hill climbing passes the learner contract (core's LearnerContractTest). */
class HillClimbLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new HillClimbLearner();
    }
}
