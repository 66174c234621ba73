package dev.touchstone.core.data;

import dev.touchstone.core.learner.ParallelLoop;

/**
 * The upper triangle of X'X for a row-major n × p matrix X, by a cache-blocked loop that
 * HotSpot's C2 compiler turns into SIMD code.
 *
 * <p>The blocking follows Goto and van de Geijn (2008, "Anatomy of high-performance matrix
 * multiplication", ACM TOMS 34(3)): the columns are cut into blocks of
 * {@value #COLUMN_BLOCK} and the rows into panels of {@value #ROW_PANEL}, so that the panel
 * of X for one column block (≈ 512 kB) stays in the level-2 cache while every output row
 * sweeps it, and the output segment being updated (2 kB) stays in the level-1 cache. The
 * innermost loop adds four rows of X at once into one output row
 * ({@code c[j] += a0·x0[j] + a1·x1[j] + a2·x2[j] + a3·x3[j]}): four multiply-adds per store
 * instead of the naive loop's one, in a loop shape (one array written, one index) that C2's
 * superword pass vectorises. Tiles updating two or four output rows at once were tried and
 * measured slower on Java 17: C2 did not vectorise them (see {@code docs/dev/data-io.md}).
 *
 * <p>Every output entry is owned by exactly one task and accumulated in a fixed order
 * (panels in order, rows in quadruples in order, each quadruple's four products summed
 * left to right before being added), so the result is bitwise the same for any number of
 * threads. Cost: about n·p² flops for the triangle, O(p²) memory for the output.
 */
final class CrossProduct {

    static final int COLUMN_BLOCK = 256;
    static final int ROW_PANEL = 256;
    /** Output rows per task within a column block: small enough to balance two or more threads. */
    static final int TASK_ROWS = 128;

    private CrossProduct() {
    }

    /**
     * Sums x[r][i]·x[r][j] over all rows r into {@code out[i][j]} for every j ≥ i (entries
     * below the diagonal may receive partial sums and must be ignored).
     *
     * @param x       the rows of X, each of length p
     * @param p       the number of columns
     * @param threads how many threads to use (1 = the calling thread only)
     * @return the p rows of the output, each of length p
     */
    static double[][] upper(double[][] x, int p, int threads) {
        double[][] out = new double[p][p];
        int n = x.length;
        int blocks = (p + COLUMN_BLOCK - 1) / COLUMN_BLOCK;
        // Tasks: (column block, range of output rows); the larger blocks (more rows above
        // the diagonal) are listed first so that threads finish together.
        int[][] tasks = tasks(p, blocks);
        ParallelLoop.run(threads, tasks.length, 1, () -> k -> run(x, out, n, p, tasks[k]));
        return out;
    }

    private static int[][] tasks(int p, int blocks) {
        int count = 0;
        for (int b = blocks - 1; b >= 0; b--) {
            int rowsAbove = Math.min(p, (b + 1) * COLUMN_BLOCK);
            count += (rowsAbove + TASK_ROWS - 1) / TASK_ROWS;
        }
        int[][] tasks = new int[count][];
        int k = 0;
        for (int b = blocks - 1; b >= 0; b--) {
            int jc = b * COLUMN_BLOCK;
            int je = Math.min(p, jc + COLUMN_BLOCK);
            for (int i0 = 0; i0 < je; i0 += TASK_ROWS) {
                tasks[k++] = new int[] {jc, je, i0, Math.min(je, i0 + TASK_ROWS)};
            }
        }
        return tasks;
    }

    private static void run(double[][] x, double[][] out, int n, int p, int[] task) {
        int jc = task[0];
        int je = task[1];
        int iStart = task[2];
        int iEnd = task[3];
        for (int pc = 0; pc < n; pc += ROW_PANEL) {
            int pe = Math.min(n, pc + ROW_PANEL);
            for (int i = iStart; i < iEnd; i++) {
                single(x, out[i], i, Math.max(jc, i), je, pc, pe);
            }
        }
    }

    /** One output row i, columns [js, je), rows of X [pc, pe). */
    private static void single(double[][] x, double[] c0, int i, int js, int je, int pc, int pe) {
        int r = pc;
        for (; r + 4 <= pe; r += 4) {
            double[] x0 = x[r];
            double[] x1 = x[r + 1];
            double[] x2 = x[r + 2];
            double[] x3 = x[r + 3];
            double a0 = x0[i], a1 = x1[i], a2 = x2[i], a3 = x3[i];
            for (int j = js; j < je; j++) {
                c0[j] += a0 * x0[j] + a1 * x1[j] + a2 * x2[j] + a3 * x3[j];
            }
        }
        for (; r < pe; r++) {
            double[] x0 = x[r];
            double a0 = x0[i];
            for (int j = js; j < je; j++) {
                c0[j] += a0 * x0[j];
            }
        }
    }
}
