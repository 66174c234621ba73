package dev.touchstone.spark;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeadlineExceededException;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.baseline.EmptyGraphLearner;

import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Test learner: the empty graph, except that when armed its first call throws an error no
 * run catches (an {@link AssertionError}), so the whole Spark task dies and must be retried.
 * Its parameter {@code outcome} makes a run fail ({@code fail}: a learner exception) or pass
 * its deadline ({@code timeout}: what {@code RunContext.checkDeadline} throws), so that such
 * runs can be compared between engines without waiting for a real time limit.
 */
public final class CrashOnceLearner implements Learner {

    /** Set to make the next call in this JVM kill its task. */
    static final AtomicBoolean ARMED = new AtomicBoolean();

    private static final LearnerDescription DESCRIPTION = LearnerDescription.builder("crash-once-test")
            .summary("test only: the empty graph, killing its task once when armed")
            .publication("none (test)")
            .family(LearnerFamily.BASELINE)
            .accepts(DataKind.CONTINUOUS, DataKind.DISCRETE, DataKind.MIXED)
            .returns(GraphClass.CPDAG)
            .oracle(OracleUse.INDEPENDENCE)
            .parameter(ParameterSpec.choice("outcome", "ok", List.of("ok", "fail", "timeout"), "what the run does"))
            .build();

    private final Learner empty = new EmptyGraphLearner();

    @Override
    public LearnerDescription description() {
        return DESCRIPTION;
    }

    @Override
    public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
        if (ARMED.getAndSet(false)) {
            throw new AssertionError("test: this task dies once");
        }
        switch (parameters.getString("outcome")) {
            case "fail":
                throw new LearnerException("test: this run fails");
            case "timeout":
                throw new DeadlineExceededException("test: past the deadline");
            default:
                break;
        }
        return Estimate.of(empty.learn(input, knowledge, parameters, context).graph(), GraphClass.CPDAG);
    }
}
