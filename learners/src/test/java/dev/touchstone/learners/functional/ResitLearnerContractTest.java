package dev.touchstone.learners.functional;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

class ResitLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new ResitLearner();
    }
}
