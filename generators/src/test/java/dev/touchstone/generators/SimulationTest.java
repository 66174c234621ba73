package dev.touchstone.generators;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.hidden.HiddenOptions;
import dev.touchstone.generators.missing.MissingnessMechanisms;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.generators.networks.ReferenceNetworks;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SimulationTest {

    private static Simulation.Builder base() {
        return Simulation.builder()
                .graph(GraphFamilies.byId("layered"), Map.of("nodes", 15, "layers", 3, "edge_probability", 0.3))
                .model(ModelKinds.byId("linear-non-gaussian"), Map.of("noise", "laplace", "standardize", true,
                        "shuffle_columns", true))
                .hidden(HiddenOptions.byId("confounders"), Map.of("count", 2));
    }

    private static void assertSameData(DataSet a, DataSet b) {
        assertEquals(a.names(), b.names());
        for (int j = 0; j < a.columns(); j++) {
            assertArrayEquals(a.continuous(j), b.continuous(j), 0.0, a.variable(j).name());
        }
    }

    @Test
    @DisplayName("the same replicate seed gives identical truth and identical bytes")
    void deterministic() {
        Simulation sim = base().missing(MissingnessMechanisms.byId("mar"), Map.of("rate", 0.2)).build();
        SimulatedTruth a = sim.drawTruth(77);
        SimulatedTruth b = sim.drawTruth(77);
        assertEquals(a.dag(), b.dag());
        assertEquals(a.missingnessDrivers(), b.missingnessDrivers());
        assertSameData(a.sample(500).data(), b.sample(500).data());
    }

    @Test
    @DisplayName("nested sample sizes: the 200-row data set is the prefix of the 2,000-row one, missing cells included")
    void nestedPrefix() {
        Simulation sim = base().missing(MissingnessMechanisms.byId("mnar"), Map.of("rate", 0.2)).build();
        SimulatedTruth t = sim.drawTruth(5);
        assertSameData(t.sample(2000).data().head(200), t.sample(200).data());
    }

    @Test
    @DisplayName("changing the missingness leaves graph, parameters and every observed value unchanged")
    void settingsAreIndependent() {
        SimulatedTruth complete = base().build().drawTruth(9);
        SimulatedTruth masked = base().missing(MissingnessMechanisms.byId("mcar"), Map.of("rate", 0.3)).build()
                .drawTruth(9);
        assertEquals(complete.dag(), masked.dag());
        DataSet a = complete.sample(300).data();
        DataSet b = masked.sample(300).data();
        int masks = 0;
        for (int j = 0; j < a.columns(); j++) {
            for (int r = 0; r < 300; r++) {
                if (b.isMissing(r, j)) {
                    masks++;
                } else {
                    assertEquals(a.value(r, j), b.value(r, j), 0.0);
                }
            }
        }
        assertTrue(masks > 0);
    }

    @Test
    @DisplayName("different replicate seeds give different graphs; one replicate's seed never changes another's data")
    void replicatesAreIndependent() {
        Simulation sim = base().build();
        SimulatedTruth r1 = sim.drawTruth(1);
        SimulatedTruth r2 = sim.drawTruth(2);
        assertFalse(r1.dag().equals(r2.dag()));
        assertSameData(r1.sample(100).data(), sim.drawTruth(1).sample(100).data());
    }

    @Test
    @DisplayName("hidden variables: the data omit them, the truth flags them, and tiers cover observed variables only")
    void hiddenAndKnowledge() {
        SimulatedTruth t = base().build().drawTruth(3);
        DataSet d = t.sample(50).data();
        assertEquals(t.dag().size() - t.dag().hiddenNames().size(), d.columns());
        for (String h : t.dag().hiddenNames()) {
            assertEquals(-1, d.indexOf(h));
            assertEquals(-1, t.knowledge().tierOf(h));
        }
        assertEquals(3, t.knowledge().tiers().size());
        t.knowledge().checkVariables(d.names());
        assertEquals(d.names(), t.model().columnOrder());
        assertTrue(t.populationCovariance().isPresent());
        assertEquals(d.names(), t.populationCovariance().get().names());
    }

    @Test
    @DisplayName("a reference network can be simulated with a hidden variable and missing values")
    void network() {
        Simulation sim = Simulation.builder().network(ReferenceNetworks.byId("community-garden"))
                .hidden(HiddenOptions.byId("confounders"), Map.of("count", 1))
                .missing(MissingnessMechanisms.byId("mcar"), Map.of("rate", 0.1)).build();
        SimulatedReplicate rep = sim.drawTruth(4).sample(1000);
        assertEquals(1, rep.dag().hiddenNames().size());
        assertEquals(9, rep.data().columns());
        assertTrue(rep.data().hasMissing());
        assertFalse(rep.audit().isDefined());
    }

    @Test
    @DisplayName("a simulation needs a family and a kind, or a network, not both")
    void builderRules() {
        assertThrows(IllegalStateException.class, () -> Simulation.builder().build());
        assertThrows(IllegalStateException.class, () -> Simulation.builder()
                .network(ReferenceNetworks.chestClinic())
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of()).build());
        List<String> names = base().build().drawTruth(1).causalOrder();
        assertEquals(15, names.size());
        assertFalse(Arrays.asList(names.toArray()).isEmpty());
    }
}
