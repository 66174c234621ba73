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
     * The local scores of {@code node} given {@code parents} plus one more parent x, for every
     * x with {@code candidates[x]}, written to {@code out[x]} (other entries untouched): the
     * batch a search makes when it weighs every single addition to one parent set (the
     * grow-shrink trees of {@link GrowShrinkTree}). Scores may share the work on
     * {@code parents} across the batch; the default calls {@link #localScore} once per x.
     *
     * @param candidates indexed by variable; must be false for {@code node} and members of {@code parents}
     */
    default void scoreAdditions(int node, int[] parents, boolean[] candidates, double[] out) {
        int[] with = java.util.Arrays.copyOf(parents, parents.length + 1);
        for (int x = 0; x < candidates.length; x++) {
            if (candidates[x]) {
                with[parents.length] = x;
                out[x] = localScore(node, with);
            }
        }
    }

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
