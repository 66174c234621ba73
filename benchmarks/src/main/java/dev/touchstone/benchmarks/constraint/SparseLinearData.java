package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/**
 * Benchmark fixture: linear Gaussian data from a random sparse DAG (Erdős–Rényi over the
 * index order, edge weights ±[0.5, 1.5], unit noise). Kept here, minimal and fast, so the
 * benchmarks measure the learner and not a generator's options.
 */
final class SparseLinearData {

    private SparseLinearData() {
    }

    /** Column arrays, p × n. */
    static double[][] columns(int p, int n, double meanDegree, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double prob = meanDegree / (p - 1);
        int[][] parents = new int[p][];
        double[][] weights = new double[p][];
        for (int j = 0; j < p; j++) {
            int[] pa = new int[j];
            double[] w = new double[j];
            int k = 0;
            for (int i = 0; i < j; i++) {
                if (rng.nextDouble() < prob) {
                    pa[k] = i;
                    w[k] = (0.5 + rng.nextDouble()) * (rng.nextBoolean() ? 1 : -1);
                    k++;
                }
            }
            parents[j] = java.util.Arrays.copyOf(pa, k);
            weights[j] = java.util.Arrays.copyOf(w, k);
        }
        double[][] x = new double[p][n];
        for (int j = 0; j < p; j++) {
            double[] col = x[j];
            for (int r = 0; r < n; r++) {
                double s = g.sample();
                for (int k = 0; k < parents[j].length; k++) {
                    s += weights[j][k] * x[parents[j][k]][r];
                }
                col[r] = s;
            }
        }
        return x;
    }

    /** A fresh data set over these columns (so nothing is cached from an earlier run). */
    static DataSet dataSet(double[][] cols) {
        DataSet.Builder b = DataSet.builder(cols[0].length);
        for (int j = 0; j < cols.length; j++) {
            b.continuous("X" + (j + 1), cols[j]);
        }
        return b.build();
    }
}
