package dev.touchstone.learners.composed;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;
import dev.touchstone.learners.constraint.PcLearner;
import dev.touchstone.learners.score.HillClimbLearner;

import java.util.List;

/** A composed learner (PC's skeleton, then hill climbing within it) passes the learner contract (core's LearnerContractTest). */
class ComposedLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return ComposedLearner.of(List.of(ComposedStep.first(new PcLearner()),
                new ComposedStep(new HillClimbLearner(), Handoff.ALLOWED_EDGES)));
    }
}
