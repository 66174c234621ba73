package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.Covariances;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.graphs.GraphFamily;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class LinearModelsTest {

    static Graph randomDag(int nodes, double meanDegree, long seed) {
        GraphFamily f = GraphFamilies.byId("erdos-renyi");
        return f.generate(f.resolve(Map.of("nodes", nodes, "mean_degree", meanDegree)), Seeds.random(seed)).dag();
    }

    /** (I − B)⁻¹ Ω (I − B)⁻ᵀ from the drawn weights, with Commons Math's matrix inverse. */
    static RealMatrix textbookCovariance(NodeWiseModel m) {
        int p = m.graph().size();
        RealMatrix b = MatrixUtils.createRealMatrix(p, p);
        RealMatrix omega = MatrixUtils.createRealMatrix(p, p);
        for (int v = 0; v < p; v++) {
            LinearMechanism lm = (LinearMechanism) m.mechanism(v);
            int[] pa = lm.parents();
            double[] w = lm.weights();
            for (int k = 0; k < pa.length; k++) {
                b.setEntry(v, pa[k], w[k]);
            }
            omega.setEntry(v, v, lm.noiseScale() * lm.noiseScale());
        }
        RealMatrix inv = MatrixUtils.inverse(MatrixUtils.createRealIdentityMatrix(p).subtract(b));
        return inv.multiply(omega).multiply(inv.transpose());
    }

    @Test
    @DisplayName("linear SEM: exact covariance equals (I − B)⁻¹ Ω (I − B)⁻ᵀ, and 200,000 rows match it within 5 SE (common practice)")
    void covarianceOfLinearSem() {
        for (String kind : List.of("linear-gaussian", "linear-non-gaussian")) {
            Graph dag = randomDag(8, 2.5, 11);
            ModelKind k = ModelKinds.byId(kind);
            NodeWiseModel m = (NodeWiseModel) k.draw(dag, k.resolve(Map.of("noise_scale_low", 0.5,
                    "noise_scale_high", 1.5)), Seeds.random(12));
            RealMatrix sigma = textbookCovariance(m);
            CovarianceMatrix exact = m.populationCovariance().orElseThrow();
            int p = dag.size();
            for (int i = 0; i < p; i++) {
                for (int j = 0; j < p; j++) {
                    assertEquals(sigma.getEntry(i, j), exact.get(i, j), 1e-9 * (1 + Math.abs(sigma.getEntry(i, j))));
                }
            }
            int n = 200_000;
            CovarianceMatrix s = Covariances.sample(m.sample(n, 13));
            for (int i = 0; i < p; i++) {
                for (int j = 0; j < p; j++) {
                    double sij = sigma.getEntry(i, j);
                    // Var of a sample covariance under normality: (Σii Σjj + Σij²)/n (Wishart; common practice);
                    // the wider tolerance covers the heavier-tailed noise of the non-Gaussian kind.
                    double se = Math.sqrt((sigma.getEntry(i, i) * sigma.getEntry(j, j) + sij * sij) / n);
                    assertEquals(sij, s.get(i, j), 6 * se, kind + " entry " + i + "," + j);
                }
            }
        }
    }

    @Test
    @DisplayName("local Markov property on seeded random DAGs: each variable is uncorrelated with its non-descendants given its parents in the exact covariance (Lauritzen 1996, Thm 3.27)")
    void localMarkovProperty() {
        ModelKind k = ModelKinds.byId("linear-gaussian");
        for (int rep = 0; rep < 20; rep++) {
            Graph dag = randomDag(9, 3, 500 + rep);
            CovarianceMatrix c = k.draw(dag, k.resolve(Map.of()), Seeds.random(600 + rep)).populationCovariance()
                    .orElseThrow();
            for (int v = 0; v < dag.size(); v++) {
                boolean[] desc = dev.touchstone.core.graph.algorithms.Ancestry.descendants(dag, v);
                int[] pa = dag.parents(v);
                for (int w = 0; w < dag.size(); w++) {
                    final int other = w;
                    if (w == v || desc[w] || java.util.Arrays.stream(pa).anyMatch(q -> q == other)) {
                        continue;
                    }
                    int[] idx = new int[pa.length + 2];
                    idx[0] = v;
                    idx[1] = w;
                    System.arraycopy(pa, 0, idx, 2, pa.length);
                    RealMatrix sub = MatrixUtils.createRealMatrix(idx.length, idx.length);
                    for (int a = 0; a < idx.length; a++) {
                        for (int b = 0; b < idx.length; b++) {
                            sub.setEntry(a, b, c.get(idx[a], idx[b]));
                        }
                    }
                    RealMatrix prec = MatrixUtils.inverse(sub);
                    double partial = -prec.getEntry(0, 1) / Math.sqrt(prec.getEntry(0, 0) * prec.getEntry(1, 1));
                    assertEquals(0.0, partial, 1e-9, dag.name(v) + " vs " + dag.name(w));
                }
            }
        }
    }

    @Test
    @DisplayName("standardised linear model: exact covariance is the correlation matrix, sample variances near 1")
    void standardisedCovariance() {
        Graph dag = randomDag(10, 2, 21);
        ModelKind k = ModelKinds.byId("linear-gaussian");
        NodeWiseModel m = (NodeWiseModel) k.draw(dag, k.resolve(Map.of("standardize", true)), Seeds.random(22));
        CovarianceMatrix c = m.populationCovariance().orElseThrow();
        for (int i = 0; i < 10; i++) {
            assertEquals(1.0, c.get(i, i), 1e-12);
        }
        CovarianceMatrix s = Covariances.sample(m.sample(50_000, 23));
        for (int i = 0; i < 10; i++) {
            assertEquals(1.0, s.get(i, i), 0.05);
        }
    }

    @Test
    @DisplayName("pinned: a seeded linear Gaussian chain gives exactly these first values (regression pin)")
    void pinnedValues() {
        Graph chain = Graph.builder(List.of("a", "b", "c")).addDirected(0, 1).addDirected(1, 2).freeze();
        ModelKind k = ModelKinds.byId("linear-gaussian");
        StructuralModel m = k.draw(chain, k.resolve(Map.of()), Seeds.random(7));
        DataSet d = m.sample(3, 8);
        double[][] got = {d.continuous(0), d.continuous(1), d.continuous(2)};
        assertArrayEquals(PINNED[0], got[0], 0.0);
        assertArrayEquals(PINNED[1], got[1], 0.0);
        assertArrayEquals(PINNED[2], got[2], 0.0);
    }

    static final double[][] PINNED = {
        {0.5773092666370957, 1.5358914416719387, -0.48820759773505673},
        {-0.04009867357414376, 0.8054928425770157, -1.3577915687313584},
        {0.24044452298144278, 0.8503783278127339, -0.9488566748910358}};

    @Test
    @DisplayName("memory: a sampled data set holds no more than 1.1 × rows · columns · 8 bytes of column arrays")
    void memory() {
        Graph dag = randomDag(50, 2, 31);
        ModelKind k = ModelKinds.byId("linear-gaussian");
        DataSet d = k.draw(dag, k.resolve(Map.of()), Seeds.random(32)).sample(10_000, 33);
        long raw = 10_000L * 50 * 8;
        assertTrue(d.rawBytes() <= 1.1 * raw, d.rawBytes() + " bytes");
        assertEquals(raw, d.rawBytes());
    }
}
