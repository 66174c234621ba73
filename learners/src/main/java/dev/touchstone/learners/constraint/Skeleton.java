package dev.touchstone.learners.constraint;

import java.util.Arrays;

/**
 * The undirected adjacencies found by a constraint-based search, with the separating set
 * recorded for every pair the search removed. Not thread-safe for writes; the parallel
 * search collects a level's removals and applies them afterwards.
 *
 * <p>Storage: a p × p adjacency matrix and one slot per unordered pair for its separating
 * set, O(p²) memory in total (about 12 bytes per pair), which keeps every lookup O(1).
 */
public final class Skeleton {

    private static final int[] NO_SET = new int[0];

    private final int p;
    private final boolean[] adjacent;
    private final int[][] sepsets;

    /** The complete graph over p variables, nothing separated yet. */
    Skeleton(int p) {
        if (p > 40_000) {
            throw new IllegalArgumentException("the adjacency search supports at most 40000 variables, got " + p);
        }
        this.p = p;
        this.adjacent = new boolean[p * p];
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                adjacent[a * p + b] = a != b;
            }
        }
        this.sepsets = new int[p * (p - 1) / 2 + 1][];
    }

    public int size() {
        return p;
    }

    public boolean adjacent(int a, int b) {
        return adjacent[a * p + b];
    }

    /** The neighbours of {@code v}, ascending (a fresh array). */
    public int[] neighbours(int v) {
        int[] out = new int[p];
        int k = 0;
        int row = v * p;
        for (int w = 0; w < p; w++) {
            if (adjacent[row + w]) {
                out[k++] = w;
            }
        }
        return Arrays.copyOf(out, k);
    }

    /** The number of edges. */
    public int edgeCount() {
        int n = 0;
        for (int a = 0; a < p; a++) {
            for (int b = a + 1; b < p; b++) {
                if (adjacent[a * p + b]) {
                    n++;
                }
            }
        }
        return n;
    }

    /**
     * The separating set recorded when a and b were found independent, or null when they
     * are adjacent or were made non-adjacent without a test (by knowledge).
     */
    public int[] sepset(int a, int b) {
        return sepsets[pair(a, b)];
    }

    /** Whether the recorded separating set of a and b contains v (false without one). */
    public boolean sepsetContains(int a, int b, int v) {
        int[] s = sepsets[pair(a, b)];
        if (s == null) {
            return false;
        }
        for (int w : s) {
            if (w == v) {
                return true;
            }
        }
        return false;
    }

    /** Removes the edge a − b, recording the set that separated them (null: removed by knowledge). */
    void remove(int a, int b, int[] separatingSet) {
        adjacent[a * p + b] = false;
        adjacent[b * p + a] = false;
        sepsets[pair(a, b)] = separatingSet == null ? null
                : separatingSet.length == 0 ? NO_SET : separatingSet;
    }

    private int pair(int a, int b) {
        int lo = Math.min(a, b);
        int hi = Math.max(a, b);
        return lo * p - lo * (lo + 1) / 2 + (hi - lo - 1);
    }
}
