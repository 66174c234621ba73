package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.ParallelLoop;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.Arrays;
import java.util.Queue;
import java.util.concurrent.ConcurrentLinkedQueue;

/**
 * FCI's second adjacency phase: an edge x *-* y left by the PC-style search is removed when
 * x and y test independent given a subset of Possible-D-Sep(x) (or of Possible-D-Sep(y)),
 * the set being recorded as their separating set (Spirtes, Glymour and Scheines 2000,
 * §6.7; Zhang 2008, AI 172, §3.1).
 *
 * <p>Possible-D-Sep(x, y) in the graph after R0 is taken as the set of v ≠ x joined to x by a
 * path on which every inner vertex b, with neighbours a and c on the path, is a collider
 * (a *→ b ←* c) or lies in a triangle (a and c adjacent), and every vertex is a possible
 * ancestor of x or y. The path condition is the Possible-D-Sep of Spirtes, Glymour and
 * Scheines (2000) as restated by Colombo, Maathuis, Kalisch and Richardson (2012, Ann. Stat.
 * 40, Definition 3.3; from memory). The ancestor condition comes from what Possible-D-Sep
 * stands in for: D-Sep(x, y), the vertices joined to x by a collider path <em>all of whose
 * vertices are ancestors of x or y</em>, separates x and y when they are not adjacent in the
 * MAG (Spirtes, Meek and Richardson 1999; from memory). Possible ancestors are read off the R0
 * graph (a path into x or y with no arrowhead at the end nearer the start); R0's arrowheads
 * are sound under a perfect oracle, so every true ancestor qualifies. The set is computed by
 * a breadth-first search over directed edges (a, b), which follows walks, a superset of the
 * path definition: a superset only adds candidate sets, and an edge is removed only when a
 * test separates. An optional bound on the walk length trades completeness for speed.
 *
 * <p>Order: every pair's set is computed from the graph after R0, and every edge is tested
 * against it and against the adjacencies at the start of the phase; removals are applied at
 * the end (as in the order-independent FCI of Colombo and Maathuis 2014). So, given the R0
 * graph, the edges removed do not depend on the order in which edges are visited, and the
 * edges' tests run on {@link RunContext#threads()} threads. The R0 graph itself comes from
 * recorded separating sets, which with finite samples can depend on the column order.
 *
 * <p>Tests saved: a conditioning set contained in adj(x) \ {y} (adjacencies at the start of
 * the phase) was already tried by the adjacency search, which tried every subset of the
 * final neighbourhoods up to {@code max_depth}, so it is skipped. Sets are tried by
 * increasing size, first from x's side then from y's, in lexicographic order of positions.
 *
 * <p>Cost: per edge, one O(|V| + |E|) search for the possible ancestors and two of O(Σ deg²)
 * for the sets; then up to
 * Σ_{ℓ ≤ d} C(|pds|, ℓ) tests for d = {@code max_depth} (unbounded: 2^|pds|), the dominant
 * term on dense or heavily confounded graphs. The deadline is checked before every edge and
 * every 64 sets.
 */
final class PossibleDsepSearch {

    private final IndependenceTest test;
    private final KnowledgeIndex knowledge;
    private final int maxDepth;
    private final int maxLength;
    private final RunContext context;

    /**
     * @param maxDepth  the largest conditioning set tried, −1 for no limit
     * @param maxLength the longest walk followed from x when building Possible-D-Sep(x), −1 for no limit
     */
    PossibleDsepSearch(IndependenceTest test, KnowledgeIndex knowledge, int maxDepth, int maxLength,
                       RunContext context) {
        this.test = test;
        this.knowledge = knowledge;
        this.maxDepth = maxDepth < 0 ? Integer.MAX_VALUE : maxDepth;
        this.maxLength = maxLength < 0 ? Integer.MAX_VALUE : maxLength;
        this.context = context;
    }

