package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;

import java.util.Arrays;
import java.util.List;

/**
 * The conditional Gaussian BIC for mixed continuous and discrete data (Andrews, Ramsey and
 * Cooper 2018, "Scoring Bayesian networks of mixed variables", International Journal of
 * Data Science and Analytics 6). Given the discrete parents D, the continuous variables are
 * jointly Gaussian with a mean and covariance per configuration of D; the local terms are
 * ratios of such cell-wise Gaussian (and multinomial) likelihoods:
 *
 * <ul>
 *   <li>continuous Y with continuous parents C: ln L = Σ_cells of D [ℓ(Y ∪ C) − ℓ(C)], the
 *       per-cell least-squares regression of Y on C; |C| + 2 parameters per cell;</li>
 *   <li>discrete Y: ln L = Σ_cells of (D, Y) [N ln(N / N_D) + ℓ(C)] − Σ_cells of D ℓ(C),
 *       the mixture trick of the paper (p(Y | C, D) = p(Y, C | D) / p(C | D)); per cell of D,
 *       (observed categories − 1) · (1 + |C|(|C| + 3)/2) parameters;</li>
 * </ul>
 *
 * where ℓ(V) = −m/2 · (|V| ln 2π + ln det S_V + |V|) is the maximised Gaussian
 * log-likelihood of a cell's m rows with maximum-likelihood covariance S_V. Then
 * score = ln L − c · (parameters)/2 · ln n. Only observed cells are counted.
 *
 * <p><b>Small cells</b> (our choice, stated because the paper leaves room): a cell with
 * m ≤ |V| + 1 rows, or whose covariance is singular, is scored under the covariance of all
 * rows (the pooled maximum-likelihood covariance) and the cell's own mean, so that no cell
 * can reach an unbounded likelihood. With all variables continuous the score equals
 * {@link BicScore}'s; with all discrete it is the multinomial BIC.
 *
 * <p>Rows with a missing cell anywhere are left out (list-wise deletion). <b>Cost</b>
 * O(n log n + n d²) per call with d = |C| + 1. Thread-safe.
 */
public final class ConditionalGaussianScore implements LocalScore {

    private static final double LOG_2PI = Math.log(2 * Math.PI);

    private final List<String> names;
    private final boolean[] discrete;
    private final int[][] codes;
    private final double[][] values;
    private final int[] cardinality;
    private final int rows;
    private final double[] pooled;
    private final int p;
    private final double penaltyPerParameter;
    private final double penaltyMultiplier;
    private final ThreadLocal<long[]> keys;

    private ConditionalGaussianScore(DataSet data, double penaltyMultiplier) {
        this.names = data.names();
        this.p = data.columns();
        this.rows = data.rows();
        if (rows < 2) {
            throw new IllegalArgumentException("the conditional Gaussian score needs at least 2 complete rows, got " + rows);
        }
        this.discrete = new boolean[p];
        this.codes = new int[p][];
        this.values = new double[p][];
        this.cardinality = new int[p];
        for (int j = 0; j < p; j++) {
            discrete[j] = data.isDiscrete(j);
            if (discrete[j]) {
                codes[j] = data.discrete(j);
                cardinality[j] = data.variable(j).cardinality();
            } else {
                values[j] = data.continuous(j);
            }
        }
        double[] c = data.covariance().toArray();
        double mle = (rows - 1.0) / rows;
        for (int i = 0; i < c.length; i++) {
            c[i] *= mle;
        }
        this.pooled = c;
        for (int j = 0; j < p; j++) {
            if (!discrete[j] && !(pooled[j * p + j] > 0)) {
                throw new IllegalArgumentException("variable '" + names.get(j) + "' is constant; the conditional"
                        + " Gaussian score needs positive variances");
            }
        }
        this.penaltyMultiplier = penaltyMultiplier;
        this.penaltyPerParameter = penaltyMultiplier * 0.5 * Math.log(rows);
        this.keys = ThreadLocal.withInitial(() -> new long[rows]);
    }

    /**
     * The conditional Gaussian BIC of these (mixed, continuous or discrete) data with penalty multiplier c.
     *
     * @throws IllegalArgumentException for c ≤ 0, fewer than 2 complete rows or a constant continuous column
     */
    public static ConditionalGaussianScore of(DataSet data, double penaltyMultiplier) {
        if (!(penaltyMultiplier > 0) || Double.isInfinite(penaltyMultiplier)) {
            throw new IllegalArgumentException("the penalty multiplier must be positive and finite, got "
                    + penaltyMultiplier);
        }
        return new ConditionalGaussianScore(data.completeCases(), penaltyMultiplier);
    }

    @Override
    public List<String> names() {
        return names;
    }

