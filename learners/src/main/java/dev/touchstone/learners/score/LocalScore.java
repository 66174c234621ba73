package dev.touchstone.learners.score;

import java.util.List;

/**
 * A decomposable score of a DAG over fixed variables: the score of a DAG is the sum over
 * its nodes of {@link #localScore(int, int[])} of the node given its parents. Higher is
 * better. Implementations are immutable and thread-safe.
 *
 * <p>The score-based searches rely on decomposability (Chickering 2002, §2): moves change
 * one or two local terms, so a move is rated by the difference of the terms it changes.
 */
public interface LocalScore {

    /** The variables, in index order. */
    List<String> names();

    /** The number of variables. */
    default int variableCount() {
        return names().size();
    }

    /**
     * The local score of {@code node} given the parent set {@code parents}.
     *
     * @param node    a variable index
     * @param parents distinct variable indices, not containing {@code node}, in any order
     *                (the array is not modified and not kept)
     * @return the score term; higher is better; never NaN
     */
    double localScore(int node, int[] parents);

    /**
     * Whether a memo ({@link ScoreCache}) pays off for parent sets of this size: false when
     * evaluating is about as cheap as a hash lookup. Default true.
     */
    default boolean worthCaching(int parentCount) {
        return true;
    }

    /** A short description for messages and estimates, e.g. {@code bic(penalty=1.0)}. */
    String describe();
}