    /**
     * Tests every edge of {@code s} (whose adjacencies {@code g}, oriented by R0, mirrors)
     * and removes from {@code s} those separated by a Possible-D-Sep subset, recording the
     * set. {@code g} is not changed. Returns the number of edges removed.
     */
    int run(Skeleton s, MutableGraph g) {
        int p = s.size();
        int[][] nb = new int[p][];
        for (int v = 0; v < p; v++) {
            nb[v] = s.neighbours(v);
        }
        context.checkDeadline();
        R0Graph r0 = new R0Graph(g);
        int pairs = 0;
        for (int x = 0; x < p; x++) {
            for (int y : nb[x]) {
                if (x < y && !knowledge.isRequiredEitherWay(x, y)) {
                    pairs++;
                }
            }
        }
        int[] xs = new int[pairs];
        int[] ys = new int[pairs];
        int k = 0;
        for (int x = 0; x < p; x++) {
            for (int y : nb[x]) {
                if (x < y && !knowledge.isRequiredEitherWay(x, y)) {
                    xs[k] = x;
                    ys[k] = y;
                    k++;
                }
            }
        }
        int[][] found = new int[pairs][];
        Queue<EdgeWorker> workers = new ConcurrentLinkedQueue<>();
        try {
            ParallelLoop.run(context.threads(), pairs, ParallelLoop.CHUNK, () -> {
                EdgeWorker w = new EdgeWorker(s, new Walker(r0), xs, ys, found);
                workers.add(w);
                return w;
            });
        } finally {
            for (EdgeWorker w : workers) {
                context.countTests(w.tests);
            }
        }
        int removed = 0;
        for (int i = 0; i < pairs; i++) {
            if (found[i] != null) {
                s.remove(xs[i], ys[i], found[i]);
                removed++;
            }
        }
        return removed;
    }

    /** An immutable snapshot of the graph after R0: sorted adjacencies and where the arrowheads are. */
    private static final class R0Graph {
        final int p;
        final int[][] nbr;
        final int[] offset;
        final boolean[][] arrowAt;
        private final boolean[] adjacency;

        R0Graph(MutableGraph g) {
            this.p = g.size();
            this.nbr = new int[p][];
            this.offset = new int[p + 1];
            this.arrowAt = new boolean[p][];
            for (int v = 0; v < p; v++) {
                int[] row = g.neighbours(v);
                Arrays.sort(row);
                nbr[v] = row;
                arrowAt[v] = new boolean[row.length];
                for (int i = 0; i < row.length; i++) {
                    arrowAt[v][i] = g.markAt(v, row[i]) == Mark.ARROW;
                }
                offset[v + 1] = offset[v] + row.length;
            }
            // A p × p adjacency table only where it stays small (≤ 16 MB); binary search otherwise.
            this.adjacency = (long) p * p <= 16_000_000L ? new boolean[p * p] : null;
            if (adjacency != null) {
                for (int v = 0; v < p; v++) {
                    for (int w : nbr[v]) {
                        adjacency[v * p + w] = true;
                    }
                }
            }
        }

        boolean adjacent(int a, int b) {
            return adjacency != null ? adjacency[a * p + b] : Arrays.binarySearch(nbr[a], b) >= 0;
        }

        /** Whether the mark at {@code at} on its edge with {@code other} is an arrowhead. */
        boolean arrow(int at, int other) {
            return arrowAt[at][Arrays.binarySearch(nbr[at], other)];
        }
    }

    /** The searches over the R0 graph; one per thread, reusing its arrays between pairs. */
    private final class Walker {
        private final R0Graph r;
        private final int[] seenState;
        private final int[] seenVertex;
        private final int[] ancestor;
        private final int[] queueFrom;
        private final int[] queueSlot;
        private final int[] queueLength;
        private final int[] out;
        private int stamp;
        private int pairStamp;

        Walker(R0Graph r) {
            this.r = r;
            int states = r.offset[r.p];
            this.seenState = new int[states];
            this.seenVertex = new int[r.p];
            this.ancestor = new int[r.p];
            this.queueFrom = new int[Math.max(states, r.p)];
            this.queueSlot = new int[states];
            this.queueLength = new int[states];
            this.out = new int[r.p];
        }

        /**
         * Marks the possible ancestors of x and y: the vertices with a path into x or y on which no
         * edge has an arrowhead at the end nearer the start. R0's arrowheads are sound under a
         * perfect oracle, so every true ancestor is among them.
         */
        void possibleAncestors(int x, int y) {
            pairStamp++;
            int head = 0;
            int tail = 0;
            ancestor[x] = pairStamp;
            ancestor[y] = pairStamp;
            queueFrom[tail++] = x;
            queueFrom[tail++] = y;
            while (head < tail) {
                int w = queueFrom[head++];
                for (int u : r.nbr[w]) {
                    if (ancestor[u] != pairStamp && !r.arrow(u, w)) {
                        ancestor[u] = pairStamp;
                        queueFrom[tail++] = u;
                    }
                }
            }
        }

