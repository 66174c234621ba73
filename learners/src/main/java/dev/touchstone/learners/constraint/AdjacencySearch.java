package dev.touchstone.learners.constraint;

import dev.touchstone.core.learner.ParallelLoop;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.independence.FisherZTest;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.Arrays;

/**
 * The adjacency (skeleton) phase shared by PC and FCI: starting from the complete graph,
 * level ℓ = 0, 1, 2, … removes an edge x − y as soon as x and y test independent given some
 * ℓ-subset of the neighbours of x (or of y), recording that set (Spirtes, Glymour and
 * Scheines 2000, §5.4.2; in the order-independent form of Colombo and Maathuis 2014).
 *
 * <p>Background knowledge: a pair with a required edge is never tested, so it is never
 * removed. A pair whose both directions are forbidden is tested like any other, so that
 * its separating set is known whenever the tests find one, and removed afterwards only if
 * the tests left it adjacent ({@link #run()} does that at the end; FCI calls
 * {@link #searchKeepingForbidden()} and {@link #removeForbidden} after its Possible-D-Sep
 * step). Removing such a pair untested would leave it without a separating set, and its
 * unshielded triples would have to be guessed non-colliders, from which Meek's R1 (or FCI's
 * R1) can orient edges wrongly; see {@code PcKnowledgeTest} for a case.
 *
 * <p>Cost: at most O(p² · C(d, ℓ)) tests at level ℓ for maximum degree d; for sparse
 * truths the number of tests grows roughly as p² at level 0 and as p · d^(ℓ+1) after.
 * Memory: the skeleton holds only the pairs level 0 keeps ({@link Skeleton}), and Fisher z
 * screens level 0 without a p × p matrix above {@link FisherZTest#DENSE_LIMIT} variables, so
 * a search needs O(n·p + edges) rather than O(p²).
 * The order-independent variant runs each level's pairs on {@link RunContext#threads()}
 * threads. The deadline is checked before every pair.
 */
final class AdjacencySearch {

    private static final int[] NO_CANDIDATES = new int[0];

    private final IndependenceTest test;
    private final KnowledgeIndex knowledge;
    private final SkeletonVariant variant;
    private final int maxDepth;
    private final RunContext context;

    /**
     * @param maxDepth the largest conditioning set size tried, or −1 for no limit
     */
    AdjacencySearch(IndependenceTest test, KnowledgeIndex knowledge, SkeletonVariant variant, int maxDepth,
                    RunContext context) {
        this.test = test;
        this.knowledge = knowledge;
        this.variant = variant;
        this.maxDepth = maxDepth < 0 ? Integer.MAX_VALUE : maxDepth;
        this.context = context;
    }

    /** The skeleton with every pair forbidden both ways removed (those the tests kept have no separating set). */
    Skeleton run() {
        Skeleton s = searchKeepingForbidden();
        removeForbidden(s, knowledge);
        return s;
    }

    /** The skeleton the tests leave, forbidden pairs included; the caller removes them with {@link #removeForbidden}. */
    Skeleton searchKeepingForbidden() {
        context.checkDeadline();
        Skeleton s = levelZero();
        if (maxDepth >= 1) {
            if (variant == SkeletonVariant.SEQUENTIAL) {
                sequential(s);
            } else {
                orderIndependent(s);
            }
        }
        return s;
    }

    /**
     * Level 0, the same for both variants (given ∅ no removal changes another pair's question):
     * every pair not required by the knowledge is tested once, and the skeleton is built from
     * the pairs that stay, so the p² complete graph is never stored. Fisher z screens all pairs
     * in tiles ({@link FisherZTest#levelZero}); other tests are asked pair by pair on
     * {@link RunContext#threads()} threads.
     */
    private Skeleton levelZero() {
        int p = test.variables();
        int[][] kept;
        long required = requiredPairCount();
        if (test instanceof FisherZTest fisher) {
            kept = fisher.levelZero(context.threads(), context::checkDeadline);
            context.countTests((long) p * (p - 1) / 2 - required);
        } else {
            kept = testPairsGivenNothing(p);
        }
        if (required > 0) {
            kept = withRequired(kept);
        }
        return new Skeleton(kept);
    }