    @Override
    public double localScore(int node, int[] parents) {
        int nd = 0;
        for (int pa : parents) {
            if (discrete[pa]) {
                nd++;
            }
        }
        int[] disc = new int[nd];
        int[] cont = new int[parents.length - nd];
        int a = 0;
        int b = 0;
        for (int pa : parents) {
            if (discrete[pa]) {
                disc[a++] = pa;
            } else {
                cont[b++] = pa;
            }
        }
        int[] contWithY = Arrays.copyOf(cont, cont.length + 1);
        contWithY[cont.length] = node;
        long[] sorted = keys.get();
        groupRows(disc, discrete[node] ? node : -1, sorted);
        double logLik = 0;
        double parameters = 0;
        int i = 0;
        while (i < rows) {
            long config = sorted[i] / ((long) rows * (discrete[node] ? cardinality[node] : 1));
            int start = i;
            while (i < rows && sorted[i] / ((long) rows * (discrete[node] ? cardinality[node] : 1)) == config) {
                i++;
            }
            if (discrete[node]) {
                int nD = i - start;
                logLik -= gaussian(cont, sorted, start, i, cont.length + 1);
                int cells = 0;
                int j = start;
                while (j < i) {
                    long cell = sorted[j] / rows;
                    int cellStart = j;
                    while (j < i && sorted[j] / rows == cell) {
                        j++;
                    }
                    int m = j - cellStart;
                    cells++;
                    logLik += m * Math.log((double) m / nD) + gaussian(cont, sorted, cellStart, j, cont.length + 1);
                }
                int c = cont.length;
                parameters += (cells - 1) * (1.0 + c * (c + 3) / 2.0);
            } else {
                int d = cont.length + 1;
                logLik += gaussian(contWithY, sorted, start, i, d) - gaussian(cont, sorted, start, i, d);
                parameters += cont.length + 2;
            }
        }
        return logLik - penaltyPerParameter * parameters;
    }

    /**
     * Fills {@code out} with one key per row, sorted: (configuration of D, then Y's code when
     * {@code discreteChild} ≥ 0) · rows + row index.
     */
    private void groupRows(int[] disc, int discreteChild, long[] out) {
        for (int r = 0; r < rows; r++) {
            long key = 0;
            for (int d : disc) {
                key = key * cardinality[d] + codes[d][r];
            }
            if (discreteChild >= 0) {
                key = key * cardinality[discreteChild] + codes[discreteChild][r];
            }
            out[r] = key * rows + r;
        }
        Arrays.sort(out, 0, rows);
    }

    /**
     * The maximised Gaussian log-likelihood of the continuous variables {@code vars} over the
     * rows {@code sorted[from..to)} (row = key mod rows), falling back to the pooled covariance
     * for cells with at most {@code dimensionForFallback} rows or a singular covariance.
     */
    private double gaussian(int[] vars, long[] sorted, int from, int to, int dimensionForFallback) {
        int d = vars.length;
        int m = to - from;
        if (d == 0 || m == 0) {
            return 0;
        }
        double[] mean = new double[d];
        for (int t = from; t < to; t++) {
            int r = (int) (sorted[t] % rows);
            for (int u = 0; u < d; u++) {
                mean[u] += values[vars[u]][r];
            }
        }
        for (int u = 0; u < d; u++) {
            mean[u] /= m;
        }
        double[] s = new double[d * d];
        for (int t = from; t < to; t++) {
            int r = (int) (sorted[t] % rows);
            for (int u = 0; u < d; u++) {
                double xu = values[vars[u]][r] - mean[u];
                for (int v = 0; v <= u; v++) {
                    s[u * d + v] += xu * (values[vars[v]][r] - mean[v]);
                }
            }
        }
        for (int u = 0; u < d * d; u++) {
            s[u] /= m;
        }
        if (m > dimensionForFallback) {
            double[] l = s.clone();
            if (SmallCholesky.factor(l, d) == 0) {
                return -0.5 * m * (d * LOG_2PI + 2 * SmallCholesky.halfLogDet(l, d) + d);
            }
        }
        double[] l = new double[d * d];
        for (int u = 0; u < d; u++) {
            for (int v = 0; v <= u; v++) {
                l[u * d + v] = pooled[vars[u] * p + vars[v]];
            }
        }
        SmallCholesky.factor(l, d);
        // Σ over the cell's rows of (x − mean)ᵀ Σ⁻¹ (x − mean), with Σ = L Lᵀ the pooled covariance.
        double quad = 0;
        double[] z = new double[d];
        for (int t = from; t < to; t++) {
            int r = (int) (sorted[t] % rows);
            for (int u = 0; u < d; u++) {
                z[u] = values[vars[u]][r] - mean[u];
            }
            SmallCholesky.forward(l, d, z);
            for (int u = 0; u < d; u++) {
                quad += z[u] * z[u];
            }
        }
        return -0.5 * m * (d * LOG_2PI + 2 * SmallCholesky.halfLogDet(l, d)) - 0.5 * quad;
    }

    @Override
    public String describe() {
        return "conditional-gaussian-bic(penalty=" + penaltyMultiplier + ")";
    }
}
