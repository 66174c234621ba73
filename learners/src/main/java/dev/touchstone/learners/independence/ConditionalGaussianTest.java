package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import org.apache.commons.math3.special.Gamma;

import java.util.Arrays;

/**
 * The likelihood-ratio test of conditional independence for mixed continuous and discrete
 * data under the conditional Gaussian model (Andrews, Ramsey and Cooper 2018, "Scoring
 * Bayesian networks of mixed variables", International Journal of Data Science and
 * Analytics 6): the discrete variables of a set are multinomial and, within each cell of
 * their joint configuration, the continuous ones are multivariate Gaussian with the cell's
 * own mean and covariance.
 *
 * <p>With ℓ(A) the maximised log-likelihood of the variables A on the rows used, the
 * conditional log-likelihood of x given a set B is ℓ({x} ∪ B) − ℓ(B) (as in the paper), so
 * the statistic 2[ℓ(x | y, S) − ℓ(x | S)] = 2[ℓ(x, y, S) − ℓ(y, S) − ℓ(x, S) + ℓ(S)] is
 * symmetric in x and y; its degrees of freedom are the same combination of parameter
 * counts. With only continuous variables it reduces to −n ln(1 − r²) for the partial
 * correlation r (1 degree of freedom); with only discrete ones to G² on the tables of the
 * cells that occur.
 *
 * <p>Declared choices: parameters are counted for the cells that occur in the rows used
 * (cells − 1 multinomial parameters, and |C| means plus |C|(|C|+1)/2 covariances per cell
 * with a Gaussian part); a cell with at most |C| rows, or a singular covariance, has no
 * Gaussian part (its continuous likelihood and parameters are left out). A negative
 * statistic (possible only through such cells) is set to 0, and zero or negative degrees of
 * freedom accept independence (p = 1). Each test uses the rows complete for its own
 * variables (test-wise deletion, Tu et al. 2019).
 *
 * <p>Cost O(n log n + n |C|²) per test for the four likelihoods. Thread-safe.
 */
public final class ConditionalGaussianTest implements IndependenceTest {

    private static final double LOG_2PI = Math.log(2 * Math.PI);

    private final DataSet data;
    private final double alpha;