    /** The neighbour lists of the pairs that test dependent given ∅ (required pairs untested and left out). */
    private int[][] testPairsGivenNothing(int p) {
        int[][] above = new int[p][];
        java.util.Queue<long[]> counts = new java.util.concurrent.ConcurrentLinkedQueue<>();
        try {
            ParallelLoop.run(context.threads(), p, ParallelLoop.CHUNK, () -> {
                long[] tests = new long[1];
                counts.add(tests);
                int[] buffer = new int[p];
                int[] none = NO_CANDIDATES;
                return x -> {
                    int k = 0;
                    for (int y = x + 1; y < p; y++) {
                        context.checkDeadline();
                        if (knowledge.isRequiredEitherWay(x, y)) {
                            continue;
                        }
                        tests[0]++;
                        if (!test.independent(x, y, none)) {
                            buffer[k++] = y;
                        }
                    }
                    above[x] = Arrays.copyOf(buffer, k);
                };
            });
        } finally {
            for (long[] c : counts) {
                context.countTests(c[0]);
            }
        }
        return symmetric(above);
    }

    /** Full ascending neighbour lists from the lists of larger partners. */
    private static int[][] symmetric(int[][] above) {
        int p = above.length;
        int[] degree = new int[p];
        for (int x = 0; x < p; x++) {
            degree[x] += above[x].length;
            for (int y : above[x]) {
                degree[y]++;
            }
        }
        int[][] nb = new int[p][];
        for (int v = 0; v < p; v++) {
            nb[v] = new int[degree[v]];
        }
        int[] fill = new int[p];
        // Smaller partners arrive in ascending order of x, before the larger ones: each list ends up sorted.
        for (int x = 0; x < p; x++) {
            for (int y : above[x]) {
                nb[y][fill[y]++] = x;
            }
        }
        for (int x = 0; x < p; x++) {
            System.arraycopy(above[x], 0, nb[x], fill[x], above[x].length);
        }
        return nb;
    }

    /** The number of unordered pairs the knowledge requires adjacent. */
    private long requiredPairCount() {
        java.util.Set<Long> pairs = new java.util.HashSet<>();
        int p = test.variables();
        for (int[] r : knowledge.requiredEdges()) {
            pairs.add((long) Math.min(r[0], r[1]) * p + Math.max(r[0], r[1]));
        }
        return pairs.size();
    }

    /** The lists with the required pairs added (they are never tested, so never removed). */
    private int[][] withRequired(int[][] kept) {
        int[][] out = kept.clone();
        for (int[] r : knowledge.requiredEdges()) {
            out[r[0]] = insert(out[r[0]], r[1]);
            out[r[1]] = insert(out[r[1]], r[0]);
        }
        return out;
    }

    private static int[] insert(int[] sorted, int v) {
        int i = Arrays.binarySearch(sorted, v);
        if (i >= 0) {
            return sorted;
        }
        int at = -i - 1;
        int[] out = new int[sorted.length + 1];
        System.arraycopy(sorted, 0, out, 0, at);
        out[at] = v;
        System.arraycopy(sorted, at, out, at + 1, sorted.length - at);
        return out;
    }

    private void sequential(Skeleton s) {
        int p = s.size();
        SubsetSearch search = new SubsetSearch(test);
        try {
            for (int level = 1; level <= maxDepth; level++) {
                boolean any = false;
                for (int x = 0; x < p; x++) {
                    int[] around = s.neighbours(x);
                    for (int y : around) {
                        context.checkDeadline();
                        if (!s.adjacent(x, y) || knowledge.isRequiredEitherWay(x, y)) {
                            continue;
                        }
                        int[] cand = without(s.neighbours(x), y);
                        if (cand.length < level) {
                            continue;
                        }
                        any = true;
                        int[] sep = search.find(x, y, cand, cand.length, level);
                        if (sep != null) {
                            s.remove(x, y, sep);
                        }
                    }
                }
                if (!any) {
                    break;
                }
            }
        } finally {
            context.countTests(search.tests());
        }
    }

