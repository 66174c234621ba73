package dev.touchstone.metrics.truth;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.GraphChecks;
import dev.touchstone.core.graph.algorithms.LatentProjection;
import dev.touchstone.core.graph.algorithms.Pags;

import java.util.Objects;

/**
 * Chooses the truth an estimate is scored against, from the generating DAG and its hidden
 * flags: by default the graph of the estimate's own class, so that a CPDAG learner is
 * never charged for orientations no learner could know, and a PAG learner is scored against
 * the PAG.
 *
 * <table>
 *   <caption>default truth by estimate class</caption>
 *   <tr><th>estimate</th><th>nothing hidden</th><th>some variables hidden</th></tr>
 *   <tr><td>DAG</td><td>the DAG</td><td>the MAG over the observed variables</td></tr>
 *   <tr><td>CPDAG</td><td>the CPDAG</td><td>the PAG</td></tr>
 *   <tr><td>MAG</td><td>the MAG (= the DAG)</td><td>the MAG</td></tr>
 *   <tr><td>PAG</td><td>the PAG</td><td>the PAG</td></tr>
 * </table>
 *
 * <p>The CPDAG is built by core's {@link Cpdags#of} (Meek 1995, cross-checked there against
 * Chickering 1995). Cost: O(p + E) for a DAG; the other truths cost what core's constructions cost.
 *
 * <p>The MAG is core's {@link LatentProjection#mag} (Richardson and Spirtes 2002) and the PAG
 * core's {@link Pags#of} (Zhang 2008), both over the observed variables; the SID, defined
 * against a DAG, is available only when nothing is hidden.
 */
public final class TruthSelection {

    private TruthSelection() {
    }

    /** The class of truth an estimate of {@code estimateClass} is scored against by default. */
    public static GraphClass defaultClass(GraphClass estimateClass, boolean somethingHidden) {
        switch (estimateClass) {
            case DAG: return somethingHidden ? GraphClass.MAG : GraphClass.DAG;
            case CPDAG: return somethingHidden ? GraphClass.PAG : GraphClass.CPDAG;
            case MAG: return GraphClass.MAG;
            default: return GraphClass.PAG;
        }
    }

    /** The default truth for an estimate of {@code estimateClass}: the truth of its own class. */
    public static Truth forEstimate(Graph generatingDag, GraphClass estimateClass) {
        Objects.requireNonNull(estimateClass, "estimateClass");
        return as(generatingDag, defaultClass(estimateClass, generatingDag.hasHidden()));
    }

    /**
     * The truth of an explicitly requested class (a study's {@code score_against}, the command
     * line's {@code --as}).
     *
     * @throws IllegalArgumentException when the graph is not a DAG, or a DAG or CPDAG truth is
     *                                  asked for while variables are hidden (estimates are over the
     *                                  observed variables only, those truths are not)
     */
    public static Truth as(Graph generatingDag, GraphClass requested) {
        Objects.requireNonNull(generatingDag, "generatingDag");
        Objects.requireNonNull(requested, "requested");
        GraphChecks.checkDag(generatingDag);
        boolean hidden = generatingDag.hasHidden();
        if (hidden && (requested == GraphClass.DAG || requested == GraphClass.CPDAG)) {
            throw new IllegalArgumentException("cannot score against the true " + requested.word()
                    + ": variables " + String.join(", ", generatingDag.hiddenNames())
                    + " are hidden, so the truth over the observed variables is a MAG or PAG");
        }
        switch (requested) {
            case DAG:
                return new Truth(generatingDag, GraphClass.DAG, generatingDag);
            case CPDAG:
                return new Truth(Cpdags.of(generatingDag), GraphClass.CPDAG, generatingDag);
            case MAG:
                // with nothing hidden the latent projection is the DAG itself, and SID stays defined
                return new Truth(LatentProjection.mag(generatingDag), GraphClass.MAG, hidden ? null : generatingDag);
            default:
                return new Truth(Pags.of(generatingDag), GraphClass.PAG, hidden ? null : generatingDag);
        }
    }
}
