package dev.touchstone.core.learner;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterValues;

/**
 * The one interface every structure-learning method goes through: built-in learners,
 * Java plug-ins found by the service loader, and adapters around external commands.
 *
 * <p>A learner describes itself ({@link #description()}) and turns data (or an oracle)
 * into an estimate of its declared graph class over the input's variables. It must be
 * stateless between calls and safe to call from several threads at once; all randomness
 * comes from {@link RunContext#seed()}, so the same input, knowledge, parameters and seed
 * give the same estimate. Long searches call {@link RunContext#checkDeadline()} often
 * enough that a run stops within a fraction of a second of its limit.
 */
public interface Learner {

    /** What this learner is, accepts, returns and takes as parameters. */
    LearnerDescription description();

    /**
     * Learns a graph.
     *
     * @param input      the data set, or the oracle when the sample size is infinite
     * @param knowledge  background knowledge (never null; {@link Knowledge#none()} when there is none)
     * @param parameters values checked against {@link LearnerDescription#parameters()}
     * @param context    seed, deadline and counters of this run
     * @return the estimate, of {@link LearnerDescription#returns()} class, over {@link LearnerInput#variableNames()}
     * @throws LearnerException when the input is not accepted or the search cannot proceed
     * @throws DeadlineExceededException when the run's time limit passes
     */
    Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context);
}
