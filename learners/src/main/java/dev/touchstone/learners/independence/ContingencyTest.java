package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.param.Worded;

import org.apache.commons.math3.special.Gamma;

import java.util.Arrays;

/**
 * The G² (likelihood-ratio) and Pearson χ² tests of conditional independence for discrete
 * data, on the contingency table of x and y within each configuration (stratum) of S
 * (Agresti 2002, "Categorical data analysis", §3.2 and §6.3; Spirtes, Glymour and Scheines
 * 2000, §5.4.2).
 *
 * <p>Degrees of freedom, one of two declared rules ({@link DegreesOfFreedom}). {@code REDUCED}
 * (the default; common practice for sparse tables, no single source): each stratum with
 * data contributes (r − 1)(c − 1), where r and c count only the rows and columns of that
 * stratum's x × y table that are not empty; strata without rows contribute nothing. So an
 * empty row or column of a stratum's table subtracts its (c − 1) or (r − 1) cells.
 * {@code TEXTBOOK}: (|X| − 1)(|Y| − 1) · ∏ |Z| over all configurations of S, observed or
 * not, the df of the conditional-independence test in a three-way table (Agresti 2002, §6.3)
 * extended to several conditioning variables. When the total is zero there is nothing to test
 * and independence is accepted (p = 1). The p-value is the upper tail of the χ² distribution
 * with those degrees of freedom.
 *
 * <p>Missing values (code −1) are left out test by test: each test counts only the rows
 * complete for its own variables (test-wise deletion, Tu et al. 2019). For list-wise
 * deletion, give it the complete rows only.
 *
 * <p>Cost O(n) to build the table when the strata fit a direct index (at most about 4n
 * cells), O(n log n) otherwise (strata keys are sorted), plus O(cells) to evaluate.
 * Thread-safe: each call allocates its own table.
 */
public final class ContingencyTest implements IndependenceTest {

    /** The statistic of a contingency test. */
    public enum Statistic implements Worded {
        /** The likelihood-ratio statistic G² = 2 Σ O ln(O / E). */
        G_SQUARE,
        /** Pearson's statistic χ² = Σ (O − E)² / E. */
        CHI_SQUARE
    }

    /** How the degrees of freedom are counted (see the class comment). */
    public enum DegreesOfFreedom implements Worded {
        /** Σ over strata with data of (non-empty rows − 1)(non-empty columns − 1). */
        REDUCED,
        /** (|X| − 1)(|Y| − 1) times the number of configurations of the conditioning set. */
        TEXTBOOK
    }

    /** A statistic with its degrees of freedom and the number of rows used. */
    public record Result(double statistic, int degreesOfFreedom, int rowsUsed, double pValue) { }

    private final int[][] codes;
    private final int[] cardinality;
    private final int rows;
    private final Statistic statistic;
    private final double alpha;
    private final DegreesOfFreedom degreesOfFreedom;

    /** A test with the reduced degrees of freedom. */
    public ContingencyTest(DataSet data, Statistic statistic, double alpha) {
        this(data, statistic, alpha, DegreesOfFreedom.REDUCED);
    }

