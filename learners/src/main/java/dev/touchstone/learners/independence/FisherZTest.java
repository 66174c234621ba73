package dev.touchstone.learners.independence;

import dev.touchstone.core.data.CentredColumns;
import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.numbers.gamma.Erfc;

import java.util.Arrays;

/**
 * Fisher's z test of zero partial correlation for (approximately) Gaussian data, on a
 * correlation matrix computed once and shared: z = ½ ln((1 + r)/(1 − r)) √(n − |S| − 3),
 * two-sided p-value 2(1 − Φ(|z|)) (Kalisch and Bühlmann 2007, "Estimating high-dimensional
 * directed acyclic graphs with the PC-algorithm", JMLR 8).
 *
 * <p>{@link #independent} compares |r| with a threshold precomputed for each conditioning
 * size, tanh(Φ⁻¹(1 − α/2) / √(n − |S| − 3)), which is the same decision as p &gt; α
 * without a logarithm or an error function. A call with |S| ≤ 3 allocates nothing and costs
 * a few dozen floating-point operations (see {@link PartialCorrelation}); {@link #pValue}
 * adds a logarithm and Commons Numbers' {@code Erfc}.
 *
 * <p>Declared choices: when x or y is a linear function of S (zero residual variance) the
 * partial correlation is undefined and the test accepts independence (p = 1), since the
 * variable carries no further information given S; when n − |S| − 3 ≤ 0 there are too few
 * rows to test and independence is accepted as well.
 *
 * <p>Two ways to hold the correlations, with one switch point ({@link #DENSE_LIMIT}): up to
 * that many variables the p × p matrix, shared through the data set; above it no matrix at
 * all, but the centred columns ({@link CentredColumns}, n × p doubles) from which
 * {@link #levelZero} screens every pair tile by tile, keeping the correlations of the pairs
 * that test dependent, and from which any other pair a conditional test needs is computed
 * when asked. Both give bitwise the same correlations, hence the same decisions; the matrix
 * is faster when it fits, since every later read is one array access. Thread-safe; the
 * decisions are a pure function of the arguments (level 0 only fills a cache).
 */
public final class FisherZTest implements IndependenceTest {

    /**
     * The most variables for which {@link #of(DataSet, double)} builds the p × p correlation
     * matrix (128 MB at this size, and about three times that while the covariance is formed);
     * above it the test works from the centred columns.
     */
    public static final int DENSE_LIMIT = 4096;

    private static final double INV_SQRT2 = 0.7071067811865476;
    /** Columns per tile of level 0: a 128 × 256 tile of sums (256 kB) stays in the level-2 cache. */
    private static final int TILE_COLUMNS = 256;
    private static final int TILE_ROWS = 128;

    private final double[] correlation;
    private final ScreenedCorrelations screened;
    private final int p;
    private final long n;
    private final double alpha;
    private final double[] threshold;

