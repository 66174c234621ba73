package dev.touchstone.core.learner;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.ParameterValues;

import java.util.List;
import java.util.Objects;

/**
 * One call of a {@link DeclaredLearner} after its common checks passed: the input the
 * description accepts, knowledge over the input's variables, the checked parameter values
 * and the run's context. Immutable (the context's counters aside).
 *
 * @param input      the data set or oracle, accepted by the learner's description
 * @param knowledge  background knowledge naming only the input's variables
 * @param parameters values checked against the learner's declarations
 * @param context    seed, deadline and counters of this run
 */
public record LearnerRun(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {

    public LearnerRun {
        Objects.requireNonNull(input, "input");
        Objects.requireNonNull(knowledge, "knowledge");
        Objects.requireNonNull(parameters, "parameters");
        Objects.requireNonNull(context, "context");
    }

    /** The typed value of one of the learner's declared parameters. */
    public <T> T get(Parameter<T> parameter) {
        return parameters.get(parameter);
    }

    /** The variables the estimate must be over, in order. */
    public List<String> names() {
        return input.variableNames();
    }
}
