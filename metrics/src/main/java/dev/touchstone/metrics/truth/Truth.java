package dev.touchstone.metrics.truth;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;

import java.util.Objects;

/**
 * The truth one estimate is scored against.
 *
 * @param reference      the graph compared edge by edge with the estimate, over the observed
 *                       variables (the true DAG, CPDAG, MAG or PAG)
 * @param referenceClass which of those it is
 * @param dag            the generating DAG when nothing is hidden (needed by the structural
 *                       intervention distance, which is defined against a DAG); null otherwise
 */
public record Truth(Graph reference, GraphClass referenceClass, Graph dag) {

    public Truth {
        Objects.requireNonNull(reference, "reference");
        Objects.requireNonNull(referenceClass, "referenceClass");
        if (dag != null && !dag.names().equals(reference.names())) {
            throw new IllegalArgumentException("the true DAG and the reference graph must be over the same variables in the same order");
        }
        if (dag != null && dag.hasHidden()) {
            throw new IllegalArgumentException("the true DAG given for SID must have no hidden variables");
        }
    }

    /** A truth given directly as a graph of a known class, with no DAG behind it (SID is then undefined). */
    public static Truth of(Graph reference, GraphClass referenceClass) {
        return new Truth(reference, referenceClass, referenceClass == GraphClass.DAG && !reference.hasHidden()
                ? reference : null);
    }
}
