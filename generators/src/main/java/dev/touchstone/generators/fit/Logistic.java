package dev.touchstone.generators.fit;

import dev.touchstone.core.data.DataSet;

import java.util.List;

/**
 * Multinomial logistic regression of a discrete variable on its parents (McCullagh and
 * Nelder 1989, Generalized Linear Models, ch. 5): an intercept per category and
 * configuration of the discrete parents, and per category slopes on the standardised
 * continuous parents (category 0 has slopes 0), fitted by gradient ascent on the mean
 * log-likelihood minus {@link StructureFit#RIDGE}/2 · Σ slopes², with a step that grows
 * after each improvement and halves after each failure. Intercepts start at the log of
 * the smoothed table, so a configuration never seen keeps its smoothed prior. Cost
 * O(steps · m · K · q).
 */
final class Logistic {

    private Logistic() {
    }

    static FittedNode.Categorical fit(DataSet data, int v, List<Integer> con, List<Integer> dis, int[] rows) {
        int k = data.variable(v).cardinality();
        int q = con.size();
        int m = rows.length;
        int[] strides = StructureFit.strides(data, dis);
        int configs = StructureFit.configurations(data, dis);
        double[] centre = new double[q];
        double[] scale = new double[q];
        double[][] z = new double[m][q];
        for (int j = 0; j < q; j++) {
            double[] x = data.continuous(con.get(j));
            double s = 0;
            double ss = 0;
            for (int r : rows) {
                s += x[r];
                ss += x[r] * x[r];
            }
            centre[j] = s / m;
            double var = Math.max(0, ss / m - centre[j] * centre[j]);
            scale[j] = var > 0 ? Math.sqrt(var) : 1;
            for (int i = 0; i < m; i++) {
                z[i][j] = (x[rows[i]] - centre[j]) / scale[j];
            }
        }
        int[] y = new int[m];
        int[] cfg = new int[m];
        double[][] counts = new double[configs][k];
        int[] codes = data.discrete(v);
        for (int i = 0; i < m; i++) {
            y[i] = codes[rows[i]];
            cfg[i] = StructureFit.config(data, dis, strides, rows[i]);
            counts[cfg[i]][y[i]]++;
        }
        double[][] a = StructureFit.logSmoothed(counts);
        double[][] b = new double[k][q];
        double[][] ga = new double[configs][k];
        double[][] gb = new double[k][q];
        double value = objective(a, b, z, y, cfg, null, null);
        double step = 1.0;
        for (int it = 0; it < StructureFit.MAX_ITERATIONS && step > 1e-10; it++) {
            objective(a, b, z, y, cfg, ga, gb);
            double[][] a2 = new double[configs][k];
            double[][] b2 = new double[k][q];
            for (int c = 0; c < configs; c++) {
                for (int j = 0; j < k; j++) {
                    a2[c][j] = a[c][j] + step * ga[c][j];
                }
            }
            for (int j = 1; j < k; j++) {
                for (int t = 0; t < q; t++) {
                    b2[j][t] = b[j][t] + step * gb[j][t];
                }
            }
            double next = objective(a2, b2, z, y, cfg, null, null);
            if (next > value) {
                boolean converged = next - value < 1e-12;
                a = a2;
                b = b2;
                value = next;
                step *= 1.5;
                if (converged) {
                    break;
                }
            } else {
                step *= 0.5;
            }
        }
        return new FittedNode.Categorical(data.variable(v).name(), m, data.variable(v).categories(),
                new FittedNode.Categorical.Intercepts(StructureFit.names(data, dis), a),
                new FittedNode.Categorical.Effects(StructureFit.names(data, con), centre, scale, b));
    }

    /** The penalised mean log-likelihood; fills the gradients when they are not null. */
    private static double objective(double[][] a, double[][] b, double[][] z, int[] y, int[] cfg, double[][] ga,
                                    double[][] gb) {
        int m = y.length;
        int k = b.length;
        int q = k == 0 ? 0 : b[0].length;
        if (ga != null) {
            for (double[] row : ga) {
                java.util.Arrays.fill(row, 0);
            }
            for (double[] row : gb) {
                java.util.Arrays.fill(row, 0);
            }
        }
        double[] eta = new double[k];
        double[] p = new double[k];
        double ll = 0;
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < k; j++) {
                double e = a[cfg[i]][j];
                for (int t = 0; t < q; t++) {
                    e += b[j][t] * z[i][t];
                }
                eta[j] = e;
            }
            Softmax.into(eta, p);
            ll += Math.log(Math.max(p[y[i]], 1e-300));
            if (ga != null) {
                for (int j = 0; j < k; j++) {
                    double d = ((y[i] == j) ? 1 : 0) - p[j];
                    ga[cfg[i]][j] += d / m;
                    if (j > 0) {
                        for (int t = 0; t < q; t++) {
                            gb[j][t] += d * z[i][t] / m;
                        }
                    }
                }
            }
        }
        double penalty = 0;
        for (int j = 1; j < k; j++) {
            for (int t = 0; t < q; t++) {
                penalty += b[j][t] * b[j][t];
                if (gb != null) {
                    gb[j][t] -= StructureFit.RIDGE * b[j][t];
                }
            }
        }
        return ll / m - StructureFit.RIDGE / 2 * penalty;
    }
}