    public ConditionalGaussianTest(DataSet data, double alpha) {
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("alpha must be in (0, 1), got " + alpha);
        }
        this.data = data;
        this.alpha = alpha;
    }

    /** The statistic, degrees of freedom, rows used and p-value of one test. */
    public record Result(double statistic, int degreesOfFreedom, int rowsUsed, double pValue) { }

    @Override
    public int variables() {
        return data.columns();
    }

    @Override
    public double alpha() {
        return alpha;
    }

    @Override
    public double pValue(int x, int y, int[] z) {
        return evaluate(x, y, z).pValue();
    }

    @Override
    public String name() {
        return IndependenceTests.CONDITIONAL_GAUSSIAN;
    }

    /** The statistic, degrees of freedom, rows used and p-value of one test. */
    public Result evaluate(int x, int y, int[] z) {
        if (x > y) { // the same bits for (x, y) and (y, x): see IndependenceTest
            int t = x;
            x = y;
            y = t;
        }
        int[] all = new int[z.length + 2];
        all[0] = x;
        all[1] = y;
        System.arraycopy(z, 0, all, 2, z.length);
        int[] rows = data.rowsCompleteIn(all);
        int[] xs = prepend(x, z);
        int[] ys = prepend(y, z);
        Fit full = fit(all, rows);
        Fit withoutX = fit(ys, rows);
        Fit withoutY = fit(xs, rows);
        Fit cond = fit(z, rows);
        double stat = 2 * (full.logLik - withoutX.logLik - withoutY.logLik + cond.logLik);
        int dof = full.params - withoutX.params - withoutY.params + cond.params;
        stat = Math.max(stat, 0);
        double pv = dof <= 0 ? 1.0 : Gamma.regularizedGammaQ(dof / 2.0, stat / 2.0);
        return new Result(stat, Math.max(dof, 0), rows.length, pv);
    }

    private static int[] prepend(int v, int[] z) {
        int[] out = new int[z.length + 1];
        out[0] = v;
        System.arraycopy(z, 0, out, 1, z.length);
        return out;
    }

    private record Fit(double logLik, int params) { }

    /** The maximised conditional Gaussian log-likelihood of these variables on these rows. */
    private Fit fit(int[] vars, int[] rows) {
        int n = rows.length;
        if (vars.length == 0 || n == 0) {
            return new Fit(0, 0);
        }
        int nd = 0;
        for (int v : vars) {
            if (data.isDiscrete(v)) {
                nd++;
            }
        }
        int[] disc = new int[nd];
        int[] cont = new int[vars.length - nd];
        int a = 0;
        int b = 0;
        for (int v : vars) {
            if (data.isDiscrete(v)) {
                disc[a++] = v;
            } else {
                cont[b++] = v;
            }
        }
        // Cells: ranks of the discrete configurations that occur.
        long[] key = new long[n];
        for (int i = 0; i < n; i++) {
            long k = 0;
            for (int v : disc) {
                k = k * data.variable(v).cardinality() + data.discrete(v)[rows[i]];
            }
            key[i] = k;
        }
        long[] distinct = key.clone();
        Arrays.sort(distinct);
        int cells = 0;
        for (int i = 0; i < n; i++) {
            if (i == 0 || distinct[i] != distinct[i - 1]) {
                distinct[cells++] = distinct[i];
            }
        }
        int[] cellOf = new int[n];
        int[] count = new int[cells];
        for (int i = 0; i < n; i++) {
            int c = Arrays.binarySearch(distinct, 0, cells, key[i]);
            cellOf[i] = c;
            count[c]++;
        }
        double logLik = 0;
        int params = cells - 1;
        for (int c = 0; c < cells; c++) {
            logLik += count[c] * Math.log((double) count[c] / n);
        }
        int q = cont.length;
        if (q == 0) {
            return new Fit(logLik, params);
        }
        double[][] cols = new double[q][];
        for (int j = 0; j < q; j++) {
            cols[j] = data.continuous(cont[j]);
        }
        double[] mean = new double[cells * q];
        for (int i = 0; i < n; i++) {
            int c = cellOf[i];
            for (int j = 0; j < q; j++) {
                mean[c * q + j] += cols[j][rows[i]];
            }
        }
        for (int c = 0; c < cells; c++) {
            for (int j = 0; j < q; j++) {
                mean[c * q + j] /= count[c];
            }
        }
        double[] cov = new double[cells * q * q];
        for (int i = 0; i < n; i++) {
            int c = cellOf[i];
            int base = c * q * q;
            for (int j = 0; j < q; j++) {
                double dj = cols[j][rows[i]] - mean[c * q + j];
                for (int l = 0; l <= j; l++) {
                    cov[base + j * q + l] += dj * (cols[l][rows[i]] - mean[c * q + l]);
                }
            }
        }
        int gaussianParams = q + q * (q + 1) / 2;
        for (int c = 0; c < cells; c++) {
            if (count[c] <= q) {
                continue;
            }
            double logDet = logDetLower(cov, c * q * q, q, count[c]);
            if (Double.isNaN(logDet)) {
                continue;
            }
            logLik += -0.5 * count[c] * (logDet + q * (1 + LOG_2PI));
            params += gaussianParams;
        }
        return new Fit(logLik, params);
    }

    /** ln det of the ML covariance (lower triangle of the scatter at base, divided by n), NaN if singular. */
    private static double logDetLower(double[] scatter, int base, int q, int n) {
        double[] l = new double[q * q];
        double logDet = 0;
        for (int i = 0; i < q; i++) {
            for (int j = 0; j <= i; j++) {
                double s = scatter[base + i * q + j] / n;
                for (int t = 0; t < j; t++) {
                    s -= l[i * q + t] * l[j * q + t];
                }
                if (i == j) {
                    double diag = scatter[base + i * q + i] / n;
                    if (!(s > PartialCorrelation.RELATIVE_PIVOT * diag)) {
                        return Double.NaN;
                    }
                    l[i * q + i] = Math.sqrt(s);
                    logDet += Math.log(s);
                } else {
                    l[i * q + j] = s / l[j * q + j];
                }
            }
        }
        return logDet;
    }
}
