package dev.touchstone.generators;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.hidden.HiddenOptions;
import dev.touchstone.generators.missing.MissingnessMechanisms;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.generators.models.NodeFunction;
import dev.touchstone.generators.models.NodeParameters;
import dev.touchstone.generators.networks.ReferenceNetworks;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.HashSet;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** A truth's parameters rebuild the same truth: same data bit for bit, for every model kind. */
class TruthParametersTest {

    static void assertSameData(DataSet a, DataSet b) {
        assertEquals(a.variables(), b.variables());
        assertEquals(a.rows(), b.rows());
        for (int j = 0; j < a.columns(); j++) {
            if (a.isDiscrete(j)) {
                assertArrayEquals(a.discrete(j), b.discrete(j), a.variable(j).name());
            } else {
                assertArrayEquals(a.continuous(j), b.continuous(j), 0.0, a.variable(j).name());
            }
        }
    }

    private static Simulation.Builder kind(String kind, Map<String, ?> model) {
        return Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 9, "mean_degree", 2.5))
                .model(ModelKinds.byId(kind), model);
    }

    @ParameterizedTest(name = "{0}, standardised and shuffled, with hidden variables and missing values")
    @ValueSource(strings = {"linear-gaussian", "linear-non-gaussian", "additive-nonlinear", "discrete",
            "conditional-gaussian"})
    void everyKindRebuildsTheSameData(String kind) {
        Map<String, Object> model = new java.util.HashMap<>(Map.of("shuffle_columns", true));
        if (!kind.equals("discrete")) {
            model.put("standardize", true);
        }
        if (kind.equals("additive-nonlinear")) {
            model.put("functions", "mixed");
        }
        if (kind.equals("linear-non-gaussian")) {
            model.put("noise", "student-t");
        }
        for (long seed = 1; seed <= 3; seed++) {
            Simulation sim = kind(kind, model).hidden(HiddenOptions.byId(HiddenOptions.RANDOM), Map.of("count", 2))
                    .missing(MissingnessMechanisms.byId(seed == 2 ? MissingnessMechanisms.MNAR
                            : MissingnessMechanisms.MAR), Map.of("rate", 0.2)).build();
            SimulatedTruth drawn = sim.drawTruth(seed * 101);
            TruthParameters parameters = drawn.parameters();
            SimulatedTruth rebuilt = parameters.truth();
            assertEquals(drawn.dag(), rebuilt.dag());
            assertEquals(drawn.model().columnOrder(), rebuilt.model().columnOrder());
            assertSameData(drawn.sample(700).data(), rebuilt.sample(700).data());
            assertEquals(drawn.populationCovariance().isPresent(), rebuilt.populationCovariance().isPresent());
            assertFalse(parameters.missingness().isEmpty());
            DataSet other = parameters.truth(seed).sample(200).data();
            DataSet same = drawn.sample(200).data();
            boolean differs = false;
            for (int j = 0; j < same.columns(); j++) {
                for (int r = 0; r < same.rows(); r++) {
                    differs |= Double.compare(same.value(r, j), other.value(r, j)) != 0;
                }
            }
            assertTrue(differs, "another data seed, other data");
        }
    }

    @Test
    void nonlinearFunctionsOfEveryClassAreWrittenOut() {
        Set<String> seen = new HashSet<>();
        for (String f : new String[] {"sigmoid", "polynomial", "neural-net", "fourier"}) {
            SimulatedTruth t = kind("additive-nonlinear", Map.of("functions", f)).build().drawTruth(5);
            for (NodeParameters n : t.parameters().model().nodes()) {
                NodeFunction fn = ((NodeParameters.Additive) n).function();
                seen.add(fn.word());
            }
            assertSameData(t.sample(300).data(), t.parameters().truth().sample(300).data());
        }
        assertEquals(Set.of("none", "sigmoid", "polynomial", "neural-net", "fourier"), seen);
    }

    @Test
    void referenceNetworksAndTiersComeBack() {
        SimulatedTruth chest = Simulation.builder().network(ReferenceNetworks.byId(ReferenceNetworks.CHEST_CLINIC))
                .build().drawTruth(9);
        assertSameData(chest.sample(2000).data(), chest.parameters().truth().sample(2000).data());
        NodeParameters.Table tub = (NodeParameters.Table) chest.parameters().model().nodes()
                .get(chest.dag().index("tub"));
        // Lauritzen and Spiegelhalter (1988): P(tub | asia) = 0.05, P(tub | no asia) = 0.01.
        assertArrayEquals(new double[] {0.99, 0.01}, tub.probabilities()[0], 0.0);
        assertArrayEquals(new double[] {0.95, 0.05}, tub.probabilities()[1], 0.0);

        SimulatedTruth layered = Simulation.builder()
                .graph(GraphFamilies.byId("layered"), Map.of("nodes", 10, "layers", 3, "edge_probability", 0.4))
                .model(ModelKinds.byId("linear-gaussian"), Map.of()).build().drawTruth(4);
        assertFalse(layered.knowledge().tiers().isEmpty());
        assertEquals(layered.knowledge().tiers(), layered.parameters().truth().knowledge().tiers());
        assertEquals(layered.populationCovariance().get().toArray().length,
                layered.parameters().truth().populationCovariance().get().toArray().length);
        assertArrayEquals(layered.populationCovariance().get().toArray(),
                layered.parameters().truth().populationCovariance().get().toArray(), 0.0);
    }

    @Test
    void mechanismsThatDoNotFitTheGraphAreRefused() {
        SimulatedTruth t = kind("linear-gaussian", Map.of()).build().drawTruth(3);
        TruthParameters p = t.parameters();
        var nodes = new java.util.ArrayList<>(p.model().nodes());
        int v = -1;
        for (int i = 0; i < nodes.size() && v < 0; i++) {
            if (t.dag().parents(i).length > 0) {
                v = i;
            }
        }
        assertTrue(v >= 0);
        NodeParameters.Linear l = (NodeParameters.Linear) nodes.get(v);
        nodes.set(v, new NodeParameters.Linear(l.variable(), l.parents(), new double[0], l.noise()));
        var broken = new dev.touchstone.generators.models.ModelParameters(p.model().kind(), p.model().dag(), nodes,
                p.model().columns(), p.model().standardisation());
        String m = assertThrows(IllegalArgumentException.class, broken::model).getMessage();
        assertTrue(m.contains("variable '" + l.variable() + "': 0 weights where"), m);
    }
}
