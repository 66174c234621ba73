package dev.touchstone.generators.fit;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.generators.models.ModelAssembly;
import dev.touchstone.generators.models.StructuralModel;
import dev.touchstone.generators.networks.ReferenceNetwork;
import dev.touchstone.generators.networks.ReferenceNetworks;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class StructureFitTest {

    static Graph dag(List<String> names, String... arcs) {
        MutableGraph g = Graph.builder(names);
        for (String arc : arcs) {
            String[] ends = arc.split("->");
            g.addDirected(g.indexOf(ends[0].trim()), g.indexOf(ends[1].trim()));
        }
        return g.freeze();
    }

    /** a → c ← b, c → d; all continuous. */
    static StructuralModel linear(Graph g) {
        return ModelAssembly.builder(g)
                .gaussian("a", 1.0, List.of(), new double[0], List.of(), new double[0][], 1.0)
                .gaussian("b", -2.0, List.of(), new double[0], List.of(), new double[0][], 0.5)
                .gaussian("c", 0.5, List.of("a", "b"), new double[] {0.8, -1.5}, List.of(), new double[0][], 0.7)
                .gaussian("d", 0.0, List.of("c"), new double[] {1.2}, List.of(), new double[0][], 1.0)
                .build("test");
    }

    @Test
    @DisplayName("least squares equals Commons Math OLSMultipleLinearRegression and recovers the generating weights")
    void leastSquaresAgainstCommonsMath() {
        Graph g = dag(List.of("a", "b", "c", "d"), "a->c", "b->c", "c->d");
        DataSet data = linear(g).sample(20_000, 11);
        FittedModel fit = StructureFit.fit(g, data);
        FittedNode.Gaussian c = (FittedNode.Gaussian) fit.node("c");
        // Reference: Commons Math OLS with an intercept (general-purpose library).
        OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
        double[] y = data.continuous(data.indexOf("c")).clone();
        double[][] x = new double[data.rows()][2];
        for (int r = 0; r < data.rows(); r++) {
            x[r][0] = data.continuous(data.indexOf(c.continuousParents().get(0)))[r];
            x[r][1] = data.continuous(data.indexOf(c.continuousParents().get(1)))[r];
        }
        ols.newSampleData(y, x);
        double[] beta = ols.estimateRegressionParameters();
        assertEquals(beta[0], c.intercept(), 1e-8);
        assertArrayEquals(new double[] {beta[1], beta[2]}, c.weights(), 1e-8);
        assertEquals(Math.sqrt(ols.estimateErrorVariance()), c.noiseSd(), 1e-8);
        // Recovery of the generating parameters (sampling error ~ 0.7/√20000 per weight).
        assertEquals(0.8, c.weights()[c.continuousParents().indexOf("a")], 0.03);
        assertEquals(-1.5, c.weights()[c.continuousParents().indexOf("b")], 0.03);
        assertEquals(0.7, c.noiseSd(), 0.02);
        FittedNode.Gaussian b = (FittedNode.Gaussian) fit.node("b");
        assertEquals(-2.0, b.intercept(), 0.02);
        assertEquals(0.5, b.noiseSd(), 0.02);
    }

    @Test
    @DisplayName("chest clinic: fitted tables are (count + 1) / (total + K) and approach the published tables"
            + " (Lauritzen and Spiegelhalter 1988)")
    void tablesAgainstCounts() {
        ReferenceNetwork asia = ReferenceNetworks.chestClinic();
        Graph g = asia.dag();
        DataSet data = asia.model().sample(50_000, 5);
        FittedModel fit = StructureFit.fit(g, data);
        FittedNode.Categorical dysp = (FittedNode.Categorical) fit.node("dysp");
        List<String> parents = dysp.discreteParents();
        int[] y = data.discrete(data.indexOf("dysp"));
        int[] p0 = data.discrete(data.indexOf(parents.get(0)));
        int[] p1 = data.discrete(data.indexOf(parents.get(1)));
        double[][] counts = new double[4][2];
        for (int r = 0; r < data.rows(); r++) {
            counts[p0[r] * 2 + p1[r]][y[r]]++;
        }
        double[][] table = dysp.table();
        for (int c = 0; c < 4; c++) {
            double total = counts[c][0] + counts[c][1];
            for (int j = 0; j < 2; j++) {
                assertEquals((counts[c][j] + 1) / (total + 2), table[c][j], 1e-12);
            }
        }
        // Published P(dysp = yes | either, bronc), categories no/yes, (from memory).
        double[][] published = {{0.1, 0.8}, {0.7, 0.9}};
        int either = parents.indexOf("either");
        for (int e = 0; e < 2; e++) {
            for (int b = 0; b < 2; b++) {
                int config = either == 0 ? e * 2 + b : b * 2 + e;
                assertEquals(published[e][b], table[config][1], 0.03, "either=" + e + " bronc=" + b);
            }
        }
        FittedNode.Categorical smoke = (FittedNode.Categorical) fit.node("smoke");
        assertEquals(0.5, smoke.table()[0][1], 0.01);
    }

    @Test
    @DisplayName("conditional Gaussian: shifts of a discrete parent and the logistic slope of a continuous parent"
            + " are recovered (consistency of maximum likelihood, common practice)")
    void mixedRecovery() {
        Graph g = dag(List.of("x", "k", "y"), "x->k", "k->y", "x->y");
        StructuralModel m = ModelAssembly.builder(g)
                .gaussian("x", 0.0, List.of(), new double[0], List.of(), new double[0][], 1.0)
                .categorical("k", List.of("lo", "mid", "hi"), List.of(), new double[][] {{0, 0.2, -0.3}},
                        List.of("x"), new double[] {0}, new double[] {1}, new double[][] {{0}, {1.0}, {-1.5}})
                .gaussian("y", 2.0, List.of("x"), new double[] {0.5}, List.of("k"), new double[][] {{0, 1.0, -2.0}},
                        0.8)
                .build("test");
        DataSet data = m.sample(30_000, 3);
        FittedModel fit = StructureFit.fit(g, data);
        FittedNode.Gaussian y = (FittedNode.Gaussian) fit.node("y");
        assertEquals(2.0, y.intercept(), 0.05);
        assertEquals(0.5, y.weights()[0], 0.03);
        assertEquals(1.0, y.shifts()[0][1], 0.05);
        assertEquals(-2.0, y.shifts()[0][2], 0.05);
        FittedNode.Categorical k = (FittedNode.Categorical) fit.node("k");
        // Slopes are per standard deviation of x (≈ 1 here); category 0 is the reference.
        double scale = k.scale()[0];
        assertEquals(1.0, (k.slopes()[1][0] - k.slopes()[0][0]) / scale, 0.1);
        assertEquals(-1.5, (k.slopes()[2][0] - k.slopes()[0][0]) / scale, 0.1);
        assertEquals(0.2, k.logIntercepts()[0][1] - k.logIntercepts()[0][0], 0.1);
    }

    @Test
    @DisplayName("rows with missing cells: each variable is fitted on the rows complete for its family, and the"
            + " simulated truth reproduces the observed missing rates (MCAR)")
    void missingCells() {
        Graph g = dag(List.of("a", "b", "c", "d"), "a->c", "b->c", "c->d");
        DataSet full = linear(g).sample(4000, 2);
        double[] a = full.continuous(0).clone();
        double[] d = full.continuous(3).clone();
        for (int r = 0; r < a.length; r += 4) {
            a[r] = Double.NaN;
        }
        for (int r = 1; r < d.length; r += 10) {
            d[r] = Double.NaN;
        }
        DataSet data = DataSet.builder(4000).continuous("a", a).continuous("b", full.continuous(1))
                .continuous("c", full.continuous(2)).continuous("d", d).build();
        FittedModel fit = StructureFit.fit(g, data);
        assertEquals(3000, fit.node("a").rows());
        assertEquals(3000, fit.node("c").rows());
        assertEquals(4000, fit.node("b").rows());
        assertEquals(3600, fit.node("d").rows());
        FittedTruth truth = fit.truth("fitted", "test");
        DataSet sim = truth.sample(20_000, 9);
        assertEquals(0.25, sim.missingCount(0) / 20_000.0, 0.01);
        assertEquals(0.10, sim.missingCount(3) / 20_000.0, 0.01);
        assertEquals(0, sim.missingCount(1));
        // Nested and deterministic in the seed, like every model of the generators.
        DataSet small = truth.sample(500, 9);
        for (int r = 0; r < 500; r++) {
            assertEquals(sim.value(r, 2), small.value(r, 2));
            assertEquals(sim.isMissing(r, 0), small.isMissing(r, 0));
        }
    }

    @Test
    @DisplayName("bad inputs: names that differ from the data, or a graph with a cycle, are refused")
    void refusals() {
        Graph g = dag(List.of("a", "b", "c", "d"), "a->c", "b->c", "c->d");
        DataSet data = linear(g).sample(50, 1);
        Graph other = dag(List.of("a", "b", "c", "e"), "a->c");
        assertThrows(IllegalArgumentException.class, () -> StructureFit.fit(other, data));
        Graph cyclic = dag(List.of("a", "b", "c", "d"), "a->c", "c->d", "d->a");
        assertTrue(assertThrows(IllegalArgumentException.class, () -> StructureFit.fit(cyclic, data)).getMessage()
                .contains("DAG"));
    }
}
