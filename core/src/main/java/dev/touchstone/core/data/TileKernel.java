package dev.touchstone.core.data;

/**
 * The cross products of a tile of column pairs, Σ_r a_i[r]·a_j[r] for i in [i0, i1) and j in
 * [j0, j1), each summed in {@link CrossProduct}'s order: rows in quadruples, the four products
 * of a quadruple added left to right before joining the running sum, the remaining rows one by
 * one at the end. Every implementation keeps that order exactly (only the work between
 * different pairs is interleaved), so all give bitwise the same sums as
 * {@link CentredColumns#correlation}'s single pair. An instance owns its scratch and serves
 * one thread.
 *
 * <p>Two implementations: {@link VectorTileKernel}, register-blocked with the Vector API
 * (Java 17's incubator module {@code jdk.incubator.vector}, which the launcher enables), and
 * {@link BlockedTileKernel}, a plain blocked loop used when that module is not in the
 * running JVM. Both follow Goto and van de Geijn (2008, "Anatomy of high-performance matrix
 * multiplication", ACM TOMS 34(3)): the tile's columns are packed by panels of rows so that
 * the panel stays in cache while every output row sweeps it.
 */
interface TileKernel {

    /** Rows per packed panel: with 256 columns a panel of 512 kB stays in the level-2 cache. */
    int ROW_PANEL = CrossProduct.ROW_PANEL;

    /**
     * Writes the cross products into {@code sums[(i − i0)·(j1 − j0) + (j − j0)]}.
     *
     * @param columns the columns, each of {@code rows} entries
     */
    void crossProducts(double[][] columns, int rows, int i0, int i1, int j0, int j1, double[] sums);

    /** Whether the Vector API's module is in the running JVM (the launcher adds it). */
    static boolean vectorAvailable() {
        return ModuleLayer.boot().findModule("jdk.incubator.vector").isPresent();
    }

    /** A new kernel of the faster kind the running JVM offers (measured in docs/dev/constraint.md). */
    static TileKernel create() {
        // VectorTileKernel is only loaded on this branch, so a JVM without the module never links it.
        return vectorAvailable() ? new VectorTileKernel() : new BlockedTileKernel();
    }

    /** c plus Σ a[r]·b[r] over rows [from, to) in the order above ({@code from} a multiple of 4 or the start). */
    static double crossProduct(double[] a, double[] b, int from, int to, double c) {
        int r = from;
        for (; r + 4 <= to; r += 4) {
            c += a[r] * b[r] + a[r + 1] * b[r + 1] + a[r + 2] * b[r + 2] + a[r + 3] * b[r + 3];
        }
        for (; r < to; r++) {
            c += a[r] * b[r];
        }
        return c;
    }
}
