package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;

/**
 * The true partial ancestral graph (PAG): the graph that represents the Markov equivalence
 * class of a MAG, with a tail or arrow where every MAG of the class has that mark and a
 * circle elsewhere (Zhang 2008, "On the completeness of orientation rules for causal
 * discovery in the presence of latent confounders and selection bias", Artificial
 * Intelligence 172).
 *
 * <p>Built as FCI would build it from a perfect m-separation oracle: the MAG's skeleton with
 * circles at every end; arrowheads at the unshielded colliders of the MAG (R0); then
 * {@link PagRules} to closure, with the collider decisions of R4 read from the MAG's marks
 * (for a discriminating path this is what every separating set says; see {@link
 * SeparationInfo}). With nothing hidden the MAG is the DAG, and the PAG has the CPDAG's
 * skeleton with PAG marks.
 *
 * <p>Cost: the latent projection ({@link LatentProjection}) and then the rules ({@link
 * PagRules}); for a given MAG, {@link #ofMag} also checks it ({@link AncestralGraphs}).
 */
public final class Pags {

    private Pags() {
    }

    /** The PAG over the observed variables of a DAG whose hidden variables are flagged. */
    public static Graph of(Graph dagWithHidden) {
        return fromMag(LatentProjection.mag(dagWithHidden));
    }

    /**
     * The PAG of a maximal ancestral graph. A MAG with undirected edges (selection bias) is
     * handled with the complete rules R1–R10, one without with R1–R4 and R8–R10.
     *
     * @throws IllegalArgumentException if {@code mag} is not a MAG, naming why
     */
    public static Graph ofMag(Graph mag) {
        AncestralGraphs.checkMag(mag);
        return fromMag(mag);
    }

    private static Graph fromMag(Graph mag) {
        MutableGraph pag = Graph.builder(mag.names());
        boolean undirected = false;
        for (Edge e : mag.edges()) {
            pag.addEdge(e.a(), e.b(), Mark.CIRCLE, Mark.CIRCLE);
            undirected |= e.isUndirected();
        }
        PagRules rules = undirected ? PagRules.complete() : PagRules.withoutSelectionBias();
        rules.orient(pag, SeparationInfo.fromMag(mag));
        return pag.freeze();
    }
}
