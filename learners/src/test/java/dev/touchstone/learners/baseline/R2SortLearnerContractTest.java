package dev.touchstone.learners.baseline;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

class R2SortLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new R2SortLearner();
    }
}
