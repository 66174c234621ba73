package dev.touchstone.learners.example;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

/** The example learner passes the learner contract (core's LearnerContractTest), as every learner must. */
class CorrelationOrderLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new CorrelationOrderLearner();
    }
}
