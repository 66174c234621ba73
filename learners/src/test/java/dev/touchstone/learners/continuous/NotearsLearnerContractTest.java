package dev.touchstone.learners.continuous;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

class NotearsLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new NotearsLearner();
    }
}
