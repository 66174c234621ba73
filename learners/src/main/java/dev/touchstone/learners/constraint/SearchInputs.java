package dev.touchstone.learners.constraint;

import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.independence.IndependenceTests;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.List;

/**
 * What a PC or FCI run reads before searching: the variable names, the knowledge by position,
 * the independence test, {@code max_depth} and the skeleton variant. Immutable.
 */
record SearchInputs(List<String> names, KnowledgeIndex knowledge, IndependenceTest test, int maxDepth,
                    SkeletonVariant variant) {

    /** Reads the shared parameters of a run whose input the learner accepts. */
    static SearchInputs read(LearnerRun run) {
        return of(run, IndependenceTests.forInput(run.input(), run.parameters(),
                Seeds.derive(run.context().seed(), "independence-test")));
    }

    /** The same with a test of the learner's own. */
    static SearchInputs of(LearnerRun run, IndependenceTest test) {
        List<String> names = run.names();
        return new SearchInputs(names, KnowledgeIndex.of(run.knowledge(), names), test,
                run.get(ConstraintParameters.MAX_DEPTH), run.get(ConstraintParameters.SKELETON));
    }
}
