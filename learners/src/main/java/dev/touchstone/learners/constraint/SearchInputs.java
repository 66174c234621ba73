package dev.touchstone.learners.constraint;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.independence.IndependenceTest;

import java.util.List;

/**
 * What a PC or FCI run reads before searching: the variable names, the knowledge by position,
 * the independence test, {@code max_depth} and the skeleton variant. Immutable.
 */
record SearchInputs(List<String> names, KnowledgeIndex knowledge, IndependenceTest test, int maxDepth,
                    SkeletonVariant variant) {

    /** Checks the input against the learner's description, then reads the shared parameters. */
    static SearchInputs read(LearnerDescription description, LearnerInput input, Knowledge knowledge,
                             ParameterValues parameters, RunContext context) {
        description.checkAccepts(input);
        List<String> names = input.variableNames();
        KnowledgeIndex ki = ConstraintParameters.knowledge(knowledge, names);
        context.checkDeadline();
        return new SearchInputs(names, ki, ConstraintParameters.test(input, parameters,
                        dev.touchstone.core.random.Seeds.derive(context.seed(), "independence-test")),
                parameters.getInt(ConstraintParameters.MAX_DEPTH.name()),
                SkeletonVariant.parse(parameters.getString(ConstraintParameters.SKELETON.name())));
    }
}
