package dev.touchstone.core.learner;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterValues;

import java.util.Objects;

/**
 * The base of a learner that is its declaration plus its algorithm: it is built from its
 * {@link LearnerDescription}, and {@link #learn} makes the checks every run starts with, in
 * one place, before handing a {@link LearnerRun} to {@link #run}:
 * <ol>
 *   <li>the input is of a kind the description accepts (data kind, missing cells, oracle,
 *   start graph; {@link LearnerDescription#checkAccepts});</li>
 *   <li>the knowledge names only the input's variables;</li>
 *   <li>the run's time limit has not passed already.</li>
 * </ol>
 * Each failure is a {@link LearnerException} (a {@link DeadlineExceededException} for the
 * limit) with a message naming the learner or the variable. Parameters arrive checked
 * against the declarations (the caller resolves them) and are read typed with
 * {@link LearnerRun#get}. Subclasses are stateless and thread-safe, as {@link Learner} asks.
 * The method follows no single publication: it is the contract of {@link Learner} (common practice).
 */
public abstract class DeclaredLearner implements Learner {

    private final LearnerDescription description;

    protected DeclaredLearner(LearnerDescription description) {
        this.description = Objects.requireNonNull(description, "description");
    }

    @Override
    public final LearnerDescription description() {
        return description;
    }

    @Override
    public final Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters,
                                RunContext context) {
        description.checkAccepts(input);
        try {
            knowledge.checkVariables(input.variableNames());
        } catch (IllegalArgumentException e) {
            throw new LearnerException(e.getMessage(), e);
        }
        context.checkDeadline();
        return run(new LearnerRun(input, knowledge, parameters, context));
    }

    /**
     * The run's data set, which this learner needs to have at least {@code minRows} rows.
     *
     * @throws LearnerException {@code learner ID needs at least N rows, got M}
     * @throws IllegalStateException for an oracle input
     */
    protected final DataSet data(LearnerRun run, int minRows) {
        DataSet data = run.input().data();
        if (data.rows() < minRows) {
            throw new LearnerException("learner " + description.id() + " needs at least " + minRows + " rows, got "
                    + data.rows());
        }
        return data;
    }

    /**
     * The algorithm, given an input this learner accepts.
     *
     * @return the estimate, of the declared class, over the input's variables
     */
    protected abstract Estimate run(LearnerRun run);
}
