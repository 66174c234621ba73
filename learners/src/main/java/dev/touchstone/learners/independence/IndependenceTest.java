package dev.touchstone.learners.independence;

/**
 * A conditional independence test at a fixed significance level, over variables addressed by
 * position (the columns of a data set, or the observed variables of an oracle).
 *
 * <p>Implementations are thread-safe: the order-independent PC runs the tests of one level
 * in parallel. The arrays passed in are read, never kept or modified, so callers can reuse
 * them; {@code z} must not contain {@code x} or {@code y}. Counting calls is the caller's
 * job (the learners count through {@code RunContext.countTests}), so a test stays a pure
 * function of its arguments.
 *
 * <p>Implementations are symmetric to the bit: {@code (x, y, z)} and {@code (y, x, z)} give
 * the same p-value and decision. The adjacency search tests each pair once at level 0 and
 * relies on this; tests whose arithmetic is not symmetric by construction (sums taken in
 * another order) put the pair in a canonical order first.
 */
public interface IndependenceTest {

    /** The number of variables this test addresses (positions 0 … variables − 1). */
    int variables();

    /** The significance level α at which {@link #independent} decides. */
    double alpha();

    /** The p-value of the hypothesis that {@code x} and {@code y} are independent given {@code z}. */
    double pValue(int x, int y, int[] z);

    /**
     * Whether the test accepts independence of {@code x} and {@code y} given {@code z} at
     * level {@link #alpha()}, i.e. whether the p-value exceeds α. Implementations may decide
     * without computing the p-value when the statistic alone settles it.
     */
    default boolean independent(int x, int y, int[] z) {
        return pValue(x, y, z) > alpha();
    }

    /** A short name for listings and messages, e.g. {@code fisher-z}. */
    String name();
}
