package dev.touchstone.learners.continuous;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.SimulatedReplicate;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.metrics.scoring.EdgeCounts;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class NotearsLearnerTest {

    private static Estimate learn(SimulatedReplicate r, Knowledge k, Map<String, ?> raw) {
        NotearsLearner l = new NotearsLearner();
        ParameterValues pv = ParameterValues.resolve(NotearsLearner.ID, l.description().parameters(), raw);
        return l.learn(LearnerInput.of(r.data()), k, pv, RunContext.unlimited(1));
    }

    private static long shd(Graph truth, Graph est) {
        return EdgeCounts.of(truth, est).differingPairs();
    }

    private static Simulation equalVariance(int nodes) {
        // Noise scales 1..1: equal error variances, so the DAG is identifiable.
        return Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", nodes, "mean_degree", 2))
                .model(ModelKinds.byId("linear-gaussian"), Map.of("noise_scale_low", 1.0, "noise_scale_high", 1.0))
                .build();
    }

    @Test
    @DisplayName("Mean SHD to the true DAG ≤ 1 over 10 linear Gaussian SEMs with equal noise variances, 6 variables,"
            + " n = 10,000 (identifiable: Peters and Bühlmann 2014; NOTEARS, Zheng et al. 2018; bound chosen here,"
            + " common practice)")
    void smallShdOnEqualVarianceModels() {
        Simulation sim = equalVariance(6);
        long total = 0;
        StringBuilder detail = new StringBuilder();
        int reps = 10;
        for (int rep = 0; rep < reps; rep++) {
            SimulatedReplicate r = sim.drawTruth(500 + rep).sample(10_000);
            Graph est = learn(r, Knowledge.none(), Map.of()).graph();
            long s = shd(r.dag(), est);
            total += s;
            detail.append(s).append(' ');
        }
        assertTrue(total / (double) reps <= 1.0, "mean SHD " + total / (double) reps + " (per replicate: " + detail + ")");
    }

    @Test
    @DisplayName("The estimate is acyclic, and the unthresholded solution has h ≤ acyclicity_tolerance or ρ at its cap"
            + " (Zheng et al. 2018, Algorithm 1)")
    void acyclicAndConverged() {
        SimulatedReplicate r = equalVariance(10).drawTruth(42).sample(2000);
        Estimate e = learn(r, Knowledge.none(), Map.of("weight_threshold", 0.0));
        assertTrue(Ancestry.isAcyclic(e.graph()));
        assertTrue(e.extras().get("acyclicity") <= 1e-8 || e.extras().get("penalty_rho") >= 1e16, e.extras().toString());
    }

    @Test
    @DisplayName("A forbidden edge is never returned (knowledge held at weight 0; common practice)")
    void honoursForbiddenEdges() {
        SimulatedReplicate r = equalVariance(5).drawTruth(3).sample(5000);
        Graph truth = r.dag();
        Knowledge.Builder kb = Knowledge.builder();
        int forbidden = 0;
        for (var edge : truth.edges()) {
            int from = edge.isDirectedFrom(edge.a()) ? edge.a() : edge.b();
            kb.forbid(truth.name(from), truth.name(edge.other(from)));
            forbidden++;
        }
        assertTrue(forbidden > 0);
        Graph est = learn(r, kb.build(), Map.of()).graph();
        for (var edge : truth.edges()) {
            int from = edge.isDirectedFrom(edge.a()) ? edge.a() : edge.b();
            assertFalse(est.hasDirected(est.index(truth.name(from)), est.index(truth.name(edge.other(from)))));
        }
    }

    @Test
    @DisplayName("The cycle repair removes the weakest edge of a 3-cycle and nothing else (rule stated in NotearsLearner)")
    void cycleRepairDropsWeakestEdge() {
        double[] w = {
            0, 0.9, 0, 0,
            0, 0, 0.8, 0,
            0.35, 0, 0, 0.5,
            0, 0, 0, 0};
        assertEquals(1, CycleBreaker.breakCycles(w, 4));
        assertEquals(0.0, w[2 * 4]);
        assertEquals(0.9, w[1]);
        assertEquals(0.5, w[2 * 4 + 3]);
        assertEquals(0.0, Acyclicity.value(w, 4), 0.0);
    }
}
