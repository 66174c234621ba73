package dev.touchstone.learners.composed;

import dev.touchstone.core.learner.Learner;

import java.util.Objects;

/**
 * One step of a {@link ComposedLearner}: the learner it runs and how it receives the estimate
 * of the step before (null for the first step, which receives nothing).
 */
public record ComposedStep(Learner learner, Handoff given) {

    public ComposedStep {
        Objects.requireNonNull(learner, "learner");
    }

    /** The first step, which receives nothing. */
    public static ComposedStep first(Learner learner) {
        return new ComposedStep(learner, null);
    }
}
