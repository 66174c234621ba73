package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.independence.IndependenceTest;

import java.util.Arrays;
import java.util.Queue;
import java.util.concurrent.ConcurrentLinkedQueue;

/**
 * FCI's second adjacency phase: an edge x *-* y left by the PC-style search is removed when
 * x and y test independent given a subset of Possible-D-Sep(x) (or of Possible-D-Sep(y)),
 * the set being recorded as their separating set (Spirtes, Glymour and Scheines 2000,
 * §6.7; Zhang 2008, AI 172, §3.1).
 *
 * <p>Possible-D-Sep(x) in the graph after R0 is the set of v ≠ x joined to x by a path on
 * which every inner vertex b, with neighbours a and c on the path, is a collider
 * (a *→ b ←* c) or lies in a triangle (a and c adjacent) (Colombo, Maathuis, Kalisch and
 * Richardson 2012, Ann. Stat. 40, Definition 3.3, from memory). It is computed here by a
 * breadth-first search over directed edges (a, b): this finds every vertex reachable by a
 * <em>walk</em> with that property, a superset of the path definition. A superset is still
 * correct: it only adds candidate conditioning sets, and with a perfect oracle an edge is
 * removed only when a separating set exists, which Spirtes et al. show lies inside
 * Possible-D-Sep whenever x and y are not adjacent in the MAG. An optional bound on the walk
 * length trades completeness for speed.
 *
 * <p>Order independence: all Possible-D-Sep sets are computed once, from the graph after
 * R0, and every edge is tested against them and against the adjacencies at the start of the
 * phase; removals are applied at the end (as in the order-independent FCI of Colombo and
 * Maathuis 2014). So the edges removed do not depend on the order of the variables and the
 * edges' tests run on {@link RunContext#threads()} threads.
 *
 * <p>Tests saved: a conditioning set contained in adj(x) \ {y} (adjacencies at the start of
 * the phase) was already tried by the adjacency search, which tried every subset of the
 * final neighbourhoods up to {@code max_depth}, so it is skipped. Sets are tried by
 * increasing size, first from x's side then from y's, in lexicographic order of positions.
 *
 * <p>Cost: one search of O(Σ deg²) per vertex for the sets; then, per edge, up to
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
        int[][] pds = new int[p][];
        int[][] nb = new int[p][];
        Walker walker = new Walker(g);
        for (int v = 0; v < p; v++) {
            context.checkDeadline();
            nb[v] = s.neighbours(v);
            pds[v] = walker.possibleDsep(v);
        }
        int pairs = 0;
        for (int x = 0; x < p; x++) {
            for (int y : nb[x]) {
                if (x < y && !knowledge.adjacencyRequired(x, y)) {
                    pairs++;
                }
            }
        }
        int[] xs = new int[pairs];
        int[] ys = new int[pairs];
        int k = 0;
        for (int x = 0; x < p; x++) {
            for (int y : nb[x]) {
                if (x < y && !knowledge.adjacencyRequired(x, y)) {
                    xs[k] = x;
                    ys[k] = y;
                    k++;
                }
            }
        }
        int[][] found = new int[pairs][];
        Queue<EdgeWorker> workers = new ConcurrentLinkedQueue<>();
        try {
            ParallelLoop.run(pairs, context.threads(), () -> {
                EdgeWorker w = new EdgeWorker(s, pds, xs, ys, found);
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

    /** Breadth-first search over directed edges of the R0 graph; reuses its arrays between start vertices. */
    private final class Walker {
        private final int p;
        private final int[][] nbr;
        private final int[] offset;
        private final boolean[] adjacency;
        private final boolean[][] arrowAt;
        private final int[] seenState;
        private final int[] seenVertex;
        private final int[] queueFrom;
        private final int[] queueSlot;
        private final int[] queueLength;
        private int stamp;

        Walker(MutableGraph g) {
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
            // Adjacency as a bit-per-pair matrix only where it stays small; binary search otherwise.
            this.adjacency = (long) p * p <= 16_000_000L ? new boolean[p * p] : null;
            if (adjacency != null) {
                for (int v = 0; v < p; v++) {
                    for (int w : nbr[v]) {
                        adjacency[v * p + w] = true;
                    }
                }
            }
            int states = offset[p];
            this.seenState = new int[states];
            this.seenVertex = new int[p];
            this.queueFrom = new int[states];
            this.queueSlot = new int[states];
            this.queueLength = new int[states];
        }

        private boolean adjacent(int a, int b) {
            return adjacency != null ? adjacency[a * p + b] : Arrays.binarySearch(nbr[a], b) >= 0;
        }

        /** Possible-D-Sep(x), ascending, x excluded. */
        int[] possibleDsep(int x) {
            stamp++;
            seenVertex[x] = stamp;
            int head = 0;
            int tail = 0;
            int[] out = new int[p];
            int count = 0;
            // A state is the edge (a, b) by which the walk entered b: a = queueFrom, b = nbr[a][slot].
            for (int i = 0; i < nbr[x].length; i++) {
                seenState[offset[x] + i] = stamp;
                queueFrom[tail] = x;
                queueSlot[tail] = i;
                queueLength[tail] = 1;
                tail++;
                int b = nbr[x][i];
                if (seenVertex[b] != stamp) {
                    seenVertex[b] = stamp;
                    out[count++] = b;
                }
            }
            while (head < tail) {
                int a = queueFrom[head];
                int b = nbr[a][queueSlot[head]];
                int length = queueLength[head];
                head++;
                if (length >= maxLength) {
                    continue;
                }
                int ab = Arrays.binarySearch(nbr[b], a);
                boolean arrowAtBFromA = arrowAt[b][ab];
                for (int j = 0; j < nbr[b].length; j++) {
                    int c = nbr[b][j];
                    if (c == a || c == x || seenState[offset[b] + j] == stamp) {
                        continue;
                    }
                    boolean collider = arrowAtBFromA && arrowAt[b][j];
                    if (!collider && !adjacent(a, c)) {
                        continue;
                    }
                    seenState[offset[b] + j] = stamp;
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
        private final int[][] pds;
        private final int[] xs;
        private final int[] ys;
        private final int[][] found;
        private final SubsetSearch subsets = new SubsetSearch(test);
        private long tests;

        EdgeWorker(Skeleton s, int[][] pds, int[] xs, int[] ys, int[][] found) {
            this.s = s;
            this.pds = pds;
            this.xs = xs;
            this.ys = ys;
            this.found = found;
        }

        @Override
        public void accept(int i) {
            context.checkDeadline();
            int x = xs[i];
            int y = ys[i];
            int[] sep = separate(x, y);
            if (sep == null) {
                sep = separate(y, x);
            }
            found[i] = sep;
        }

        /** A subset of Possible-D-Sep(x) \ {y}, not inside adj(x), separating x and y; or null. */
        private int[] separate(int x, int y) {
            int[] cand = without(pds[x], y);
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