    private FisherZTest(double[] correlation, ScreenedCorrelations screened, int p, long n, double alpha) {
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("alpha must be in (0, 1), got " + alpha);
        }
        this.correlation = correlation;
        this.screened = screened;
        this.p = p;
        this.n = n;
        this.alpha = alpha;
        double c = new NormalDistribution(0, 1).inverseCumulativeProbability(1 - alpha / 2);
        int sizes = (int) Math.min(p + 1L, Math.max(0, n));
        this.threshold = new double[Math.max(sizes, 1)];
        for (int k = 0; k < threshold.length; k++) {
            double dof = n - k - 3.0;
            threshold[k] = dof > 0 ? Math.tanh(c / Math.sqrt(dof)) : Double.POSITIVE_INFINITY;
        }
    }

    /**
     * The test on the data set's correlations over the rows with no missing cell: the shared
     * matrix up to {@link #DENSE_LIMIT} variables, the centred columns above.
     */
    public static FisherZTest of(DataSet data, double alpha) {
        if (data.columns() > DENSE_LIMIT) {
            return fromColumns(data, alpha);
        }
        CovarianceMatrix cov = data.covariance();
        double[] corr = data.shared(CorrelationKey.INSTANCE, d -> cov.correlation().toArray());
        return new FisherZTest(corr, null, cov.dimension(), cov.sampleSize(), alpha);
    }

    /**
     * The test working from the data set's centred columns (shared through the data set) with
     * no p × p matrix, whatever the number of variables: what {@link #of(DataSet, double)}
     * does above {@link #DENSE_LIMIT}, open to callers that compare the two.
     */
    public static FisherZTest fromColumns(DataSet data, double alpha) {
        CentredColumns columns = data.shared(ColumnsKey.INSTANCE, CentredColumns::of);
        return new FisherZTest(null, new ScreenedCorrelations(columns), columns.dimension(), columns.sampleSize(),
                alpha);
    }

    /** The test on a covariance matrix estimated from {@link CovarianceMatrix#sampleSize()} rows. */
    public static FisherZTest of(CovarianceMatrix cov, double alpha) {
        return new FisherZTest(cov.correlation().toArray(), null, cov.dimension(), cov.sampleSize(), alpha);
    }

    @Override
    public int variables() {
        return p;
    }

    @Override
    public double alpha() {
        return alpha;
    }

    /** The sample size the correlations were estimated from. */
    public long sampleSize() {
        return n;
    }

    /** The sample partial correlation of x and y given z (NaN when x or y is determined by z). */
    public double partialCorrelation(int x, int y, int[] z) {
        return partial(x, y, z, z.length);
    }

    @Override
    public double pValue(int x, int y, int[] z) {
        return pValue(partialCorrelation(x, y, z), n, z.length);
    }

    @Override
    public boolean independent(int x, int y, int[] z) {
        int k = z.length;
        if (k >= threshold.length) {
            return true;
        }
        double r = partial(x, y, z, k);
        // NaN (undefined partial correlation) fails the comparison and so counts as independent.
        return !(Math.abs(r) >= threshold[k]);
    }

    @Override
    public String name() {
        return "fisher-z";
    }

    /**
     * Level 0 of the adjacency search for every pair at once: the neighbours of each variable
     * (ascending) among the variables it tests dependent on given the empty set, exactly the
     * pairs for which {@code independent(x, y, new int[0])} is false. Without a matrix the
     * correlations are computed in tiles of 128 × 256 pairs from the centred columns and only
     * those of the pairs kept are stored, for the conditional tests that follow. Cost:
     * n·p²/2 multiply-adds, memory O(n·p + kept pairs).
     *
     * @param threads  how many threads to use (1: the calling thread only)
     * @param deadline called before every tile; what it throws stops the screen and is rethrown
     */
    public int[][] levelZero(int threads, Runnable deadline) {
        int blocks = (p + TILE_COLUMNS - 1) / TILE_COLUMNS;
        // Tile t covers the columns of block jb and the rows [i0, i0 + 128) that start below the block's end.
        int tiles = 0;
        for (int jb = 0; jb < blocks; jb++) {
            tiles += (Math.min(p, (jb + 1) * TILE_COLUMNS) + TILE_ROWS - 1) / TILE_ROWS;
        }
        int[] tileBlock = new int[tiles];
        int[] tileRow = new int[tiles];
        int t = 0;
        for (int jb = 0; jb < blocks; jb++) {
            int end = Math.min(p, (jb + 1) * TILE_COLUMNS);
            for (int i0 = 0; i0 < end; i0 += TILE_ROWS) {
                tileBlock[t] = jb;
                tileRow[t] = i0;
                t++;
            }
        }
        Kept[] found = new Kept[tiles];
        dev.touchstone.core.learner.ParallelLoop.run(threads, tiles, 1, () -> {
            double[] scratch = new double[TILE_ROWS * TILE_COLUMNS];
            CentredColumns.TileWorker worker = screened == null ? null : screened.columns().tileWorker();
            return k -> {
                deadline.run();
                found[k] = screenTile(tileRow[k], tileBlock[k] * TILE_COLUMNS, worker, scratch);
            };
        });
        return collect(found);
    }

    /** The pairs i < j of one tile that test dependent given ∅, with their correlations. */
    private Kept screenTile(int i0, int j0, CentredColumns.TileWorker worker, double[] r) {
        int j1 = Math.min(p, j0 + TILE_COLUMNS);
        int i1 = Math.min(j1, i0 + TILE_ROWS);
        int width = j1 - j0;
        if (worker != null) {
            worker.correlations(i0, i1, j0, j1, r);
        } else {
            for (int i = i0; i < i1; i++) {
                System.arraycopy(correlation, i * p + j0, r, (i - i0) * width, width);
            }
        }
        Kept out = new Kept();
        double t0 = threshold[0];
        for (int i = i0; i < i1; i++) {
            int row = (i - i0) * width;
            for (int j = Math.max(j0, i + 1); j < j1; j++) {
                double rij = r[row + j - j0];
                // The decision of independent(i, j, ∅): the k = 0 partial correlation on a unit diagonal.
                if (Math.abs(PartialCorrelation.unconditional(rij)) >= t0) {
                    out.add(i, j, rij);
                }
            }
        }
        return out;
    }

    /** Each variable's kept partners in ascending order; remembers their correlations when there is no matrix. */
    private int[][] collect(Kept[] found) {
        int[] degree = new int[p];
        for (Kept k : found) {
            for (int e = 0; e < k.size; e++) {
                degree[k.a[e]]++;
                degree[k.b[e]]++;
            }
        }
        int[][] partners = new int[p][];
        double[][] values = screened == null ? null : new double[p][];
        for (int v = 0; v < p; v++) {
            partners[v] = new int[degree[v]];
            if (values != null) {
                values[v] = new double[degree[v]];
            }
        }
        int[] fill = new int[p];
        for (Kept k : found) {
            for (int e = 0; e < k.size; e++) {
                int a = k.a[e];
                int b = k.b[e];
                partners[a][fill[a]] = b;
                partners[b][fill[b]] = a;
                if (values != null) {
                    values[a][fill[a]] = k.r[e];
                    values[b][fill[b]] = k.r[e];
                }
                fill[a]++;
                fill[b]++;
            }
        }
        for (int v = 0; v < p; v++) {
            sortTogether(partners[v], values == null ? null : values[v]);
        }
        if (screened != null) {
            screened.keep(partners, values);
        }
        return partners;
    }

    /** Sorts {@code keys} ascending, permuting {@code values} (if any) alike. */
    private static void sortTogether(int[] keys, double[] values) {
        boolean sorted = true;
        for (int i = 1; i < keys.length && sorted; i++) {
            sorted = keys[i - 1] < keys[i];
        }
        if (sorted) {
            return;
        }
        Integer[] order = new Integer[keys.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (u, w) -> Integer.compare(keys[u], keys[w]));
        int[] k = keys.clone();
        for (int i = 0; i < order.length; i++) {
            keys[i] = k[order[i]];
        }
        if (values != null) {
            double[] v = values.clone();
            for (int i = 0; i < order.length; i++) {
                values[i] = v[order[i]];
            }
        }
    }

    /** The partial correlation from the matrix, or from the (k + 2)² correlations gathered when there is none. */
    private double partial(int x, int y, int[] z, int k) {
        if (correlation != null) {
            return PartialCorrelation.of(correlation, p, x, y, z, k);
        }
        int q = k + 2;
        Gathered g = GATHERED.get().ensure(q);
        int[] idx = g.index;
        idx[0] = x;
        idx[1] = y;
        System.arraycopy(z, 0, idx, 2, k);
        double[] m = g.matrix;
        for (int a = 0; a < q; a++) {
            m[a * q + a] = 1.0;
            for (int b = a + 1; b < q; b++) {
                double v = screened.get(idx[a], idx[b]);
                m[a * q + b] = v;
                m[b * q + a] = v;
            }
        }
        return PartialCorrelation.of(m, q, 0, 1, g.positions, k);
    }

    private static final ThreadLocal<Gathered> GATHERED = ThreadLocal.withInitial(Gathered::new);

    /** Per-thread scratch for a gathered (k + 2)² matrix; positions[i] = i + 2 names z[i]'s row. */
    private static final class Gathered {
        int[] index = new int[0];
        int[] positions = new int[0];
        double[] matrix = new double[0];

        Gathered ensure(int q) {
            // Larger than needed is fine: the matrix is read with stride q.
            if (index.length < q) {
                index = new int[q];
                positions = new int[q];
                for (int i = 0; i < q; i++) {
                    positions[i] = i + 2;
                }
                matrix = new double[q * q];
            }
            return this;
        }
    }

    /** The pairs one tile kept, as parallel growable arrays. */
    private static final class Kept {
        int[] a = new int[16];
        int[] b = new int[16];
        double[] r = new double[16];
        int size;

        void add(int i, int j, double v) {
            if (size == a.length) {
                a = Arrays.copyOf(a, 2 * size);
                b = Arrays.copyOf(b, 2 * size);
                r = Arrays.copyOf(r, 2 * size);
            }
            a[size] = i;
            b[size] = j;
            r[size] = v;
            size++;
        }
    }

    /** Fisher's z statistic for a partial correlation r from n rows given k variables (NaN if n − k − 3 ≤ 0). */
    public static double statistic(double r, long n, int k) {
        double dof = n - k - 3.0;
        if (!(dof > 0)) {
            return Double.NaN;
        }
        return 0.5 * Math.log((1 + r) / (1 - r)) * Math.sqrt(dof);
    }

    /** The two-sided p-value of Fisher's z for partial correlation r (1 when undefined). */
    static double pValue(double r, long n, int k) {
        if (Double.isNaN(r)) {
            return 1.0;
        }
        double z = statistic(r, n, k);
        if (Double.isNaN(z)) {
            return 1.0;
        }
        // Commons Numbers' erfc (rational approximations, a few dozen flops) rather than Commons Math's
        // incomplete-gamma series, which cost about 10x more; the test checks it against the latter.
        return Erfc.value(Math.abs(z) * INV_SQRT2);
    }

    private enum CorrelationKey { INSTANCE }

    private enum ColumnsKey { INSTANCE }
}
