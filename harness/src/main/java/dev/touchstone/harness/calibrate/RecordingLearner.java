package dev.touchstone.harness.calibrate;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;

import java.util.Map;

/**
 * A learner that behaves exactly like the one it wraps and keeps every estimate under its
 * run's seed (which the runner derives from the run's coordinates, so it identifies the
 * run). The calibration needs the estimated graphs themselves, for per-edge rates, where a
 * study keeps only metric values. Thread-safe when {@code sink} is.
 */
final class RecordingLearner implements Learner {

    private final Learner delegate;
    private final Map<Long, Graph> sink;

    RecordingLearner(Learner delegate, Map<Long, Graph> sink) {
        this.delegate = delegate;
        this.sink = sink;
    }

    @Override
    public LearnerDescription description() {
        return delegate.description();
    }

    @Override
    public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
        Estimate e = delegate.learn(input, knowledge, parameters, context);
        if (e != null) {
            sink.put(context.seed(), e.graph());
        }
        return e;
    }
}
