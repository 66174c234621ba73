package dev.touchstone.generators.models;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ModelKindsTest {

    private static StructuralModel draw(String kind, Graph dag, Map<String, ?> raw, long seed) {
        ModelKind k = ModelKinds.byId(kind);
        return k.draw(dag, k.resolve(raw), Seeds.random(seed));
    }

    private static void assertSameData(DataSet a, DataSet b) {
        assertEquals(a.names(), b.names());
        assertEquals(a.rows(), b.rows());
        for (int j = 0; j < a.columns(); j++) {
            if (a.isDiscrete(j)) {
                assertArrayEquals(a.discrete(j), b.discrete(j), a.variable(j).name());
            } else {
                assertArrayEquals(a.continuous(j), b.continuous(j), 0.0, a.variable(j).name());
            }
        }
    }

    private static Map<String, Object> optionsFor(String kind) {
        Map<String, Object> raw = new HashMap<>();
        if (!kind.equals("discrete")) {
            raw.put("standardize", true);
        }
        raw.put("shuffle_columns", true);
        return raw;
    }

    @ParameterizedTest(name = "{0}: same seed, same bytes; n rows are the prefix of N rows; other seed, other data")
    @ValueSource(strings = {"linear-gaussian", "linear-non-gaussian", "additive-nonlinear", "discrete",
            "conditional-gaussian"})
    void determinismAndPrefix(String kind) {
        Graph dag = LinearModelsTest.randomDag(12, 2.5, 41);
        StructuralModel m1 = draw(kind, dag, optionsFor(kind), 42);
        StructuralModel m2 = draw(kind, dag, optionsFor(kind), 42);
        assertSameData(m1.sample(1000, 43), m2.sample(1000, 43));
        assertSameData(m1.sample(1000, 43).head(300), m1.sample(300, 43));
        DataSet other = m1.sample(300, 44);
        DataSet base = m1.sample(300, 43);
        boolean differs = false;
        for (int j = 0; j < base.columns(); j++) {
            differs |= base.isDiscrete(j) ? !Arrays.equals(base.discrete(j), other.discrete(j))
                    : !Arrays.equals(base.continuous(j), other.continuous(j));
        }
        assertTrue(differs);
        assertEquals(ModelKinds.byId(kind).produces() == DataKind.MIXED ? DataKind.MIXED : m1.dataKind(),
                m1.dataKind());
    }

    @Test
    @DisplayName("shuffle_columns permutes the observed columns; without it they follow X1, X2, …")
    void shuffleColumns() {
        Graph dag = LinearModelsTest.randomDag(15, 2, 51);
        StructuralModel plain = draw("linear-gaussian", dag, Map.of(), 52);
        StructuralModel shuffled = draw("linear-gaussian", dag, Map.of("shuffle_columns", true), 52);
        assertEquals(dag.names(), plain.columnOrder());
        assertNotEquals(dag.names(), shuffled.columnOrder());
        assertEquals(new java.util.HashSet<>(dag.names()), new java.util.HashSet<>(shuffled.columnOrder()));
        assertEquals(shuffled.columnOrder(), shuffled.sample(5, 1).names());
    }

    @ParameterizedTest(name = "additive nonlinear, {0}: each variable with parents has variance ≈ 1 + σ² (unit-variance signal)")
    @ValueSource(strings = {"sigmoid", "polynomial", "neural-net", "fourier", "mixed"})
    void nonlinearScale(String functions) {
        Graph dag = LinearModelsTest.randomDag(10, 3, 61);
        double sigma = 0.5;
        StructuralModel m = draw("additive-nonlinear", dag, Map.of("functions", functions, "noise_scale_low", sigma,
                "noise_scale_high", sigma), 62);
        DataSet d = m.sample(20_000, 63);
        for (int v = 0; v < dag.size(); v++) {
            double[] x = d.continuous(d.indexOf(dag.name(v)));
            double[] mom = Moments.of(x, x.length);
            assertTrue(Double.isFinite(mom[1]));
            double expected = dag.parents(v).length == 0 ? sigma * sigma : 1 + sigma * sigma;
            assertEquals(expected, mom[1] * mom[1], 0.12 * expected, functions + " " + dag.name(v));
        }
    }

    @Test
    @DisplayName("random Fourier features: E[f(z) f(z')] ≈ exp(−|z − z'|²/(2ℓ²)) over draws (Rahimi and Recht 2007)")
    void fourierKernel() {
        ModelKind k = ModelKinds.byId("additive-nonlinear");
        var values = k.resolve(Map.of("fourier_features", 50, "length_scale", 1.0));
        UniformRandomProvider r = Seeds.random(71);
        int draws = 4000;
        double same = 0;
        double near = 0;
        double far = 0;
        for (int i = 0; i < draws; i++) {
            NodeFunction f = NodeFunction.draw("fourier", 1, values, r);
            double f0 = f.apply(new double[] {0});
            same += f0 * f0;
            near += f0 * f.apply(new double[] {1});
            far += f0 * f.apply(new double[] {3});
        }
        assertEquals(1.0, same / draws, 0.1);
        assertEquals(Math.exp(-0.5), near / draws, 0.1);
        assertEquals(Math.exp(-4.5), far / draws, 0.1);
    }

    @Test
    @DisplayName("Dirichlet concentration: tiny gives near-deterministic tables, large gives near-uniform ones (common practice)")
    void dirichletConcentration() {
        Graph empty = Graph.empty(List.of("A", "B", "C", "D", "E", "F", "G", "H", "I", "J"));
        DataSet sharp = draw("discrete", empty, Map.of("concentration", 0.01), 81).sample(5000, 82);
        DataSet flat = draw("discrete", empty, Map.of("concentration", 1000.0, "categories_low", 2,
                "categories_high", 2), 81).sample(5000, 82);
        int sharpCount = 0;
        for (int j = 0; j < 10; j++) {
            if (maxShare(sharp.discrete(j), sharp.variable(j).cardinality()) > 0.9) {
                sharpCount++;
            }
            assertEquals(0.5, maxShare(flat.discrete(j), 2), 0.05);
        }
        assertTrue(sharpCount >= 8, sharpCount + " of 10");
    }

    private static double maxShare(int[] codes, int k) {
        int[] c = new int[k];
        for (int x : codes) {
            c[x]++;
        }
        return Arrays.stream(c).max().orElse(0) / (double) codes.length;
    }

    @Test
    @DisplayName("conditional Gaussian: discrete variables in their category range, a discrete share near discrete_fraction")
    void conditionalGaussian() {
        Graph dag = LinearModelsTest.randomDag(200, 2, 91);
        StructuralModel m = draw("conditional-gaussian", dag, Map.of("discrete_fraction", 0.3), 92);
        assertEquals(DataKind.MIXED, m.dataKind());
        DataSet d = m.sample(2000, 93);
        int discrete = 0;
        for (int j = 0; j < d.columns(); j++) {
            if (d.isDiscrete(j)) {
                discrete++;
                for (int c : d.discrete(j)) {
                    assertTrue(c >= 0 && c < d.variable(j).cardinality());
                }
            } else {
                for (double x : d.continuous(j)) {
                    assertTrue(Double.isFinite(x));
                }
            }
        }
        assertEquals(0.3, discrete / 200.0, 4 * Math.sqrt(0.21 / 200));
    }

    @Test
    @DisplayName("multinomial logistic link: P(b = 1 | a) follows the logistic of the standardised parent (worked check)")
    void logisticLink() {
        // Two categories, α = 0 and β = (0, 1): P(b = 1 | z) = 1 / (1 + e^(−z)).
        MixedMechanisms.Discrete child = new MixedMechanisms.Discrete(1, 2,
                new MixedMechanisms.Intercepts(new int[0], new int[0], new double[][] {{0, 0}}),
                new MixedMechanisms.Standardised(new int[] {0}, new double[] {0}, new double[] {1}),
                new double[][] {{0}, {1}});
        int n = 200_000;
        double[] a = new double[n];
        var g = org.apache.commons.rng.sampling.distribution.ZigguratSampler.NormalizedGaussian.of(Seeds.random(1));
        for (int r = 0; r < n; r++) {
            a[r] = g.sample();
        }
        Object[] cols = {a, null};
        child.fill(cols, n, Seeds.random(2));
        int[] b = (int[]) cols[1];
        for (double centre : new double[] {-1.5, 0, 1.5}) {
            int in = 0;
            int ones = 0;
            for (int r = 0; r < n; r++) {
                if (Math.abs(a[r] - centre) < 0.05) {
                    in++;
                    ones += b[r];
                }
            }
            double expected = 1 / (1 + Math.exp(-centre));
            assertEquals(expected, ones / (double) in, 4 * Math.sqrt(0.25 / in) + 0.02, "at z = " + centre);
        }
        assertFalse(Arrays.stream(b).allMatch(x -> x == b[0]));
    }

    @Test
    @DisplayName("an unknown model kind is refused with the known ids listed")
    void unknownKind() {
        String msg = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> ModelKinds.byId("gaussian-process")).getMessage();
        assertTrue(msg.contains("linear-gaussian") && msg.contains("conditional-gaussian"), msg);
    }
}
