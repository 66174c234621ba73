package dev.touchstone.learners.constraint;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.independence.IndependenceTests;
import dev.touchstone.learners.independence.MissingPolicy;

import java.util.List;

/** The parameter declarations PC and FCI share, and the steps that read them, in one place. */
final class ConstraintParameters {

    static final ParameterSpec MAX_DEPTH = ParameterSpec.integer("max_depth", -1, -1, 1000,
            "largest conditioning set the adjacency search tries; -1 for no limit");
    static final ParameterSpec SKELETON = ParameterSpec.choice("skeleton", SkeletonVariant.ORDER_INDEPENDENT.word(),
            SkeletonVariant.words(), "adjacency search: order-independent (levels frozen, parallel; Colombo and "
                    + "Maathuis 2014) or original (edges removed at once; Spirtes, Glymour and Scheines 2000)");

    private ConstraintParameters() {
    }

    /** The shared declarations: test, alpha, missing, max_depth, skeleton. */
    static List<ParameterSpec> shared() {
        return List.of(IndependenceTests.TEST, IndependenceTests.ALPHA, IndependenceTests.MISSING, MAX_DEPTH, SKELETON);
    }

    static IndependenceTest test(LearnerInput input, ParameterValues values) {
        return IndependenceTests.forInput(input, values.getString(IndependenceTests.TEST.name()),
                values.getDouble(IndependenceTests.ALPHA.name()),
                MissingPolicy.parse(values.getString(IndependenceTests.MISSING.name())));
    }

    static KnowledgeIndex knowledge(Knowledge knowledge, List<String> names) {
        try {
            return new KnowledgeIndex(knowledge, names);
        } catch (IllegalArgumentException e) {
            throw new LearnerException(e.getMessage(), e);
        }
    }
}