    /** A test with the given rule for the degrees of freedom. */
    public ContingencyTest(DataSet data, Statistic statistic, double alpha, DegreesOfFreedom degreesOfFreedom) {
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("alpha must be in (0, 1), got " + alpha);
        }
        int p = data.columns();
        this.codes = new int[p][];
        this.cardinality = new int[p];
        for (int j = 0; j < p; j++) {
            if (!data.isDiscrete(j)) {
                throw new IllegalArgumentException("the " + statistic.word() + " test needs discrete data; column '"
                        + data.variable(j).name() + "' is continuous");
            }
            codes[j] = data.discrete(j);
            cardinality[j] = data.variable(j).cardinality();
        }
        this.rows = data.rows();
        this.statistic = statistic;
        this.alpha = alpha;
        this.degreesOfFreedom = degreesOfFreedom;
    }

    @Override
    public int variables() {
        return codes.length;
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
        return statistic.word();
    }

    /** The statistic, degrees of freedom, rows used and p-value of one test. */
    public Result evaluate(int x, int y, int[] z) {
        if (x > y) { // the same bits for (x, y) and (y, x): see IndependenceTest
            int t = x;
            x = y;
            y = t;
        }
        int[] cx = codes[x];
        int[] cy = codes[y];
        int kx = cardinality[x];
        int ky = cardinality[y];
        int[] stratum = new int[rows];
        int strata = strata(x, y, z, stratum);
        if (strata == 0) {
            return new Result(0, 0, 0, 1.0);
        }
        int cells = kx * ky;
        int[] table = new int[strata * cells];
        int used = 0;
        for (int r = 0; r < rows; r++) {
            int s = stratum[r];
            if (s >= 0) {
                table[s * cells + cx[r] * ky + cy[r]]++;
                used++;
            }
        }
        int[] rowSum = new int[kx];
        int[] colSum = new int[ky];
        double stat = 0;
        int dof = 0;
        for (int s = 0; s < strata; s++) {
            int base = s * cells;
            Arrays.fill(rowSum, 0);
            Arrays.fill(colSum, 0);
            int total = 0;
            for (int i = 0; i < kx; i++) {
                for (int j = 0; j < ky; j++) {
                    int o = table[base + i * ky + j];
                    rowSum[i] += o;
                    colSum[j] += o;
                    total += o;
                }
            }
            if (total == 0) {
                continue;
            }
            int nonEmptyRows = 0;
            int nonEmptyCols = 0;
            for (int i = 0; i < kx; i++) {
                if (rowSum[i] > 0) {
                    nonEmptyRows++;
                }
            }
            for (int j = 0; j < ky; j++) {
                if (colSum[j] > 0) {
                    nonEmptyCols++;
                }
            }
            dof += (nonEmptyRows - 1) * (nonEmptyCols - 1);
            for (int i = 0; i < kx; i++) {
                if (rowSum[i] == 0) {
                    continue;
                }
                for (int j = 0; j < ky; j++) {
                    if (colSum[j] == 0) {
                        continue;
                    }
                    double e = (double) rowSum[i] * colSum[j] / total;
                    int o = table[base + i * ky + j];
                    if (statistic == Statistic.G_SQUARE) {
                        if (o > 0) {
                            stat += o * Math.log(o / e);
                        }
                    } else {
                        double d = o - e;
                        stat += d * d / e;
                    }
                }
            }
        }
        if (statistic == Statistic.G_SQUARE) {
            stat *= 2;
        }
        stat = Math.max(stat, 0);
        if (degreesOfFreedom == DegreesOfFreedom.TEXTBOOK) {
            dof = textbookDegreesOfFreedom(kx, ky, z);
        }
        double pv = dof == 0 ? 1.0 : Gamma.regularizedGammaQ(dof / 2.0, stat / 2.0);
        return new Result(stat, dof, used, pv);
    }

    /** (|X| − 1)(|Y| − 1) · ∏ |Z|, capped at Integer.MAX_VALUE (where the p-value is 1 anyway). */
    private int textbookDegreesOfFreedom(int kx, int ky, int[] z) {
        long d = (long) (kx - 1) * (ky - 1);
        for (int v : z) {
            d = Math.min(d * cardinality[v], Integer.MAX_VALUE);
        }
        return (int) d;
    }

    /**
     * Writes each row's stratum index (or −1 for a row missing one of the variables) and
     * returns the number of strata. Indices are direct mixed-radix codes when they are few,
     * otherwise ranks of the distinct keys that occur.
     */
    private int strata(int x, int y, int[] z, int[] out) {
        int[] cx = codes[x];
        int[] cy = codes[y];
        long product = 1;
        for (int v : z) {
            product = Math.min(product * cardinality[v], Long.MAX_VALUE / 1024);
        }
        long[] keys = null;
        boolean direct = product <= 4L * rows + 16;
        if (!direct) {
            keys = new long[rows];
        }
        int valid = 0;
        for (int r = 0; r < rows; r++) {
            if (cx[r] < 0 || cy[r] < 0) {
                out[r] = -1;
                continue;
            }
            long key = 0;
            boolean ok = true;
            for (int v : z) {
                int c = codes[v][r];
                if (c < 0) {
                    ok = false;
                    break;
                }
                key = key * cardinality[v] + c;
            }
            if (!ok) {
                out[r] = -1;
                continue;
            }
            if (direct) {
                out[r] = (int) key;
            } else {
                keys[valid] = key;
                out[r] = valid;
            }
            valid++;
        }
        if (direct) {
            return valid == 0 ? 0 : (int) product;
        }
        // Many possible strata: rank the keys that occur (each row's slot r' < valid holds its key).
        long[] sorted = Arrays.copyOf(keys, valid);
        Arrays.sort(sorted);
        int distinct = 0;
        for (int i = 0; i < valid; i++) {
            if (i == 0 || sorted[i] != sorted[i - 1]) {
                sorted[distinct++] = sorted[i];
            }
        }
        for (int r = 0; r < rows; r++) {
            if (out[r] >= 0) {
                out[r] = Arrays.binarySearch(sorted, 0, distinct, keys[out[r]]);
            }
        }
        return distinct;
    }
}
