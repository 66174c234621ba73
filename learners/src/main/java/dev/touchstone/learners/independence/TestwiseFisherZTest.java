package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;

/**
 * Fisher's z test with test-wise deletion: each test uses exactly the rows that are
 * complete for its own variables x, y and S, and computes their covariance afresh (Tu,
 * Zhang, Ackermann, Mohan, Kjellström and Zhang 2019, "Causal discovery in the presence of
 * missing data", AISTATS, PMLR 89; the statistic is that of Kalisch and Bühlmann 2007).
 *
 * <p>Cost O(n (|S| + 2)²) per test, against O(|S|³) for {@link FisherZTest} on a shared
 * covariance; use it only when the data have missing cells. Thread-safe: every call works
 * on arrays of its own.
 */
public final class TestwiseFisherZTest implements IndependenceTest {

    private final double[][] columns;
    private final int rows;
    private final double alpha;

    /** The test over the continuous columns of {@code data} (discrete columns enter with their codes). */
    public TestwiseFisherZTest(DataSet data, double alpha) {
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("alpha must be in (0, 1), got " + alpha);
        }
        this.rows = data.rows();
        this.columns = new double[data.columns()][];
        for (int j = 0; j < columns.length; j++) {
            if (data.isDiscrete(j)) {
                double[] c = new double[rows];
                for (int r = 0; r < rows; r++) {
                    c[r] = data.value(r, j);
                }
                columns[j] = c;
            } else {
                columns[j] = data.continuous(j);
            }
        }
        this.alpha = alpha;
    }

    @Override
    public int variables() {
        return columns.length;
    }

    @Override
    public double alpha() {
        return alpha;
    }

    @Override
    public double pValue(int x, int y, int[] z) {
        if (x > y) { // the same bits for (x, y) and (y, x): see IndependenceTest
            int t = x;
            x = y;
            y = t;
        }
        int k = z.length;
        int q = k + 2;
        double[][] cols = new double[q][];
        cols[0] = columns[x];
        cols[1] = columns[y];
        for (int i = 0; i < k; i++) {
            cols[i + 2] = columns[z[i]];
        }
        boolean[] keep = new boolean[rows];
        int used = 0;
        for (int r = 0; r < rows; r++) {
            boolean ok = true;
            for (int i = 0; i < q && ok; i++) {
                ok = !Double.isNaN(cols[i][r]);
            }
            keep[r] = ok;
            used += ok ? 1 : 0;
        }
        return pValueOnRows(cols, keep, used);
    }

    /**
     * Fisher's z p-value of columns 0 and 1 given columns 2 … of {@code cols}, over the rows
     * marked in {@code keep} ({@code used} of them): their covariance computed afresh, then
     * the partial correlation. 1 when too few rows remain.
     */
    static double pValueOnRows(double[][] cols, boolean[] keep, int used) {
        int q = cols.length;
        int k = q - 2;
        if (used - k - 3 <= 0) {
            return 1.0;
        }
        double[] mean = new double[q];
        for (int r = 0; r < keep.length; r++) {
            if (keep[r]) {
                for (int i = 0; i < q; i++) {
                    mean[i] += cols[i][r];
                }
            }
        }
        for (int i = 0; i < q; i++) {
            mean[i] /= used;
        }
        double[] cov = new double[q * q];
        for (int r = 0; r < keep.length; r++) {
            if (!keep[r]) {
                continue;
            }
            for (int i = 0; i < q; i++) {
                double di = cols[i][r] - mean[i];
                for (int j = 0; j <= i; j++) {
                    cov[i * q + j] += di * (cols[j][r] - mean[j]);
                }
            }
        }
        for (int i = 0; i < q; i++) {
            for (int j = 0; j < i; j++) {
                cov[j * q + i] = cov[i * q + j];
            }
        }
        int[] local = new int[k];
        for (int i = 0; i < k; i++) {
            local[i] = i + 2;
        }
        double r = PartialCorrelation.of(cov, q, 0, 1, local);
        return FisherZTest.pValue(r, used, k);
    }

    @Override
    public String name() {
        return "fisher-z";
    }
}
