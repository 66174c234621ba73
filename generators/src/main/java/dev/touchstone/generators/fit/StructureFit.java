package dev.touchstone.generators.fit;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.CholeskyDecomposition;

import java.util.ArrayList;
import java.util.List;

/**
 * Fits a structural model over a given DAG to a data set, one variable at a time, on the
 * rows complete for that variable and its parents (Little and Rubin 2002, "available
 * case" analysis; unbiased under MCAR):
 *
 * <ul>
 * <li>continuous variable: ordinary least squares on an intercept, the continuous parents
 *     and indicator columns of the discrete parents' categories (category 0 the reference),
 *     with residual variance RSS / (m − q) — the linear Gaussian model when all parents are
 *     continuous, the conditional Gaussian model of Lauritzen and Wermuth (1989) with a
 *     common variance otherwise. Cost O(m · q²  + q³) with q the number of columns.</li>
 * <li>discrete variable, discrete parents only: the conditional table by smoothed maximum
 *     likelihood, (count + α) / (total + α·K) with α = {@value #SMOOTHING} (Laplace's rule
 *     of succession). Cost O(m + configurations · K).</li>
 * <li>discrete variable with continuous parents: multinomial logistic regression with an
 *     intercept per configuration of the discrete parents and slopes on the standardised
 *     continuous parents, by gradient ascent with a small ridge penalty ({@value #RIDGE})
 *     on the slopes, at most {@value #MAX_ITERATIONS} steps. Cost O(steps · m · K · q).</li>
 * </ul>
 */
public final class StructureFit {

    /** The pseudo-count added to every cell of a conditional table. */
    public static final double SMOOTHING = 1.0;
    /** The ridge penalty on logistic slopes (per row). */
    public static final double RIDGE = 1e-3;
    /** The most gradient steps of a logistic fit. */
    public static final int MAX_ITERATIONS = 400;

    private StructureFit() {
    }

    /**
     * Fits every variable of {@code dag} (whose names must be the data's columns, in order).
     *
     * @throws IllegalArgumentException when names differ, the graph is not a DAG, or a
     *     variable has fewer than two rows complete with its parents
     */
    public static FittedModel fit(Graph dag, DataSet data) {
        if (!dag.names().equals(data.names())) {
            throw new IllegalArgumentException("the graph's variables " + dag.names() + " are not the data's columns "
                    + data.names());
        }
        if (!dag.isFullyDirected() || Ancestry.topologicalOrder(dag) == null) {
            throw new IllegalArgumentException("the truth graph must be a DAG (directed edges only, no cycle)");
        }
        List<FittedNode> nodes = new ArrayList<>();
        for (int v = 0; v < dag.size(); v++) {
            nodes.add(fitNode(dag, data, v));
        }
        double[] rates = new double[dag.size()];
        for (int j = 0; j < rates.length; j++) {
            rates[j] = data.rows() == 0 ? 0 : data.missingCount(j) / (double) data.rows();
        }
        return new FittedModel(dag, data.variables(), nodes, rates);
    }

    static FittedNode fitNode(Graph dag, DataSet data, int v) {
        List<Integer> con = new ArrayList<>();
        List<Integer> dis = new ArrayList<>();
        for (int q : dag.parents(v)) {
            (data.isDiscrete(q) ? dis : con).add(q);
        }
        int[] rows = completeRows(data, v, con, dis);
        if (rows.length < 2) {
            throw new IllegalArgumentException("variable '" + dag.name(v) + "' has " + rows.length
                    + " rows complete with its parents; at least 2 are needed to fit it");
        }
        if (!data.isDiscrete(v)) {
            return leastSquares(data, v, con, dis, rows);
        }
        if (con.isEmpty()) {
            return table(data, v, dis, rows);
        }
        return Logistic.fit(data, v, con, dis, rows);
    }

    static int[] completeRows(DataSet data, int v, List<Integer> con, List<Integer> dis) {
        int[] columns = new int[1 + con.size() + dis.size()];
        columns[0] = v;
        for (int k = 0; k < con.size(); k++) {
            columns[1 + k] = con.get(k);
        }
        for (int k = 0; k < dis.size(); k++) {
            columns[1 + con.size() + k] = dis.get(k);
        }
        return data.rowsCompleteIn(columns);
    }

