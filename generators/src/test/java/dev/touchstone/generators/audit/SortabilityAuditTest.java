package dev.touchstone.generators.audit;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.SimulatedTruth;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.models.ModelKinds;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SortabilityAuditTest {

    @Test
    @DisplayName("worked example: chain a → b → c has 3 (length, pair) paths; increasing criterion 1, decreasing 0, ties 1/2")
    void chain() {
        Graph chain = Graph.builder(List.of("a", "b", "c")).addDirected(0, 1).addDirected(1, 2).freeze();
        int[] node = {0, 1, 2};
        assertEquals(1.0, SortabilityAudit.sortability(chain, node, new double[] {1, 2, 3}), 0);
        assertEquals(0.0, SortabilityAudit.sortability(chain, node, new double[] {3, 2, 1}), 0);
        assertEquals(0.5, SortabilityAudit.sortability(chain, node, new double[] {1, 1, 1}), 0);
        // a→b right, b→c wrong, a→c (length 2) right: 2 of 3.
        assertEquals(2.0 / 3, SortabilityAudit.sortability(chain, node, new double[] {1, 3, 2}), 1e-15);
    }

    @Test
    @DisplayName("a pair joined by paths of two lengths counts twice (Reisach et al. 2021 count per path length)")
    void pathLengths() {
        // a → b → c and a → c: (a,c) is joined by paths of length 1 and 2.
        Graph g = Graph.builder(List.of("a", "b", "c")).addDirected(0, 1).addDirected(1, 2).addDirected(0, 2).freeze();
        DataSet d = DataSet.builder(3).continuous("a", new double[] {0, 1, 2}).continuous("b", new double[] {0, 2, 4})
                .continuous("c", new double[] {0, 3, 5}).build();
        SortabilityAudit a = SortabilityAudit.of(g, d);
        assertEquals(4, a.pathPairs());
        assertEquals(1.0, a.varsortability(), 0);
    }

    @Test
    @DisplayName("R² is left out above R2_MAX_VARIABLES, varsortability is still the worked fraction (chain of increasing variances: 1)")
    void rSquaredSkippedForManyVariables() {
        int p = SortabilityAudit.R2_MAX_VARIABLES + 1;
        dev.touchstone.core.graph.MutableGraph b = Graph.builder(java.util.stream.IntStream.range(0, p).mapToObj(i -> "x" + i).toList());
        DataSet.Builder d = DataSet.builder(3);
        for (int i = 0; i < p; i++) {
            if (i > 0) {
                b.addDirected(i - 1, i);
            }
            // Variance grows along the chain: (i+1)² times that of {-1, 0, 1}.
            d.continuous("x" + i, new double[] {-(i + 1), 0, i + 1});
        }
        SortabilityAudit a = SortabilityAudit.of(b.freeze(), d.build());
        assertTrue(a.r2Skipped());
        assertTrue(Double.isNaN(a.r2Sortability()));
        assertEquals(1.0, a.varsortability(), 0);
        assertEquals((long) p * (p - 1) / 2, a.pathPairs(), "a chain joins every ordered pair by one path");
    }

    private static double meanAudit(boolean standardize, boolean r2) {
        Simulation sim = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 20, "mean_degree", 2))
                .model(ModelKinds.byId("linear-gaussian"), Map.of("edge_weight_low", 0.5, "edge_weight_high", 2.0,
                        "edge_weight_random_sign", true, "noise_scale_low", 1.0, "noise_scale_high", 1.0,
                        "standardize", standardize))
                .build();
        double s = 0;
        int reps = 10;
        for (int i = 0; i < reps; i++) {
            SimulatedTruth t = sim.drawTruth(100 + i);
            SortabilityAudit a = t.sample(2000).audit();
            s += r2 ? a.r2Sortability() : a.varsortability();
        }
        return s / reps;
    }

    @Test
    @DisplayName("varsortability near 1 on raw linear Gaussian data with weights ±[0.5, 2], equal noise; near 0.5 standardised (Reisach et al. 2021, from memory; wide tolerances)")
    void varsortabilityRawAndStandardised() {
        double raw = meanAudit(false, false);
        double standardised = meanAudit(true, false);
        assertTrue(raw > 0.85, "raw " + raw);
        assertEquals(0.5, standardised, 0.12, "standardised " + standardised);
    }

    @Test
    @DisplayName("R²-sortability is scale-invariant: standardising leaves it (nearly) unchanged (Reisach et al. 2023)")
    void r2ScaleInvariant() {
        double raw = meanAudit(false, true);
        double standardised = meanAudit(true, true);
        assertEquals(raw, standardised, 1e-6);
        assertTrue(raw > 0.5, "R2-sortability " + raw);
    }

    @Test
    @DisplayName("discrete data: the audit is undefined (NaN), not a made-up number")
    void discreteUndefined() {
        Simulation sim = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 6, "mean_degree", 2))
                .model(ModelKinds.byId("discrete"), Map.of()).build();
        SortabilityAudit a = sim.drawTruth(1).sample(200).audit();
        assertFalse(a.isDefined());
        assertTrue(Double.isNaN(a.r2Sortability()));
    }
}
