package dev.touchstone.core.data;

/**
 * The columns of a data set over the rows complete in every column, each centred by its
 * mean over those rows, kept column-major (n × p doubles), with the sample correlations
 * between them computed one pair or one tile of pairs at a time instead of as a p × p
 * matrix. This is what a search over many variables needs when only a small part of the
 * matrix is ever read: memory O(n·p) instead of O(p²) (a 100,000-variable matrix would take
 * 80 GB).
 *
 * <p>Every value is bitwise the one {@link DataSet#covariance()} followed by
 * {@link CovarianceMatrix#correlation()} gives: the same centring ({@link Covariances}), and
 * each cross product summed in the order of {@link CrossProduct}'s kernel (rows in
 * quadruples, the four products of a quadruple added left to right before joining the
 * running sum, the remaining rows one by one), then divided by n − 1 and by the product of
 * the two standard deviations. Java's floating-point arithmetic is strict, so equal
 * operations in equal order give equal bits; {@code CentredColumnsTest} checks it. A caller
 * can therefore take a decision from these values that is exactly the decision it would
 * take from the matrix.
 *
 * <p>{@link #correlationTile} packs the columns of the tile into rows (Goto and van de Geijn
 * 2008, "Anatomy of high-performance matrix multiplication", ACM TOMS 34(3)) and sweeps them
 * with the same loop shape as {@link CrossProduct}, which C2 vectorises. Immutable and
 * thread-safe; the tile method writes only into the caller's arrays.
 */
public final class CentredColumns {

    /** Rows per panel in a tile: with 256 columns a panel of 512 kB stays in the level-2 cache. */
    private static final int ROW_PANEL = CrossProduct.ROW_PANEL;

    private final double[][] columns;
    private final double[] sd;
    private final int rows;
    private final double divisor;

    private CentredColumns(double[][] columns, int rows) {
        this.columns = columns;
        this.rows = rows;
        this.divisor = rows > 1 ? rows - 1 : 1;
        this.sd = new double[columns.length];
        for (int j = 0; j < columns.length; j++) {
            sd[j] = Math.sqrt(crossProduct(columns[j], columns[j]) / divisor);
        }
    }

    /** The centred columns of {@code data} over its rows complete in every column; discrete columns enter with their codes. */
    public static CentredColumns of(DataSet data) {
        int p = data.columns();
        int[] keep = data.completeRows();
        boolean all = keep.length == data.rows();
        double[][] cols = new double[p][];
        for (int j = 0; j < p; j++) {
            double[] v = Covariances.asDoubles(data, j);
            double mu = Covariances.mean(v, keep);
            double[] c = new double[keep.length];
            for (int k = 0; k < c.length; k++) {
                c[k] = v[all ? k : keep[k]] - mu;
            }
            cols[j] = c;
        }
        return new CentredColumns(cols, keep.length);
    }

    /** The number of columns. */
    public int dimension() {
        return columns.length;
    }

    /** The number of rows the columns were centred over (those complete in every column). */
    public int sampleSize() {
        return rows;
    }

    /** The sample correlation of columns i and j (1 when i = j), bitwise that of the correlation matrix. */
    public double correlation(int i, int j) {
        if (i == j) {
            return 1.0;
        }
        double v = crossProduct(columns[i], columns[j]) / divisor;
        return v / (sd[i] * sd[j]);
    }

    /**
     * The correlations of the columns {@code [i0, i1)} with the columns {@code [j0, j1)}:
     * {@code out[(i − i0)·(j1 − j0) + (j − j0)]}, 1 where i = j. {@code panel} is scratch of at
     * least {@code min(n, 256)} rows of {@code j1 − j0} entries, and {@code sums} of
     * {@code (i1 − i0)·(j1 − j0)} entries (both reused between calls by one thread).
     */
    public void correlationTile(int i0, int i1, int j0, int j1, double[][] panel, double[] sums, double[] out) {
        int width = j1 - j0;
        int cells = (i1 - i0) * width;
        java.util.Arrays.fill(sums, 0, cells, 0.0);
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
                accumulate(columns[i], panel, pc, pe, sums, (i - i0) * width, width);
            }
        }
        for (int i = i0; i < i1; i++) {
            int row = (i - i0) * width;
            for (int j = j0; j < j1; j++) {
                double v = sums[row + j - j0] / divisor;
                out[row + j - j0] = i == j ? 1.0 : v / (sd[i] * sd[j]);
            }
        }
    }

    /**
     * Adds rows [pc, pe) of column a times the packed panel into {@code c[offset … offset + width)},
     * in {@link CrossProduct}'s order: four rows at once, their products summed left to right.
     */
    private static void accumulate(double[] a, double[][] panel, int pc, int pe, double[] c, int offset, int width) {
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

    /** The sum of a[r]·b[r] in {@link CrossProduct}'s order (see {@link #accumulate}). */
    private static double crossProduct(double[] a, double[] b) {
        int n = a.length;
        double c = 0;
        int r = 0;
        for (; r + 4 <= n; r += 4) {
            c += a[r] * b[r] + a[r + 1] * b[r + 1] + a[r + 2] * b[r + 2] + a[r + 3] * b[r + 3];
        }
        for (; r < n; r++) {
            c += a[r] * b[r];
        }
        return c;
    }
}
