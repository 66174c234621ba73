package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

/**
 * What the PAG orientation rules need to know beyond the current marks: whether the middle
 * vertex of a triple is a collider, asked for unshielded triples (rule R0) and for the last
 * triple of a discriminating path (rule R4) (Zhang 2008, "On the completeness of
 * orientation rules for causal discovery in the presence of latent confounders and
 * selection bias", Artificial Intelligence 172, §3).
 *
 * <p>A learner answers from the separating sets it recorded ({@link
 * #fromSeparatingSets(SeparatingSets)}); the true PAG is built from the MAG itself ({@link
 * #fromMag(Graph)}). With a perfect independence oracle the two answer alike: for an
 * unshielded triple, and for a discriminating path, the middle vertex is a collider in the
 * MAG iff it is in no separating set of the two ends (Spirtes, Glymour and Scheines 2000,
 * ch. 6; Zhang 2008, the soundness arguments for R0 and R4).
 *
 * <p>Indices are those of the graph the rules work on.
 */
public interface SeparationInfo {

    /**
     * For an unshielded triple {@code a *-* b *-* c} ({@code a}, {@code c} not adjacent):
     * whether {@code b} is a collider.
     */
    boolean unshieldedCollider(int a, int b, int c);

    /**
     * For a discriminating path {@code <theta, ..., a, b, c>} for {@code b} ({@code theta}
     * not adjacent to {@code c}): whether {@code b} is a collider on {@code <a, b, c>}.
     */
    boolean discriminatedCollider(int theta, int a, int b, int c);

    /**
     * The same question given the whole discriminating path, {@code path[0]} = theta, then the
     * colliders, and the last three {@code a, b, c}. The rules ask this form; learners that test
     * along the path (RFCI's extra tests, Colombo et al. 2012) override it, the others answer
     * from the ends through {@link #discriminatedCollider(int, int, int, int)}.
     */
    default boolean discriminatedCollider(int[] path) {
        int k = path.length;
        return discriminatedCollider(path[0], path[k - 3], path[k - 2], path[k - 1]);
    }

    /** Membership in the separating sets a learner recorded. */
    @FunctionalInterface
    interface SeparatingSets {
        /**
         * Whether {@code v} is in the set recorded as separating {@code x} and {@code y}; called
         * only for non-adjacent pairs, with {@code x} and {@code y} in either order.
         */
        boolean contains(int x, int y, int v);
    }

    /**
     * The answers of FCI-style learners: the middle vertex is a collider iff it is not in the
     * recorded separating set of the two ends ({@code a, c} for R0; {@code theta, c} for R4).
     */
    static SeparationInfo fromSeparatingSets(SeparatingSets sets) {
        return new SeparationInfo() {
            @Override
            public boolean unshieldedCollider(int a, int b, int c) {
                return !sets.contains(a, c, b);
            }

            @Override
            public boolean discriminatedCollider(int theta, int a, int b, int c) {
                return !sets.contains(theta, c, b);
            }
        };
    }

    /**
     * The answers read off a MAG over the same variables: the middle vertex is a collider iff
     * both its marks on the triple are arrows.
     */
    static SeparationInfo fromMag(Graph mag) {
        return new SeparationInfo() {
            @Override
            public boolean unshieldedCollider(int a, int b, int c) {
                return mag.markAt(b, a) == Mark.ARROW && mag.markAt(b, c) == Mark.ARROW;
            }

            @Override
            public boolean discriminatedCollider(int theta, int a, int b, int c) {
                return unshieldedCollider(a, b, c);
            }
        };
    }
}
