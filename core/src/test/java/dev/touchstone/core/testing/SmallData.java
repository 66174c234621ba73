package dev.touchstone.core.testing;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;

/**
 * Small seeded data sets for the learner contract test. Deliberately minimal (the real
 * models live in the generators module): a linear Gaussian SEM with weights ±[0.5, 1.5]
 * and unit noise, and a binary network with noisy-OR-like tables.
 */
public final class SmallData {

    private SmallData() {
    }

    /** Linear Gaussian data from {@code dag} (hidden variables are simulated, then left out). */
    public static DataSet linearGaussian(Graph dag, int rows, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int p = dag.size();
        double[][] x = new double[p][rows];
        double[][] w = new double[p][];
        for (int v = 0; v < p; v++) {
            int[] pa = dag.parents(v);
            w[v] = new double[pa.length];
            for (int k = 0; k < pa.length; k++) {
                w[v][k] = (0.5 + rng.nextDouble()) * (rng.nextBoolean() ? 1 : -1);
            }
        }
        for (int v : Ancestry.topologicalOrder(dag)) {
            int[] pa = dag.parents(v);
            for (int r = 0; r < rows; r++) {
                double s = gaussian(rng);
                for (int k = 0; k < pa.length; k++) {
                    s += w[v][k] * x[pa[k]][r];
                }
                x[v][r] = s;
            }
        }
        DataSet.Builder b = DataSet.builder(rows);
        for (int v = 0; v < p; v++) {
            if (!dag.isHidden(v)) {
                b.continuous(dag.name(v), x[v]);
            }
        }
        return b.build();
    }

    /** Binary data from {@code dag}: P(X = 1) = 0.15 + 0.7 · (share of parents equal to 1). */
    public static DataSet binary(Graph dag, int rows, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int p = dag.size();
        int[][] x = new int[p][rows];
        for (int v : Ancestry.topologicalOrder(dag)) {
            int[] pa = dag.parents(v);
            for (int r = 0; r < rows; r++) {
                double on = 0;
                for (int q : pa) {
                    on += x[q][r];
                }
                double prob = 0.15 + 0.7 * (pa.length == 0 ? 0.5 : on / pa.length);
                x[v][r] = rng.nextDouble() < prob ? 1 : 0;
            }
        }
        DataSet.Builder b = DataSet.builder(rows);
        for (int v = 0; v < p; v++) {
            if (!dag.isHidden(v)) {
                b.discrete(Variable.discrete(dag.name(v), 2), x[v]);
            }
        }
        return b.build();
    }

    /** The first continuous columns of {@code continuous} next to the discrete columns of {@code discrete}. */
    public static DataSet mixed(DataSet continuous, DataSet discrete) {
        DataSet.Builder b = DataSet.builder(continuous.rows());
        for (int j = 0; j < continuous.columns(); j++) {
            b.continuous("C" + continuous.variable(j).name(), continuous.continuous(j));
        }
        for (int j = 0; j < discrete.columns(); j++) {
            b.discrete(Variable.discrete("D" + discrete.variable(j).name(), discrete.variable(j).categories()),
                    discrete.discrete(j));
        }
        return b.build();
    }

    private static double gaussian(UniformRandomProvider rng) {
        double u = 1.0 - rng.nextDouble();
        double v = rng.nextDouble();
        return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    }
}
