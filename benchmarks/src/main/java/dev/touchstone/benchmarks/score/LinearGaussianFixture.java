package dev.touchstone.benchmarks.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

import java.util.ArrayList;
import java.util.List;

/**
 * Benchmark inputs: an Erdős–Rényi DAG with a given mean degree over a random causal
 * order, edge weights uniform on ±[0.5, 2], unit-variance Gaussian noise (common practice
 * for simulation studies), and n rows drawn from it. Seeded; kept here so the benchmarks
 * do not depend on the generators module's evolving API.
 */
final class LinearGaussianFixture {

    final Graph dag;
    final DataSet data;

    private LinearGaussianFixture(Graph dag, DataSet data) {
        this.dag = dag;
        this.data = data;
    }

    static LinearGaussianFixture of(int p, double meanDegree, int rows, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        List<String> names = new ArrayList<>();
        for (int i = 1; i <= p; i++) {
            names.add("V" + i);
        }
        int[] order = new int[p];
        for (int i = 0; i < p; i++) {
            order[i] = i;
        }
        for (int i = p - 1; i > 0; i--) {
            int j = rng.nextInt(i + 1);
            int t = order[i];
            order[i] = order[j];
            order[j] = t;
        }
        double edgeProbability = p > 1 ? Math.min(1, meanDegree / (p - 1)) : 0;
        MutableGraph g = Graph.builder(names);
        double[][] weight = new double[p][p];
        for (int i = 0; i < p; i++) {
            for (int j = i + 1; j < p; j++) {
                if (rng.nextDouble() < edgeProbability) {
                    g.addDirected(order[i], order[j]);
                    weight[order[i]][order[j]] = (0.5 + 1.5 * rng.nextDouble()) * (rng.nextBoolean() ? 1 : -1);
                }
            }
        }
        Graph dag = g.freeze();
        ZigguratSampler.NormalizedGaussian normal = ZigguratSampler.NormalizedGaussian.of(rng);
        double[][] x = new double[p][rows];
        for (int i = 0; i < p; i++) {
            int v = order[i];
            int[] pa = dag.parents(v);
            for (int r = 0; r < rows; r++) {
                double s = normal.sample();
                for (int u : pa) {
                    s += weight[u][v] * x[u][r];
                }
                x[v][r] = s;
            }
        }
        DataSet.Builder b = DataSet.builder(rows);
        for (int v = 0; v < p; v++) {
            b.continuous(names.get(v), x[v]);
        }
        return new LinearGaussianFixture(dag, b.build());
    }
}
