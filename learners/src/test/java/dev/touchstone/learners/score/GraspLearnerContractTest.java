package dev.touchstone.learners.score;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** GRaSP passes the learner contract (core's LearnerContractTest). */
class GraspLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new GraspLearner();
    }
}
