package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;

import java.util.Arrays;

/**
 * d-separation in a DAG by linear-time reachability ("Bayes-ball"; Shachter 1998,
 * "Bayes-ball: the rational pastime", UAI; Koller and Friedman 2009, Algorithm 3.1).
 *
 * <p>A query costs O(|An(Z)| + the part of the graph reachable from x by active trails),
 * at most O(|V| + |E|), with no O(|V|) set-up: per-thread scratch arrays are stamped with a
 * query number instead of being cleared. Instances are immutable and thread-safe;
 * building one costs O(|V| + |E|) and checks that the graph is a DAG.
 */
public final class DSeparation {

    private final Graph dag;
    private final int n;
    private final int[] parentOffsets;
    private final int[] parentList;
    private final int[] childOffsets;
    private final int[] childList;
    private final ThreadLocal<Scratch> scratch;

    /**
     * @throws IllegalArgumentException if {@code dag} is not a DAG, naming the edge or cycle
     */
    public DSeparation(Graph dag) {
        GraphChecks.checkDag(dag);
        this.dag = dag;
        this.n = dag.size();
        this.parentOffsets = new int[n + 1];
        this.childOffsets = new int[n + 1];
        for (int v = 0; v < n; v++) {
            int np = 0;
            for (int k = 0, d = dag.degree(v); k < d; k++) {
                if (Ancestry.isParentSlot(dag, v, k)) {
                    np++;
                }
            }
            parentOffsets[v + 1] = parentOffsets[v] + np;
            childOffsets[v + 1] = childOffsets[v] + dag.degree(v) - np;
        }
        this.parentList = new int[parentOffsets[n]];
        this.childList = new int[childOffsets[n]];
        for (int v = 0; v < n; v++) {
            int pi = parentOffsets[v];
            int ci = childOffsets[v];
            for (int k = 0, d = dag.degree(v); k < d; k++) {
                if (Ancestry.isParentSlot(dag, v, k)) {
                    parentList[pi++] = dag.neighbour(v, k);
                } else {
                    childList[ci++] = dag.neighbour(v, k);
                }
            }
        }
        this.scratch = ThreadLocal.withInitial(() -> new Scratch(n));
    }

    /** The DAG queried. */
    public Graph graph() {
        return dag;
    }

    /**
     * Whether {@code x} and {@code y} are d-separated given the set {@code given}.
     *
     * @throws IllegalArgumentException if x equals y or either is in {@code given}
     */
    public boolean separated(int x, int y, int[] given) {
        if (x == y) {
            throw new IllegalArgumentException("x and y must differ, got '" + dag.name(x) + "' twice");
        }
        return separated(new int[] {x}, new int[] {y}, given);
    }

    /**
     * Whether every variable of {@code xs} is d-separated from every variable of {@code ys}
     * given {@code given}: one traversal for the whole set.
     *
     * @throws IllegalArgumentException if the three sets are not disjoint
     */
    public boolean separated(int[] xs, int[] ys, int[] given) {
        Scratch w = scratch.get();
        int q = w.next();
        int qz = q + 1; // stamp for "in Z", "in An(Z)" uses q + 2, "in Y" uses q + 3
        int qa = q + 2;
        int qy = q + 3;
        int[] zMark = w.zMark;
        int[] anMark = w.anMark;
        for (int z : given) {
            zMark[z] = qz;
        }
        for (int v : ys) {
            if (zMark[v] == qz) {
                throw new IllegalArgumentException("'" + dag.name(v) + "' is both separated and conditioned on");
            }
            w.yMark[v] = qy;
        }
        for (int v : xs) {
            if (zMark[v] == qz || w.yMark[v] == qy) {
                throw new IllegalArgumentException("'" + dag.name(v) + "' is both separated and "
                        + (zMark[v] == qz ? "conditioned on" : "in the other set"));
            }
        }
        // Ancestors of Z (Z included): a collider passes the ball exactly when it is among them.
        int[] stack = w.stack;
        int top = 0;
        for (int z : given) {
            if (anMark[z] != qa) {
                anMark[z] = qa;
                stack[top++] = z;
            }
        }
        while (top > 0) {
            int v = stack[--top];
            for (int i = parentOffsets[v], e = parentOffsets[v + 1]; i < e; i++) {
                int p = parentList[i];
                if (anMark[p] != qa) {
                    anMark[p] = qa;
                    stack[top++] = p;
                }
            }
        }
        // States (variable, direction): "up" = the ball arrived from a child (or starts there),
        // "down" = from a parent. Each state is visited at most once.
        int[] upMark = w.upMark;
        int[] downMark = w.downMark;
        int[] queue = w.queue;
        int head = 0;
        int tail = 0;
        for (int x : xs) {
            if (upMark[x] != q) {
                upMark[x] = q;
                queue[tail++] = x << 1 | 1;
            }
        }
        int[] yMark = w.yMark;
        while (head < tail) {
            int s = queue[head++];
            int v = s >>> 1;
            if (yMark[v] == qy) {
                return false;
            }
            boolean inZ = zMark[v] == qz;
            if ((s & 1) == 1) {
                if (inZ) {
                    continue;
                }
                for (int i = parentOffsets[v], e = parentOffsets[v + 1]; i < e; i++) {
                    int p = parentList[i];
                    if (upMark[p] != q) {
                        upMark[p] = q;
                        queue[tail++] = p << 1 | 1;
                    }
                }
                for (int i = childOffsets[v], e = childOffsets[v + 1]; i < e; i++) {
                    int c = childList[i];
                    if (downMark[c] != q) {
                        downMark[c] = q;
                        queue[tail++] = c << 1;
                    }
                }
            } else {
                if (!inZ) {
                    for (int i = childOffsets[v], e = childOffsets[v + 1]; i < e; i++) {
                        int c = childList[i];
                        if (downMark[c] != q) {
                            downMark[c] = q;
                            queue[tail++] = c << 1;
                        }
                    }
                }
                if (anMark[v] == qa) {
                    for (int i = parentOffsets[v], e = parentOffsets[v + 1]; i < e; i++) {
                        int p = parentList[i];
                        if (upMark[p] != q) {
                            upMark[p] = q;
                            queue[tail++] = p << 1 | 1;
                        }
                    }
                }
            }
        }
        return true;
    }

    /** Per-thread marks, stamped with a query number so they never need clearing. */
    private static final class Scratch {
        final int[] zMark;
        final int[] anMark;
        final int[] yMark;
        final int[] upMark;
        final int[] downMark;
        final int[] stack;
        final int[] queue;
        private int stamp;

        Scratch(int n) {
            zMark = new int[n];
            anMark = new int[n];
            yMark = new int[n];
            upMark = new int[n];
            downMark = new int[n];
            stack = new int[n];
            queue = new int[2 * n];
        }

        /** A fresh block of four stamps; clears the marks when the counter would wrap. */
        int next() {
            if (stamp > Integer.MAX_VALUE - 8) {
                Arrays.fill(zMark, 0);
                Arrays.fill(anMark, 0);
                Arrays.fill(yMark, 0);
                Arrays.fill(upMark, 0);
                Arrays.fill(downMark, 0);
                stamp = 0;
            }
            stamp += 4;
            return stamp;
        }
    }
}
