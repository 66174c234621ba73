package dev.touchstone.harness.outside;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.harness.testing.TestWorld;

/** A learner listed only in a jar built by {@link PluginLoaderTest}, to be found as a plug-in. */
public final class PluginTestLearner implements Learner {

    private static final LearnerDescription D = LearnerDescription.builder("plugged-in-test").summary("a plug-in")
            .publication("test only").family(dev.touchstone.core.learner.LearnerFamily.BASELINE)
            .accepts(dev.touchstone.core.data.DataKind.CONTINUOUS).returns(dev.touchstone.core.graph.GraphClass.DAG)
            .build();

    @Override
    public LearnerDescription description() {
        return D;
    }

    @Override
    public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
        return TestWorld.EMPTY.learn(input, knowledge, parameters, context);
    }
}
