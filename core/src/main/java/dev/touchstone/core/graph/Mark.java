package dev.touchstone.core.graph;

import dev.touchstone.core.param.Worded;

/**
 * The mark an edge carries at one of its two ends.
 *
 * <p>A directed edge A → B is (tail at A, arrow at B); an undirected edge A — B is
 * (tail, tail); a bidirected edge A ↔ B is (arrow, arrow); a circle records that the
 * equivalence class contains graphs with either mark there (Zhang 2008, "On the
 * completeness of orientation rules for causal discovery in the presence of latent
 * confounders and selection bias", Artificial Intelligence 172).
 */
public enum Mark implements Worded {
    /** No arrowhead: the variable at this end is an ancestor (or, undirected, tied) of the other. */
    TAIL,
    /** An arrowhead: the variable at this end is not an ancestor of the other. */
    ARROW,
    /** Undetermined: tail in some members of the equivalence class, arrow in others. */
    CIRCLE;

    /**
     * Parses a mark word as written in graph files.
     *
     * @throws IllegalArgumentException naming the word and the allowed words
     */
    public static Mark parse(String word) {
        return Worded.parse(Mark.class, word, "mark");
    }
}
