package dev.touchstone.generators.fit;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.generators.models.ModelAssembly;
import dev.touchstone.generators.models.StructuralModel;
import dev.touchstone.generators.networks.ReferenceNetworks;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

class PerturbationAndChecksTest {

    @Test
    @DisplayName("perturbed truths are DAGs over the same variables, deterministic in the seed, with edge counts"
            + " within the density range")
    void perturbation() {
        Graph g = StructureFitTest.dag(List.of("a", "b", "c", "d"), "a->c", "b->c", "c->d");
        DataSet data = StructureFitTest.linear(g).sample(1000, 4);
        FittedModel fit = StructureFit.fit(g, data);
        Perturbation p = Perturbation.defaults();
        boolean anyDifferent = false;
        for (int k = 0; k < 20; k++) {
            FittedTruth t = p.apply(fit, data, "v", Seeds.derive(7, k));
            assertTrue(Ancestry.isAcyclic(t.dag()));
            assertEquals(g.names(), t.dag().names());
            assertTrue(t.dag().edgeCount() >= 2 && t.dag().edgeCount() <= 4, "edges " + t.dag().edgeCount());
            assertEquals(t.dag(), p.apply(fit, data, "v", Seeds.derive(7, k)).dag());
            anyDifferent |= !t.dag().equals(g);
            DataSet a = t.sample(50, 3);
            DataSet b = p.apply(fit, data, "v", Seeds.derive(7, k)).sample(50, 3);
            for (int r = 0; r < 50; r++) {
                assertEquals(a.value(r, 3), b.value(r, 3));
            }
        }
        assertTrue(anyDifferent);
        // Discrete data: variants stay sampleable (tables re-fitted over the new parents).
        DataSet asia = ReferenceNetworks.chestClinic().model().sample(2000, 1);
        FittedModel asiaFit = StructureFit.fit(ReferenceNetworks.chestClinic().dag(), asia);
        FittedTruth v = p.apply(asiaFit, asia, "v", 99);
        assertEquals(300, v.sample(300, 1).rows());
    }

    @Test
    @DisplayName("Jarque–Bera (Jarque and Bera 1980): Gaussian residuals pass, exponential residuals fail; JB"
            + " p-value equals the χ²(2) tail of Commons Math at the statistic")
    void normalityCheck() {
        Graph g = StructureFitTest.dag(List.of("x", "y"), "x->y");
        UniformRandomProvider rng = Seeds.random(3);
        int n = 3000;
        double[] x = new double[n];
        double[] yGauss = new double[n];
        double[] yExp = new double[n];
        var normal = org.apache.commons.rng.sampling.distribution.ZigguratSampler.NormalizedGaussian.of(rng);
        for (int i = 0; i < n; i++) {
            x[i] = normal.sample();
            yGauss[i] = 0.5 * x[i] + normal.sample();
            yExp[i] = 0.5 * x[i] - Math.log(rng.nextDouble());
        }
        FitDiagnostics.Check gauss = FitDiagnostics.of(StructureFit.fit(g, DataSet.builder(n).continuous("x", x)
                .continuous("y", yGauss).build())).get(1);
        FitDiagnostics.Check exp = FitDiagnostics.of(StructureFit.fit(g, DataSet.builder(n).continuous("x", x)
                .continuous("y", yExp).build())).get(1);
        assertTrue(gauss.residuals().normalityP() > 0.001, "Gaussian p " + gauss.residuals().normalityP());
        assertTrue(exp.residuals().normalityP() < 1e-6, "exponential p " + exp.residuals().normalityP());
        // Exponential noise: skewness 2, excess kurtosis 6 (textbook moments).
        assertEquals(2.0, exp.residuals().skewness(), 0.4);
        assertEquals(6.0, exp.residuals().excessKurtosis(), 2.5);
        FitDiagnostics.Residuals gr = gauss.residuals();
        double jb = n / 6.0 * (gr.skewness() * gr.skewness() + gr.excessKurtosis() * gr.excessKurtosis() / 4);
        assertEquals(1 - new ChiSquaredDistribution(2).cumulativeProbability(jb), gr.normalityP(), 1e-12);
        assertNull(FitDiagnostics.of(StructureFit.fit(g, DataSet.builder(n).continuous("x", x)
                .continuous("y", yGauss).build())).get(0).residuals().nonlinearityP(),
                "no parents, no nonlinearity test");
    }

    @Test
    @DisplayName("RESET-type check (Ramsey 1969): y = x² + noise is flagged, y = x + noise is not")
    void nonlinearityCheck() {
        Graph g = StructureFitTest.dag(List.of("x", "y"), "x->y");
        StructuralModel lin = ModelAssembly.builder(g)
                .gaussian("x", 1.0, List.of(), new double[0], List.of(), new double[0][], 1.0)
                .gaussian("y", 0.0, List.of("x"), new double[] {1.0}, List.of(), new double[0][], 1.0)
                .build("t");
        DataSet linear = lin.sample(2000, 8);
        double[] x = linear.continuous(0);
        double[] y = new double[x.length];
        UniformRandomProvider rng = Seeds.random(5);
        var normal = org.apache.commons.rng.sampling.distribution.ZigguratSampler.NormalizedGaussian.of(rng);
        for (int i = 0; i < x.length; i++) {
            y[i] = x[i] * x[i] + normal.sample();
        }
        DataSet quadratic = DataSet.builder(x.length).continuous("x", x).continuous("y", y).build();
        double pLinear = FitDiagnostics.of(StructureFit.fit(g, linear)).get(1).residuals().nonlinearityP();
        double pQuad = FitDiagnostics.of(StructureFit.fit(g, quadratic)).get(1).residuals().nonlinearityP();
        assertTrue(pLinear > 0.001, "linear p " + pLinear);
        assertTrue(pQuad < 1e-10, "quadratic p " + pQuad);
        assertNotEquals(pLinear, pQuad);
    }
}
