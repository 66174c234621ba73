package dev.touchstone.core.learner;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What a learner learns from: a data set, or the oracle when the sample size is infinite;
 * optionally with a graph to start its search from, which only learners declaring
 * {@link LearnerDescription#takesStartGraph()} accept.
 */
public final class LearnerInput {

    private final DataSet data;
    private final Oracle oracle;
    private final Graph start;

    private LearnerInput(DataSet data, Oracle oracle, Graph start) {
        this.data = data;
        this.oracle = oracle;
        this.start = start;
    }

    public static LearnerInput of(DataSet data) {
        return new LearnerInput(Objects.requireNonNull(data, "data"), null, null);
    }

    public static LearnerInput of(Oracle oracle) {
        return new LearnerInput(null, Objects.requireNonNull(oracle, "oracle"), null);
    }

    /**
     * The same data or oracle with a graph to start the search from.
     *
     * @throws IllegalArgumentException if the graph is not over {@link #variableNames()}, in that order
     */
    public LearnerInput withStart(Graph startGraph) {
        Objects.requireNonNull(startGraph, "startGraph");
        if (!startGraph.names().equals(variableNames())) {
            throw new IllegalArgumentException("a start graph must be over the input's variables " + variableNames()
                    + ", got " + startGraph.names());
        }
        return new LearnerInput(data, oracle, startGraph);
    }

    /** The graph to start the search from, when one was given. */
    public Optional<Graph> startGraph() {
        return Optional.ofNullable(start);
    }

    public boolean isOracle() {
        return oracle != null;
    }

    /**
     * The data set.
     *
     * @throws IllegalStateException for an oracle input
     */
    public DataSet data() {
        if (data == null) {
            throw new IllegalStateException("this input is the oracle, not a data set");
        }
        return data;
    }

    /**
     * The oracle.
     *
     * @throws IllegalStateException for a data input
     */
    public Oracle oracle() {
        if (oracle == null) {
            throw new IllegalStateException("this input is a data set, not the oracle");
        }
        return oracle;
    }

    /** The variables the estimate must be over, in order. */
    public List<String> variableNames() {
        return data != null ? data.names() : oracle.variableNames();
    }
}