    private static FittedNode.Gaussian leastSquares(DataSet data, int v, List<Integer> con, List<Integer> dis,
                                                    int[] rows) {
        int q = 1 + con.size();
        int[] offset = new int[dis.size()];
        for (int k = 0; k < dis.size(); k++) {
            offset[k] = q;
            q += data.variable(dis.get(k)).cardinality() - 1;
        }
        double[] y = data.continuous(v);
        double[][] xtx = new double[q][q];
        double[] xty = new double[q];
        double[] x = new double[q];
        for (int r : rows) {
            design(data, con, dis, offset, r, x);
            for (int a = 0; a < q; a++) {
                if (x[a] == 0) {
                    continue;
                }
                xty[a] += x[a] * y[r];
                for (int b = a; b < q; b++) {
                    xtx[a][b] += x[a] * x[b];
                }
            }
        }
        for (int a = 0; a < q; a++) {
            for (int b = 0; b < a; b++) {
                xtx[a][b] = xtx[b][a];
            }
            // A category never seen among the complete rows leaves a zero column: a tiny ridge
            // keeps the system solvable and gives that shift 0 (its effect is unknown).
            xtx[a][a] += 1e-10 * xtx[a][a] + 1e-12;
        }
        double[] beta = new CholeskyDecomposition(new Array2DRowRealMatrix(xtx, false), 1e-15, 1e-300).getSolver()
                .solve(new ArrayRealVector(xty, false)).toArray();
        double[] residuals = new double[rows.length];
        double[] fitted = new double[rows.length];
        double rss = 0;
        for (int i = 0; i < rows.length; i++) {
            design(data, con, dis, offset, rows[i], x);
            double f = 0;
            for (int a = 0; a < q; a++) {
                f += beta[a] * x[a];
            }
            fitted[i] = f;
            residuals[i] = y[rows[i]] - f;
            rss += residuals[i] * residuals[i];
        }
        double sigma = Math.sqrt(rss / Math.max(1, rows.length - q));
        double[] weights = new double[con.size()];
        System.arraycopy(beta, 1, weights, 0, weights.length);
        double[][] shifts = new double[dis.size()][];
        for (int k = 0; k < dis.size(); k++) {
            shifts[k] = new double[data.variable(dis.get(k)).cardinality()];
            System.arraycopy(beta, offset[k], shifts[k], 1, shifts[k].length - 1);
        }
        return new FittedNode.Gaussian(data.variable(v).name(), rows.length,
                new FittedNode.Gaussian.Mean(beta[0], names(data, con), weights, names(data, dis), shifts), sigma,
                new FittedNode.Gaussian.OnRows(residuals, fitted));
    }

    private static void design(DataSet data, List<Integer> con, List<Integer> dis, int[] offset, int r, double[] x) {
        java.util.Arrays.fill(x, 0);
        x[0] = 1;
        for (int k = 0; k < con.size(); k++) {
            x[1 + k] = data.continuous(con.get(k))[r];
        }
        for (int k = 0; k < dis.size(); k++) {
            int c = data.discrete(dis.get(k))[r];
            if (c > 0) {
                x[offset[k] + c - 1] = 1;
            }
        }
    }

    private static FittedNode.Categorical table(DataSet data, int v, List<Integer> dis, int[] rows) {
        int k = data.variable(v).cardinality();
        int[] strides = strides(data, dis);
        int configs = configurations(data, dis);
        double[][] counts = new double[configs][k];
        int[] y = data.discrete(v);
        for (int r : rows) {
            counts[config(data, dis, strides, r)][y[r]]++;
        }
        return new FittedNode.Categorical(data.variable(v).name(), rows.length, data.variable(v).categories(),
                new FittedNode.Categorical.Intercepts(names(data, dis), logSmoothed(counts)),
                FittedNode.Categorical.Effects.none(k));
    }

    /** The log of (count + α) / (total + α·K), row by row. */
    static double[][] logSmoothed(double[][] counts) {
        double[][] out = new double[counts.length][];
        for (int c = 0; c < counts.length; c++) {
            int k = counts[c].length;
            double total = 0;
            for (double n : counts[c]) {
                total += n;
            }
            out[c] = new double[k];
            for (int j = 0; j < k; j++) {
                out[c][j] = Math.log((counts[c][j] + SMOOTHING) / (total + SMOOTHING * k));
            }
        }
        return out;
    }

    static int[] strides(DataSet data, List<Integer> dis) {
        int[] strides = new int[dis.size()];
        int stride = 1;
        for (int k = dis.size() - 1; k >= 0; k--) {
            strides[k] = stride;
            stride *= data.variable(dis.get(k)).cardinality();
        }
        return strides;
    }

    static int configurations(DataSet data, List<Integer> dis) {
        long n = 1;
        for (int q : dis) {
            n *= data.variable(q).cardinality();
            if (n > 1_000_000) {
                throw new IllegalArgumentException("a variable has discrete parents with more than 1,000,000"
                        + " configurations; the truth graph is too dense for a conditional table");
            }
        }
        return (int) n;
    }

    static int config(DataSet data, List<Integer> dis, int[] strides, int r) {
        int c = 0;
        for (int k = 0; k < dis.size(); k++) {
            c += data.discrete(dis.get(k))[r] * strides[k];
        }
        return c;
    }

    static List<String> names(DataSet data, List<Integer> columns) {
        List<String> out = new ArrayList<>();
        for (int j : columns) {
            out.add(data.variable(j).name());
        }
        return out;
    }
}
