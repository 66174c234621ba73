package dev.touchstone.core.data;

/**
 * The plain-Java tile kernel, used when the Vector API's module is not in the running JVM:
 * the tile's columns are packed into rows panel by panel, and each output row sweeps the
 * panel with {@link CrossProduct}'s loop shape (four rows of the panel at once into one
 * output row), which C2's superword pass vectorises. Register blocking in plain Java (4 × 4
 * scalar accumulators, or one output row held for 16 columns) was measured no faster: C2
 * does not vectorise those shapes, since a strict-order sum is not reassociated.
 */
final class BlockedTileKernel implements TileKernel {

    private double[][] panel = new double[ROW_PANEL][0];

    @Override
    public void crossProducts(double[][] columns, int rows, int i0, int i1, int j0, int j1, double[] sums) {
        int width = j1 - j0;
        if (panel[0].length < width) {
            panel = new double[ROW_PANEL][width];
        }
        java.util.Arrays.fill(sums, 0, (i1 - i0) * width, 0.0);
        for (int pc = 0; pc < rows; pc += ROW_PANEL) {
            int pe = Math.min(rows, pc + ROW_PANEL);
            for (int j = j0; j < j1; j++) {
                double[] col = columns[j];
                int jj = j - j0;
                for (int r = pc; r < pe; r++) {
                    panel[r - pc][jj] = col[r];
                }
            }
            for (int i = i0; i < i1; i++) {
                accumulate(columns[i], pc, pe, sums, (i - i0) * width, width);
            }
        }
    }

    /** Adds rows [pc, pe) of column a times the packed panel into {@code c[offset … offset + width)}. */
    private void accumulate(double[] a, int pc, int pe, double[] c, int offset, int width) {
        int r = pc;
        for (; r + 4 <= pe; r += 4) {
            double[] x0 = panel[r - pc];
            double[] x1 = panel[r - pc + 1];
            double[] x2 = panel[r - pc + 2];
            double[] x3 = panel[r - pc + 3];
            double a0 = a[r], a1 = a[r + 1], a2 = a[r + 2], a3 = a[r + 3];
            for (int j = 0; j < width; j++) {
                c[offset + j] += a0 * x0[j] + a1 * x1[j] + a2 * x2[j] + a3 * x3[j];
            }
        }
        for (; r < pe; r++) {
            double[] x0 = panel[r - pc];
            double a0 = a[r];
            for (int j = 0; j < width; j++) {
                c[offset + j] += a0 * x0[j];
            }
        }
    }
}
