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
 * <p>Tiles of pairs go through a {@link TileWorker}: a register-blocked kernel on the Vector
 * API when the JVM has its incubator module, a plain blocked loop otherwise (see
 * {@link TileKernel}; Goto and van de Geijn 2008, "Anatomy of high-performance matrix
 * multiplication", ACM TOMS 34(3)). Both keep the summation order above, so the choice never
 * changes a value. Immutable and thread-safe; a worker holds scratch and serves one thread.
 */
public final class CentredColumns {

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
        return correlation(crossProduct(columns[i], columns[j]), i, j);
    }

    /**
     * The correlation of columns i and j from their cross product (1 when i = j): the one
     * formula of {@link #correlation(int, int)} and of the tiles, so that both agree bitwise.
     */
    private double correlation(double crossProduct, int i, int j) {
        return i == j ? 1.0 : crossProduct / divisor / (sd[i] * sd[j]);
    }

    /** A new worker for tiles of correlations, with its own scratch; use one per thread. */
    public TileWorker tileWorker() {
        return new TileWorker(TileKernel.create());
    }

    /** A worker on a given kernel, so that tests can check each kernel. */
    TileWorker tileWorker(TileKernel kernel) {
        return new TileWorker(kernel);
    }

    /**
     * Which tile kernel {@link #tileWorker()} uses in this JVM: {@code "vector-N"} (the Vector
     * API with N-bit vectors, when the JVM runs with {@code --add-modules jdk.incubator.vector})
     * or {@code "blocked-loop"}.
     */
    public static String tileKernel() {
        return TileKernel.vectorAvailable() ? "vector-" + VectorTileKernel.vectorBits() : "blocked-loop";
    }

    /**
     * Computes tiles of correlations of these columns with a {@link TileKernel} (the Vector API's
     * register-blocked one when the JVM has its module, the plain blocked loop otherwise; both
     * give bitwise the same values). Holds scratch, so one per thread.
     */
    public final class TileWorker {
        private final TileKernel kernel;
        private double[] sums = new double[0];

        private TileWorker(TileKernel kernel) {
            this.kernel = kernel;
        }

        /**
         * The correlations of the columns {@code [i0, i1)} with the columns {@code [j0, j1)}:
         * {@code out[(i − i0)·(j1 − j0) + (j − j0)]}, 1 where i = j.
         */
        public void correlations(int i0, int i1, int j0, int j1, double[] out) {
            int width = j1 - j0;
            int cells = (i1 - i0) * width;
            if (sums.length < cells) {
                sums = new double[cells];
            }
            kernel.crossProducts(columns, rows, i0, i1, j0, j1, sums);
            for (int i = i0; i < i1; i++) {
                int row = (i - i0) * width;
                for (int j = j0; j < j1; j++) {
                    out[row + j - j0] = correlation(sums[row + j - j0], i, j);
                }
            }
        }
    }

    /** The sum of a[r]·b[r] in {@link CrossProduct}'s order. */
    private static double crossProduct(double[] a, double[] b) {
        return TileKernel.crossProduct(a, b, 0, a.length, 0.0);
    }
}