        /**
         * Possible-D-Sep(x, y), ascending, x excluded, after {@link #possibleAncestors(int, int)}:
         * the vertices joined to x by a walk whose vertices are possible ancestors of x or y and
         * whose inner vertices are colliders on it or lie in a triangle with their two neighbours.
         */
        int[] possibleDsep(int x) {
            stamp++;
            seenVertex[x] = stamp;
            int head = 0;
            int tail = 0;
            int count = 0;
            // A state is the edge (a, b) by which the walk entered b: a = queueFrom, b = nbr[a][slot].
            for (int i = 0; i < r.nbr[x].length; i++) {
                int b = r.nbr[x][i];
                if (ancestor[b] != pairStamp) {
                    continue;
                }
                seenState[r.offset[x] + i] = stamp;
                queueFrom[tail] = x;
                queueSlot[tail] = i;
                queueLength[tail] = 1;
                tail++;
                seenVertex[b] = stamp;
                out[count++] = b;
            }
            while (head < tail) {
                int a = queueFrom[head];
                int b = r.nbr[a][queueSlot[head]];
                int length = queueLength[head];
                head++;
                if (length >= maxLength) {
                    continue;
                }
                boolean arrowAtBFromA = r.arrow(b, a);
                int[] around = r.nbr[b];
                for (int j = 0; j < around.length; j++) {
                    int c = around[j];
                    int state = r.offset[b] + j;
                    if (c == a || c == x || seenState[state] == stamp || ancestor[c] != pairStamp) {
                        continue;
                    }
                    boolean collider = arrowAtBFromA && r.arrowAt[b][j];
                    if (!collider && !r.adjacent(a, c)) {
                        continue;
                    }
                    seenState[state] = stamp;
                    queueFrom[tail] = b;
                    queueSlot[tail] = j;
                    queueLength[tail] = length + 1;
                    tail++;
                    if (seenVertex[c] != stamp) {
                        seenVertex[c] = stamp;
                        out[count++] = c;
                    }
                }
            }
            int[] result = Arrays.copyOf(out, count);
            Arrays.sort(result);
            return result;
        }
    }

    /** Tests the edges against their Possible-D-Sep sets; one per thread. */
    private final class EdgeWorker implements java.util.function.IntConsumer {
        private final Skeleton s;
        private final Walker walker;
        private final int[] xs;
        private final int[] ys;
        private final int[][] found;
        private final SubsetSearch subsets = new SubsetSearch(test);
        private long tests;

        EdgeWorker(Skeleton s, Walker walker, int[] xs, int[] ys, int[][] found) {
            this.s = s;
            this.walker = walker;
            this.xs = xs;
            this.ys = ys;
            this.found = found;
        }

        @Override
        public void accept(int i) {
            context.checkDeadline();
            int x = xs[i];
            int y = ys[i];
            walker.possibleAncestors(x, y);
            int[] sep = separate(x, y);
            if (sep == null) {
                sep = separate(y, x);
            }
            found[i] = sep;
        }

        /** A subset of Possible-D-Sep(x) \ {y}, not inside adj(x), separating x and y; or null. */
        private int[] separate(int x, int y) {
            int[] cand = without(walker.possibleDsep(x), y);
            boolean anyNew = false;
            for (int v : cand) {
                anyNew |= !s.adjacent(x, v);
            }
            if (!anyNew) {
                return null;
            }
            int[][] result = new int[1][];
            int top = Math.min(cand.length, maxDepth);
            for (int size = 1; size <= top && result[0] == null; size++) {
                long[] visited = {0};
                subsets.forEach(cand, cand.length, size, z -> {
                    if ((++visited[0] & 63) == 0) {
                        context.checkDeadline();
                    }
                    if (insideAdjacency(x, z)) {
                        return true;
                    }
                    tests++;
                    if (test.independent(x, y, z)) {
                        result[0] = z.clone();
                        return false;
                    }
                    return true;
                });
            }
            return result[0];
        }

        private boolean insideAdjacency(int x, int[] z) {
            for (int v : z) {
                if (!s.adjacent(x, v)) {
                    return false;
                }
            }
            return true;
        }
    }

    private static int[] without(int[] a, int v) {
        int k = Arrays.binarySearch(a, v);
        if (k < 0) {
            return a;
        }
        int[] out = new int[a.length - 1];
        System.arraycopy(a, 0, out, 0, k);
        System.arraycopy(a, k + 1, out, k, a.length - k - 1);
        return out;
    }
}
