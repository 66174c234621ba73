package dev.touchstone.core.learner;

import dev.touchstone.core.data.DataSet;

import java.util.List;
import java.util.Objects;

/** What a learner learns from: a data set, or the oracle when the sample size is infinite. */
public final class LearnerInput {

    private final DataSet data;
    private final Oracle oracle;

    private LearnerInput(DataSet data, Oracle oracle) {
        this.data = data;
        this.oracle = oracle;
    }

    public static LearnerInput of(DataSet data) {
        return new LearnerInput(Objects.requireNonNull(data, "data"), null);
    }

    public static LearnerInput of(Oracle oracle) {
        return new LearnerInput(null, Objects.requireNonNull(oracle, "oracle"));
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
