package dev.touchstone.learners.baseline;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

class VarianceSortLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new VarianceSortLearner();
    }
}
