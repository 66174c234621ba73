package dev.touchstone.learners.functional;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

class CamLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new CamLearner();
    }
}
