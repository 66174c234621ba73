package dev.touchstone.learners.constraint;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;

/**
 * The undirected adjacencies found by a constraint-based search, with the separating set
 * recorded for every pair the search removed. Not thread-safe for writes; the parallel
 * search collects a level's removals and applies them afterwards.
 *
 * <p>Storage: each variable's neighbours as an ascending array, and a map holding the
 * separating sets that are not empty (and the pairs removed by knowledge). A pair that is not
 * adjacent and has no entry was separated by the empty set, which is what level 0 of the
 * adjacency search finds for all but a few of the p² pairs; so memory is O(p + edges + sets
 * of size ≥ 1), lookups of adjacency cost O(log degree), and a removal O(degree).
 */
public final class Skeleton {

    private static final int[] NO_SET = new int[0];
    /** The entry of a pair removed by knowledge, which has no separating set. */
    private static final int[] BY_KNOWLEDGE = new int[0];

    private final int p;
    private final int[][] neighbours;
    private final int[] degree;
    private final Map<Long, int[]> sepsets = new HashMap<>();

    /** The complete graph over p variables, nothing separated yet. */
    Skeleton(int p) {
        this(complete(p));
    }

    /**
     * The graph whose neighbours of v are {@code neighbours[v]} (ascending, symmetric; copied,
     * since removals shift entries in place), every other pair separated by the empty set.
     */
    Skeleton(int[][] neighbours) {
        this.p = neighbours.length;
        this.neighbours = new int[p][];
        this.degree = new int[p];
        for (int v = 0; v < p; v++) {
            this.neighbours[v] = neighbours[v].clone();
            degree[v] = neighbours[v].length;
        }
    }

    private static int[][] complete(int p) {
        int[][] nb = new int[p][];
        for (int v = 0; v < p; v++) {
            nb[v] = new int[p - 1];
            for (int w = 0, k = 0; w < p; w++) {
                if (w != v) {
                    nb[v][k++] = w;
                }
            }
        }
        return nb;
    }

    public int size() {
        return p;
    }

    public boolean adjacent(int a, int b) {
        return Arrays.binarySearch(neighbours[a], 0, degree[a], b) >= 0;
    }

    /** The neighbours of {@code v}, ascending (a fresh array). */
    public int[] neighbours(int v) {
        return Arrays.copyOf(neighbours[v], degree[v]);
    }

    /** The number of neighbours of {@code v}. */
    public int degree(int v) {
        return degree[v];
    }

    /** The number of edges. */
    public int edgeCount() {
        long twice = 0;
        for (int d : degree) {
            twice += d;
        }
        return (int) (twice / 2);
    }

    /**
     * The separating set recorded when a and b were found independent, or null when they
     * are adjacent or were made non-adjacent without a test (by knowledge).
     */
    public int[] sepset(int a, int b) {
        if (a == b || adjacent(a, b)) {
            return null;
        }
        int[] s = sepsets.get(key(a, b));
        return s == null ? NO_SET : s == BY_KNOWLEDGE ? null : s;
    }

    /** Whether the recorded separating set of a and b contains v (false without one). */
    public boolean sepsetContains(int a, int b, int v) {
        int[] s = sepset(a, b);
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
        drop(a, b);
        drop(b, a);
        long k = key(a, b);
        if (separatingSet == null) {
            sepsets.put(k, BY_KNOWLEDGE);
        } else if (separatingSet.length == 0) {
            sepsets.remove(k);
        } else {
            sepsets.put(k, separatingSet);
        }
    }

    private void drop(int v, int w) {
        int[] nb = neighbours[v];
        int i = Arrays.binarySearch(nb, 0, degree[v], w);
        if (i >= 0) {
            System.arraycopy(nb, i + 1, nb, i, degree[v] - i - 1);
            degree[v]--;
        }
    }

    private long key(int a, int b) {
        return (long) Math.min(a, b) * p + Math.max(a, b);
    }
}
