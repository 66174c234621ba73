package dev.touchstone.learners.score;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** The exact learner passes the learner contract (core's LearnerContractTest). */
class ExactScoreLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new ExactScoreLearner();
    }
}
