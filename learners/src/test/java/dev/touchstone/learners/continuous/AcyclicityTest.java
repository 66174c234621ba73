package dev.touchstone.learners.continuous;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class AcyclicityTest {

    /** A weight matrix with the DAG's edges, weights ±[0.5, 2]. */
    private static double[] weights(Graph g, UniformRandomProvider rng) {
        int d = g.size();
        double[] w = new double[d * d];
        for (Edge e : g.edges()) {
            int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
            int to = e.other(from);
            double v = 0.5 + 1.5 * rng.nextDouble();
            w[from * d + to] = rng.nextBoolean() ? v : -v;
        }
        return w;
    }

    @Test
    @DisplayName("h(W) = 0.0 exactly for the weight matrix of every one of 200 seeded random DAGs"
            + " (Zheng et al. 2018, Theorem 1)")
    void zeroOnDags() {
        for (int seed = 0; seed < 200; seed++) {
            int d = 2 + seed % 30;
            Graph g = RandomDags.erdosRenyi(d, 1.0 + seed % 5, seed);
            double[] w = weights(g, Seeds.random(seed));
            assertEquals(0.0, Acyclicity.value(w, d), 0.0, "DAG seed " + seed);
        }
    }

    @Test
    @DisplayName("h(W) > 0 once one edge closing a directed cycle is added, on 200 seeded random DAGs"
            + " (Zheng et al. 2018, Theorem 1)")
    void positiveOnCycles() {
        int checked = 0;
        for (int seed = 0; seed < 200; seed++) {
            int d = 3 + seed % 20;
            Graph g = RandomDags.erdosRenyi(d, 2.0, 1000 + seed);
            UniformRandomProvider rng = Seeds.random(seed);
            double[] w = weights(g, rng);
            // Close a cycle: find an edge a → b and add b → a (a 2-cycle), weight as small as 0.1.
            for (Edge e : g.edges()) {
                int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
                int to = e.other(from);
                w[to * d + from] = 0.1;
                double h = Acyclicity.value(w, d);
                assertTrue(h > 0, "cyclic seed " + seed + ": h = " + h);
                // The smallest term of tr(e^{A}) − d from the 2-cycle is (w_ab w_ba)²: a lower bound.
                double wab = w[from * d + to];
                assertTrue(h >= Math.pow(wab * 0.1, 2) * (1 - 1e-12), "lower bound, seed " + seed);
                checked++;
                break;
            }
        }
        assertTrue(checked > 150, "cycles checked: " + checked);
    }

    @Test
    @DisplayName("The gradient of h matches central finite differences on random cyclic matrices (common practice)")
    void gradientMatchesFiniteDifferences() {
        UniformRandomProvider rng = Seeds.random(77);
        for (int trial = 0; trial < 5; trial++) {
            int d = 4 + trial;
            double[] w = new double[d * d];
            for (int k = 0; k < w.length; k++) {
                if (k % (d + 1) != 0 && rng.nextDouble() < 0.5) {
                    w[k] = rng.nextDouble() * 2 - 1;
                }
            }
            double[] grad = new double[d * d];
            Acyclicity.valueAndGradient(w, d, grad);
            for (int k = 0; k < w.length; k++) {
                double eps = 1e-6;
                double[] plus = w.clone();
                double[] minus = w.clone();
                plus[k] += eps;
                minus[k] -= eps;
                double fd = (Acyclicity.value(plus, d) - Acyclicity.value(minus, d)) / (2 * eps);
                assertEquals(fd, grad[k], 1e-6 * Math.max(1, Math.abs(fd)), "entry " + k + " of d = " + d);
            }
        }
    }

    @Test
    @DisplayName("exp of a symmetric non-negative matrix equals V e^Λ Vᵀ from Commons Math 3.6.1 EigenDecomposition")
    void exponentialMatchesEigenDecomposition() {
        UniformRandomProvider rng = Seeds.random(5);
        for (int trial = 0; trial < 5; trial++) {
            int d = 3 + 4 * trial;
            double[][] a = new double[d][d];
            double[] flat = new double[d * d];
            for (int i = 0; i < d; i++) {
                for (int j = i; j < d; j++) {
                    double v = rng.nextDouble() * (1 + trial);
                    a[i][j] = v;
                    a[j][i] = v;
                }
            }
            for (int i = 0; i < d; i++) {
                System.arraycopy(a[i], 0, flat, i * d, d);
            }
            EigenDecomposition eig = new EigenDecomposition(new Array2DRowRealMatrix(a));
            RealMatrix v = eig.getV();
            double[] lambda = eig.getRealEigenvalues();
            double[] ours = Acyclicity.expNonNegative(flat, d);
            for (int i = 0; i < d; i++) {
                for (int j = 0; j < d; j++) {
                    double ref = 0;
                    for (int k = 0; k < d; k++) {
                        ref += v.getEntry(i, k) * Math.exp(lambda[k]) * v.getEntry(j, k);
                    }
                    assertEquals(ref, ours[i * d + j], 1e-10 * Math.abs(ref) + 1e-12, "entry " + i + "," + j);
                }
            }
        }
    }
}