    private void orderIndependent(Skeleton s) {
        int p = s.size();
        for (int level = 1; level <= maxDepth; level++) {
            int[][] nb = new int[p][];
            for (int v = 0; v < p; v++) {
                nb[v] = s.neighbours(v);
            }
            int pairs = 0;
            for (int x = 0; x < p; x++) {
                for (int y : nb[x]) {
                    if (x < y && !knowledge.isRequiredEitherWay(x, y)
                            && (nb[x].length - 1 >= level || nb[y].length - 1 >= level)) {
                        pairs++;
                    }
                }
            }
            if (pairs == 0) {
                break;
            }
            int[] xs = new int[pairs];
            int[] ys = new int[pairs];
            int k = 0;
            for (int x = 0; x < p; x++) {
                for (int y : nb[x]) {
                    if (x < y && !knowledge.isRequiredEitherWay(x, y)
                            && (nb[x].length - 1 >= level || nb[y].length - 1 >= level)) {
                        xs[k] = x;
                        ys[k] = y;
                        k++;
                    }
                }
            }
            int[][] found = new int[pairs][];
            final int depth = level;
            java.util.Queue<LevelWorker> workers = new java.util.concurrent.ConcurrentLinkedQueue<>();
            try {
                ParallelLoop.run(context.threads(), pairs, ParallelLoop.CHUNK, () -> {
                    LevelWorker w = new LevelWorker(nb, xs, ys, found, depth);
                    workers.add(w);
                    return w;
                });
            } finally {
                for (LevelWorker w : workers) {
                    context.countTests(w.search.tests());
                }
            }
            for (int i = 0; i < pairs; i++) {
                if (found[i] != null) {
                    s.remove(xs[i], ys[i], found[i]);
                }
            }
        }
    }

    /** Tests the pairs of one level against the frozen neighbourhoods; one per thread. */
    private final class LevelWorker implements java.util.function.IntConsumer {
        private final int[][] nb;
        private final int[] xs;
        private final int[] ys;
        private final int[][] found;
        private final int level;
        private final SubsetSearch search = new SubsetSearch(test);
        private final int[] cand;

        LevelWorker(int[][] nb, int[] xs, int[] ys, int[][] found, int level) {
            this.nb = nb;
            this.xs = xs;
            this.ys = ys;
            this.found = found;
            this.level = level;
            int max = 0;
            for (int[] n : nb) {
                max = Math.max(max, n.length);
            }
            this.cand = new int[max];
        }

        @Override
        public void accept(int i) {
            context.checkDeadline();
            int x = xs[i];
            int y = ys[i];
            int m = fill(nb[x], y);
            int[] sep = search.find(x, y, cand, m, level);
            if (sep == null) {
                m = fill(nb[y], x);
                sep = search.find(y, x, cand, m, level);
            }
            found[i] = sep;
        }

        private int fill(int[] around, int skip) {
            int m = 0;
            for (int v : around) {
                if (v != skip) {
                    cand[m++] = v;
                }
            }
            return m;
        }
    }

    /** Removes the pairs the knowledge forbids both ways that are still adjacent (they get no separating set). */
    static void removeForbidden(Skeleton s, KnowledgeIndex knowledge) {
        if (knowledge.isEmpty()) {
            return;
        }
        for (int a = 0; a < s.size(); a++) {
            for (int b : s.neighbours(a)) {
                if (a < b && knowledge.isForbiddenBothWays(a, b)) {
                    s.remove(a, b, null);
                }
            }
        }
    }

    /** {@code a} without {@code v}, in the same order. */
    static int[] without(int[] a, int v) {
        int[] out = new int[a.length];
        int k = 0;
        for (int w : a) {
            if (w != v) {
                out[k++] = w;
            }
        }
        return Arrays.copyOf(out, k);
    }
}
