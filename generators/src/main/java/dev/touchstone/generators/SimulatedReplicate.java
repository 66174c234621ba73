package dev.touchstone.generators;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.audit.SortabilityAudit;
import dev.touchstone.generators.missing.MissingnessDriver;

import java.util.List;

/**
 * One simulated replicate at one sample size: its truth and the observed data set every
 * learner sees. The sortability audit is computed on first request. Thread-safe.
 */
public final class SimulatedReplicate {

    private final SimulatedTruth truth;
    private final DataSet data;
    private volatile SortabilityAudit audit;

    SimulatedReplicate(SimulatedTruth truth, DataSet data) {
        this.truth = truth;
        this.data = data;
    }

    public SimulatedTruth truth() {
        return truth;
    }

    /** The generating DAG, hidden variables flagged. */
    public Graph dag() {
        return truth.dag();
    }

    /** The observed data. */
    public DataSet data() {
        return data;
    }

    public int rows() {
        return data.rows();
    }

    public List<MissingnessDriver> missingnessDrivers() {
        return truth.missingnessDrivers();
    }

    /** Varsortability and R²-sortability of these data against the truth. */
    public SortabilityAudit audit() {
        SortabilityAudit a = audit;
        if (a == null) {
            a = SortabilityAudit.of(truth.dag(), data);
            audit = a;
        }
        return a;
    }
}
