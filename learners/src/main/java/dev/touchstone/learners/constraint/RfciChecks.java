package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.algorithms.SeparationInfo;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.ArrayDeque;
import java.util.Arrays;

/**
 * The extra tests with which RFCI replaces FCI's Possible-D-Sep step (Colombo, Maathuis,
 * Kalisch and Richardson 2012, "Learning high-dimensional directed acyclic graphs with latent
 * and selection variables", Annals of Statistics 40; algorithm numbers from memory).
 *
 * <p>Unshielded triples (their Algorithm 4.4): for a triple i *-* j *-* k with i, k not
 * adjacent and j outside the separating set S of i and k (a collider candidate), test i ⫫ j | S
 * and j ⫫ k | S. When both are dependent the triple is a collider. When one end r is
 * independent of j given S, the edge r *-* j is removed with a minimal subset of S that
 * separates them as its separating set, and the triples the removal makes unshielded (r *-* q
 * *-* j for the common neighbours q) are queued to be checked in turn. The collider decisions
 * themselves are read afterwards from the separating sets of the final skeleton, which is what
 * the list of colliders of Algorithm 4.4 holds: every unshielded triple of that skeleton was
 * queued, and was checked while both its edges were present.
 *
 * <p>Discriminating paths (their Algorithm 4.5), as the {@link SeparationInfo} the rules ask in
 * R4: for a discriminating path ⟨θ, …, a, b, c⟩ and S the separating set of θ and c, every two
 * consecutive vertices r, q of the path are tested given S \ {r, q}. If none is independent,
 * b is a collider iff it is outside S, as in FCI. If one pair is, the path was not a
 * discriminating path of the truth: the pair is recorded for removal ({@link #pendingRemoval})
 * and the rules' answer does not matter, because the caller removes the edge, checks the
 * triples it unshields and orients again from scratch.
 *
 * <p>Minimal separating sets are the smallest subsets of S that separate, found by increasing
 * size, so no proper subset separates. Cost: per checked triple two tests, plus up to 2^|S|
 * when an edge goes; per discriminating path one test per edge of the path. Not thread-safe.
 */
final class RfciChecks {

    private final IndependenceTest test;
    private final KnowledgeIndex knowledge;
    private final Skeleton skeleton;
    private final RunContext context;
    private final SubsetSearch search;
    private int tripleRemovals;
    private int pathRemovals;

    RfciChecks(IndependenceTest test, KnowledgeIndex knowledge, Skeleton skeleton, RunContext context) {
        this.test = test;
        this.knowledge = knowledge;
        this.skeleton = skeleton;
        this.context = context;
        this.search = new SubsetSearch(test);
    }

    /** Edges removed by the unshielded-triple check so far. */
    int tripleRemovals() {
        return tripleRemovals;
    }

    /** Edges removed by the discriminating-path check so far. */
    int pathRemovals() {
        return pathRemovals;
    }

    /** Tests run by the checks so far. */
    long tests() {
        return search.tests();
    }

    /** Algorithm 4.4 on every unshielded triple of the skeleton. */
    void checkAllTriples() {
        ArrayDeque<int[]> queue = new ArrayDeque<>();
        for (int j = 0; j < skeleton.size(); j++) {
            int[] nb = skeleton.neighbours(j);
            for (int x = 0; x < nb.length; x++) {
                for (int y = x + 1; y < nb.length; y++) {
                    if (!skeleton.adjacent(nb[x], nb[y])) {
                        queue.add(new int[] {nb[x], j, nb[y]});
                    }
                }
            }
        }
        drain(queue);
    }

    /**
     * Removes r *-* q with separating set {@code sepset}, found by the discriminating-path check,
     * then checks the triples the removal unshields.
     */
    void removeFromPath(int r, int q, int[] sepset) {
        pathRemovals++;
        ArrayDeque<int[]> queue = new ArrayDeque<>();
        remove(r, q, sepset, queue);
        drain(queue);
    }

