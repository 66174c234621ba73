package dev.touchstone.learners.constraint;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.learners.independence.IndependenceTests;

import java.util.List;

/**
 * The parameter declarations and description PC and FCI share, and the steps that read them, in
 * one place; public for the hybrid learners, whose constraint half declares the same parameters.
 */
public final class ConstraintParameters {

    /** The largest conditioning set tried. */
    public static final Parameter<Integer> MAX_DEPTH = Parameter.integer("max_depth", -1, -1, 1000,
            "largest conditioning set the adjacency search tries; -1 for no limit");
    static final Parameter<SkeletonVariant> SKELETON = Parameter.choice("skeleton", SkeletonVariant.ORDER_INDEPENDENT,
            "adjacency search: order-independent (levels frozen, parallel; Colombo and "
                    + "Maathuis 2014) or sequential (pairs in variable order, an edge removed at once; Spirtes, Glymour and Scheines 2000)");

    private ConstraintParameters() {
    }

    /** The shared declarations: test, alpha, missing, max_depth, skeleton, degrees_of_freedom, then the kernel tests' settings. */
    static List<ParameterSpec> shared() {
        List<ParameterSpec> specs = new java.util.ArrayList<>(List.of(IndependenceTests.TEST, IndependenceTests.ALPHA,
                IndependenceTests.MISSING, MAX_DEPTH, SKELETON, IndependenceTests.DEGREES_OF_FREEDOM).stream()
                .map(Parameter::spec).toList());
        specs.addAll(IndependenceTests.kernelParameters());
        return List.copyOf(specs);
    }

    /**
     * The independence test's declarations alone (test, alpha, missing, degrees_of_freedom, the
     * kernel tests' settings), for learners that test without PC's adjacency search.
     */
    public static List<ParameterSpec> testParameters() {
        List<ParameterSpec> specs = new java.util.ArrayList<>(List.of(IndependenceTests.TEST, IndependenceTests.ALPHA,
                IndependenceTests.MISSING, IndependenceTests.DEGREES_OF_FREEDOM).stream().map(Parameter::spec).toList());
        specs.addAll(IndependenceTests.kernelParameters());
        return List.copyOf(specs);
    }

    /**
     * A description with what PC and FCI declare alike: the constraint family, every data kind,
     * configurable missing values, all three kinds of knowledge, the independence oracle.
     */
    static LearnerDescription.Builder describe(String id, GraphClass returns) {
        return LearnerDescription.builder(id)
                .family(LearnerFamily.CONSTRAINT)
                .accepts(DataKind.CONTINUOUS, DataKind.DISCRETE, DataKind.MIXED)
                .returns(returns)
                .missingValues(MissingValues.CONFIGURABLE)
                .knowledge(KnowledgeUse.REQUIRED_EDGES, KnowledgeUse.FORBIDDEN_EDGES, KnowledgeUse.TIERS)
                .oracle(OracleUse.INDEPENDENCE);
    }

    /** Adds the shared parameters, then the learner's {@code own}, and builds. */
    static LearnerDescription build(LearnerDescription.Builder b, Parameter<?>... own) {
        for (ParameterSpec s : shared()) {
            b.parameter(s);
        }
        for (Parameter<?> s : own) {
            b.parameter(s);
        }
        return b.build();
    }
}
