package dev.touchstone.learners.functional;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.SimulatedReplicate;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.models.ModelKinds;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.UniformRealDistribution;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DirectLingamLearnerTest {

    private static Simulation uniformNoise(int nodes) {
        return Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", nodes, "mean_degree", 2))
                .model(ModelKinds.byId("linear-non-gaussian"), Map.of("noise", "uniform"))
                .build();
    }

    private static Graph learn(DataSet d, Map<String, ?> raw) {
        DirectLingamLearner l = new DirectLingamLearner();
        ParameterValues pv = ParameterValues.resolve(DirectLingamLearner.ID, l.description().parameters(), raw);
        return l.learn(LearnerInput.of(d), Knowledge.none(), pv, RunContext.unlimited(1)).graph();
    }

    @Test
    @DisplayName("Recovers the exact DAG on 6 variables, uniform noise, n = 5,000 in at least 18 of 20 replicates"
            + " (Shimizu et al. 2011; the 90 % bar is chosen here, common practice)")
    void recoversSmallDagsExactly() {
        Simulation sim = uniformNoise(6);
        int exact = 0;
        List<String> misses = new ArrayList<>();
        for (int rep = 0; rep < 20; rep++) {
            SimulatedReplicate r = sim.drawTruth(7000 + rep).sample(5000);
            Graph est = learn(r.data(), Map.of());
            if (est.sameEdges(r.dag())) {
                exact++;
            } else {
                misses.add("replicate " + rep + ": true " + r.dag().edges() + " got " + est.edges());
            }
        }
        assertTrue(exact >= 18, exact + " of 20 exact; " + misses);
    }

    @Test
    @DisplayName("The causal order puts every true parent before its child on 10 variables with Laplace noise"
            + " (identifiability of LiNGAM, Shimizu et al. 2006; common practice)")
    void orderIsConsistentWithTheTruth() {
        Simulation sim = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 10, "mean_degree", 2))
                .model(ModelKinds.byId("linear-non-gaussian"), Map.of("noise", "laplace"))
                .build();
        int consistent = 0;
        for (int rep = 0; rep < 5; rep++) {
            SimulatedReplicate r = sim.drawTruth(300 + rep).sample(5000);
            int[] order = DirectLingamLearner.causalOrder(r.data(), RunContext.unlimited(1));
            int[] position = new int[order.length];
            for (int k = 0; k < order.length; k++) {
                position[order[k]] = k;
            }
            boolean ok = true;
            Graph dag = r.dag();
            for (int v = 0; v < dag.size(); v++) {
                for (int parent : dag.parents(v)) {
                    ok &= position[parent] < position[v];
                }
            }
            consistent += ok ? 1 : 0;
        }
        assertTrue(consistent >= 4, consistent + " of 5 orders consistent with the true DAG");
    }

    @Test
    @DisplayName("On a two-variable uniform-noise pair the likelihood ratio favours the true direction, and on"
            + " Gaussian data its entropy approximation is near the Gaussian maximum (Hyvärinen and Smith 2013;"
            + " Hyvärinen 1998)")
    void likelihoodRatioPointsTheRightWay() {
        int n = 20000;
        UniformRealDistribution u = new UniformRealDistribution(
                new org.apache.commons.math3.random.Well19937c(3), -1, 1);
        double[] x = u.sample(n);
        double[] e = u.sample(n);
        double[] y = new double[n];
        for (int r = 0; r < n; r++) {
            y[r] = 0.8 * x[r] + e[r];
        }
        DirectLingamLearner.standardise(x);
        DirectLingamLearner.standardise(y);
        double hx = PairwiseLikelihoodRatio.entropy(x);
        double hy = PairwiseLikelihoodRatio.entropy(y);
        assertTrue(PairwiseLikelihoodRatio.ratio(x, y, hx, hy) > 0, "x → y should be favoured");
        assertTrue(PairwiseLikelihoodRatio.ratio(y, x, hy, hx) < 0, "y → x should be disfavoured");

        double[] z = new NormalDistribution(new org.apache.commons.math3.random.Well19937c(4), 0, 1).sample(n);
        DirectLingamLearner.standardise(z);
        // The approximation is exact-ish for the Gaussian: E log cosh z ≈ γ and E z e^{−z²/2} = 0.
        assertEquals(PairwiseLikelihoodRatio.GAUSSIAN_ENTROPY, PairwiseLikelihoodRatio.entropy(z), 2e-3);
        // A standardised uniform has entropy log(2√3) ≈ 1.2425 < 1.4189; the approximation is below the maximum.
        assertTrue(hx < PairwiseLikelihoodRatio.GAUSSIAN_ENTROPY - 0.05, "uniform entropy " + hx);
    }

    @Test
    @DisplayName("Threshold pruning keeps exactly the coefficients above the threshold (least squares, common"
            + " practice): an infinite threshold gives the empty graph, a zero threshold a complete order")
    void thresholdPruningBounds() {
        SimulatedReplicate r = uniformNoise(5).drawTruth(11).sample(2000);
        Graph none = learn(r.data(), Map.of("pruning", "weight-threshold", "weight_threshold", 1e9));
        assertEquals(0, none.edgeCount());
        Graph all = learn(r.data(), Map.of("pruning", "weight-threshold", "weight_threshold", 0.0));
        assertEquals(10, all.edgeCount(), "complete DAG over the estimated order");
    }

    @Test
    @DisplayName("The causal order is the same with 1 and 3 threads (results identical for any thread count)")
    void threadCountDoesNotChangeTheOrder() {
        SimulatedReplicate r = uniformNoise(12).drawTruth(21).sample(1000);
        int[] one = DirectLingamLearner.causalOrder(r.data(), RunContext.unlimited(1));
        int[] three = DirectLingamLearner.causalOrder(r.data(), RunContext.of(1, null, 3));
        org.junit.jupiter.api.Assertions.assertArrayEquals(one, three);
    }

    @Test
    @DisplayName("Negative control: with Gaussian noise the DAG is not identifiable and exact recovery drops well"
            + " below the uniform-noise rate (Shimizu et al. 2006: at most one Gaussian noise term)")
    void gaussianNoiseIsNotIdentifiable() {
        Simulation sim = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 6, "mean_degree", 2))
                .model(ModelKinds.byId("linear-gaussian"), Map.of())
                .build();
        int exact = 0;
        for (int rep = 0; rep < 20; rep++) {
            SimulatedReplicate r = sim.drawTruth(7000 + rep).sample(5000);
            exact += learn(r.data(), Map.of()).sameEdges(r.dag()) ? 1 : 0;
        }
        assertTrue(exact <= 10, exact + " of 20 exact on Gaussian data");
    }
}