    private void drain(ArrayDeque<int[]> queue) {
        while (!queue.isEmpty()) {
            context.checkDeadline();
            int[] t = queue.poll();
            int i = t[0];
            int j = t[1];
            int k = t[2];
            if (!skeleton.adjacent(i, j) || !skeleton.adjacent(j, k) || skeleton.adjacent(i, k)) {
                continue;
            }
            int[] s = skeleton.sepset(i, k);
            // No set (removed by knowledge) or j in it: a non-collider, nothing to check.
            if (s == null || skeleton.sepsetContains(i, k, j)) {
                continue;
            }
            boolean iSeparated = !knowledge.isRequiredEitherWay(i, j) && separated(i, j, s);
            boolean kSeparated = !knowledge.isRequiredEitherWay(j, k) && separated(j, k, s);
            if (iSeparated) {
                tripleRemovals++;
                remove(i, j, minimal(i, j, s), queue);
            }
            if (kSeparated) {
                tripleRemovals++;
                remove(k, j, minimal(k, j, s), queue);
            }
        }
    }

    private boolean separated(int x, int y, int[] given) {
        return search.find(x, y, given, given.length, given.length) != null;
    }

    /** The smallest subset of {@code set} separating x and y; {@code set} itself is known to. */
    private int[] minimal(int x, int y, int[] set) {
        for (int size = 0; size < set.length; size++) {
            int[] found = search.find(x, y, set, set.length, size);
            if (found != null) {
                return found;
            }
        }
        return set.clone();
    }

    private void remove(int r, int q, int[] sepset, ArrayDeque<int[]> queue) {
        int[] common = commonNeighbours(r, q);
        skeleton.remove(r, q, sepset);
        for (int v : common) {
            queue.add(new int[] {Math.min(r, q), v, Math.max(r, q)});
        }
    }

    private int[] commonNeighbours(int r, int q) {
        int[] nr = skeleton.neighbours(r);
        int[] out = new int[nr.length];
        int k = 0;
        for (int v : nr) {
            if (v != q && skeleton.adjacent(v, q)) {
                out[k++] = v;
            }
        }
        return Arrays.copyOf(out, k);
    }

    /**
     * The R4 answers with Algorithm 4.5's tests for one orientation pass; a fresh instance per
     * pass, since a removal found ends the pass.
     */
    PathCheck pathCheck() {
        return new PathCheck();
    }

    /** R4's collider question with the tests along the path; see the class comment. */
    final class PathCheck implements SeparationInfo {

        private int[] pending;

        /** The pair to remove and its separating set, {@code {r, q, s…}}, or null when every path passed. */
        int[] pendingRemoval() {
            return pending;
        }

        @Override
        public boolean unshieldedCollider(int a, int b, int c) {
            return !contains(a, c, b);
        }

        @Override
        public boolean discriminatedCollider(int theta, int a, int b, int c) {
            return !contains(theta, c, b);
        }

        @Override
        public boolean discriminatedCollider(int[] path) {
            int theta = path[0];
            int c = path[path.length - 1];
            int b = path[path.length - 2];
            int[] s = skeleton.sepset(theta, c);
            if (pending == null && s != null) {
                for (int e = 0; e + 1 < path.length && pending == null; e++) {
                    context.checkDeadline();
                    int r = path[e];
                    int q = path[e + 1];
                    if (knowledge.isRequiredEitherWay(r, q)) {
                        continue;
                    }
                    int[] given = without(s, r, q);
                    if (separated(r, q, given)) {
                        int[] y = minimal(r, q, given);
                        pending = new int[y.length + 2];
                        pending[0] = r;
                        pending[1] = q;
                        System.arraycopy(y, 0, pending, 2, y.length);
                    }
                }
            }
            return !contains(theta, c, b);
        }

        private boolean contains(int x, int y, int v) {
            return skeleton.sepset(x, y) == null || skeleton.sepsetContains(x, y, v);
        }
    }

    private static int[] without(int[] set, int r, int q) {
        int[] out = new int[set.length];
        int k = 0;
        for (int v : set) {
            if (v != r && v != q) {
                out[k++] = v;
            }
        }
        return Arrays.copyOf(out, k);
    }
}
