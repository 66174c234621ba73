package dev.touchstone.learners.independence;

import dev.touchstone.core.data.CentredColumns;

import java.util.Arrays;

/**
 * The correlations a Fisher z test reads when there are too many variables for a p × p
 * matrix: those of the pairs that level 0 of the adjacency search kept (stored with each
 * variable's ascending list of such partners, O(kept pairs) memory), and any other pair
 * computed from the centred columns when asked (O(n)), remembered in a small per-thread
 * direct-mapped cache so that the pairs a level asks again and again are computed once.
 * Every value is bitwise the correlation matrix's entry (see {@link CentredColumns}), so the
 * test decides exactly as it would on the matrix. Thread-safe: the kept pairs are published
 * once, before the levels that read them.
 */
final class ScreenedCorrelations {

    /** 2¹⁴ slots per thread (256 kB): enough for the conditioning sets of a few thousand pairs. */
    private static final int CACHE_BITS = 14;

    private final CentredColumns columns;
    private volatile Kept kept;
    private final ThreadLocal<Cache> cache = ThreadLocal.withInitial(Cache::new);

    ScreenedCorrelations(CentredColumns columns) {
        this.columns = columns;
    }

    CentredColumns columns() {
        return columns;
    }

    /** Remembers the pairs level 0 kept: partners of v ascending in {@code partners[v]}, their correlations in {@code values[v]}. */
    void keep(int[][] partners, double[][] values) {
        kept = new Kept(partners, values);
    }

    /** The correlation of a and b, bitwise the matrix entry. */
    double get(int a, int b) {
        if (a == b) {
            return 1.0;
        }
        Kept k = kept;
        if (k != null) {
            int i = Arrays.binarySearch(k.partners[a], b);
            if (i >= 0) {
                return k.values[a][i];
            }
        }
        return cache.get().get(columns, a, b);
    }

    private record Kept(int[][] partners, double[][] values) {
    }

    /** A direct-mapped cache of computed pairs, keyed by the unordered pair. */
    private static final class Cache {
        private final long[] keys = new long[1 << CACHE_BITS];
        private final double[] values = new double[1 << CACHE_BITS];

        Cache() {
            Arrays.fill(keys, -1L);
        }

        double get(CentredColumns columns, int a, int b) {
            long key = ((long) Math.min(a, b) << 32) | Math.max(a, b);
            int slot = (int) ((key * 0x9E3779B97F4A7C15L) >>> (64 - CACHE_BITS));
            if (keys[slot] == key) {
                return values[slot];
            }
            double r = columns.correlation(a, b);
            keys[slot] = key;
            values[slot] = r;
            return r;
        }
    }
}
