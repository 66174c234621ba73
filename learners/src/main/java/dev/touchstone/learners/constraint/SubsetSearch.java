package dev.touchstone.learners.constraint;

import dev.touchstone.learners.independence.IndependenceTest;

/**
 * Looks for a set that separates two variables among the subsets of a candidate set of a
 * given size, in lexicographic order of the candidates' positions. One instance per thread:
 * it reuses its arrays, so a search allocates nothing until it finds a set (which it copies).
 */
final class SubsetSearch {

    private final IndependenceTest test;
    private int[][] scratch = new int[8][];
    private int[] choice = new int[8];
    private long tests;

    SubsetSearch(IndependenceTest test) {
        this.test = test;
        for (int k = 0; k < scratch.length; k++) {
            scratch[k] = new int[k];
        }
    }

    /** Tests run by this instance so far. */
    long tests() {
        return tests;
    }

    /**
     * The first subset of {@code candidates[0 … m)} of size {@code size} given which x and y
     * test independent, or null if none does.
     */
    int[] find(int x, int y, int[] candidates, int m, int size) {
        if (size > m) {
            return null;
        }
        if (size >= scratch.length) {
            int[][] bigger = new int[size + 1][];
            System.arraycopy(scratch, 0, bigger, 0, scratch.length);
            for (int k = scratch.length; k <= size; k++) {
                bigger[k] = new int[k];
            }
            scratch = bigger;
            choice = new int[size + 1];
        }
        int[] z = scratch[size];
        int[] c = choice;
        for (int i = 0; i < size; i++) {
            c[i] = i;
        }
        while (true) {
            for (int i = 0; i < size; i++) {
                z[i] = candidates[c[i]];
            }
            tests++;
            if (test.independent(x, y, z)) {
                return z.clone();
            }
            // Next combination in lexicographic order.
            int i = size - 1;
            while (i >= 0 && c[i] == m - size + i) {
                i--;
            }
            if (i < 0) {
                return null;
            }
            c[i]++;
            for (int j = i + 1; j < size; j++) {
                c[j] = c[j - 1] + 1;
            }
        }
    }

    /** Calls {@code visitor} with every subset of candidates[0 … m) of size {@code size}; stops when it returns false. */
    void forEach(int[] candidates, int m, int size, java.util.function.Predicate<int[]> visitor) {
        if (size > m) {
            return;
        }
        int[] z = new int[size];
        int[] c = new int[size];
        for (int i = 0; i < size; i++) {
            c[i] = i;
        }
        while (true) {
            for (int i = 0; i < size; i++) {
                z[i] = candidates[c[i]];
            }
            if (!visitor.test(z)) {
                return;
            }
            int i = size - 1;
            while (i >= 0 && c[i] == m - size + i) {
                i--;
            }
            if (i < 0) {
                return;
            }
            c[i]++;
            for (int j = i + 1; j < size; j++) {
                c[j] = c[j - 1] + 1;
            }
        }
    }
}
