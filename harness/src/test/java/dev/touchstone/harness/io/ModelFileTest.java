package dev.touchstone.harness.io;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.SimulatedTruth;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.TruthParameters;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.hidden.HiddenOptions;
import dev.touchstone.generators.missing.MissingnessMechanisms;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.generators.models.NodeParameters;
import dev.touchstone.generators.networks.ReferenceNetworks;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Model-parameter files: exact round trips, and the written numbers describe the data drawn. */
class ModelFileTest {

    @TempDir
    Path dir;

    private static void assertSameData(DataSet a, DataSet b) {
        assertEquals(a.variables(), b.variables());
        for (int j = 0; j < a.columns(); j++) {
            if (a.isDiscrete(j)) {
                assertArrayEquals(a.discrete(j), b.discrete(j), a.variable(j).name());
            } else {
                assertArrayEquals(a.continuous(j), b.continuous(j), 0.0, a.variable(j).name());
            }
        }
    }

    private TruthParameters throughFile(SimulatedTruth t) throws IOException {
        Path f = dir.resolve("model.json");
        ModelFile.write(f, t.parameters());
        TruthParameters back = ModelFile.read(f);
        assertEquals(Files.readString(f), ModelFile.toJson(back), "reading and writing again gives the same text");
        return back;
    }

    @ParameterizedTest(name = "{0}: written, read back, same data")
    @ValueSource(strings = {"linear-gaussian", "linear-non-gaussian", "additive-nonlinear", "discrete",
            "conditional-gaussian"})
    void everyKindComesBackExactly(String kind) throws IOException {
        Map<String, Object> model = new HashMap<>(Map.of("shuffle_columns", true));
        if (!kind.equals("discrete")) {
            model.put("standardize", true);
        }
        if (kind.equals("additive-nonlinear")) {
            model.put("functions", "mixed");
        }
        if (kind.equals("linear-non-gaussian")) {
            model.put("noise", "student-t");
        }
        SimulatedTruth t = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 8, "mean_degree", 2.5))
                .model(ModelKinds.byId(kind), model)
                .hidden(HiddenOptions.byId(HiddenOptions.RANDOM), Map.of("count", 1))
                .missing(MissingnessMechanisms.byId(MissingnessMechanisms.MAR), Map.of("rate", 0.15))
                .build().drawTruth(77);
        SimulatedTruth back = throughFile(t).truth();
        assertEquals(t.dag(), back.dag());
        assertSameData(t.sample(800).data(), back.sample(800).data());
    }

    @Test
    void linearGaussianCovarianceMatchesTheWrittenParameters() throws IOException {
        // Σ = (I − B)⁻¹ Ω (I − B)⁻ᵀ (common practice for linear SEMs), computed with Commons Math from the
        // weights and noise scales read back from the file, against the sample covariance of 1,000,000 rows.
        SimulatedTruth t = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 4, "mean_degree", 2.0))
                .model(ModelKinds.byId("linear-gaussian"), Map.of()).build().drawTruth(12);
        TruthParameters written = throughFile(t);
        Graph dag = written.model().dag();
        int p = dag.size();
        RealMatrix b = new Array2DRowRealMatrix(p, p);
        RealMatrix omega = new Array2DRowRealMatrix(p, p);
        for (int v = 0; v < p; v++) {
            NodeParameters.Linear l = (NodeParameters.Linear) written.model().nodes().get(v);
            for (int k = 0; k < l.parents().size(); k++) {
                b.setEntry(v, dag.index(l.parents().get(k)), l.weights()[k]);
            }
            omega.setEntry(v, v, l.noise().scale() * l.noise().scale());
        }
        assertTrue(dag.edgeCount() > 0, "the check needs edges");
        RealMatrix inv = MatrixUtils.inverse(MatrixUtils.createRealIdentityMatrix(p).subtract(b));
        RealMatrix sigma = inv.multiply(omega).multiply(inv.transpose());
        int n = 1_000_000;
        DataSet data = t.sample(n).data();
        double[][] x = new double[p][];
        double[] mean = new double[p];
        for (int v = 0; v < p; v++) {
            x[v] = data.continuous(data.indexOf(dag.name(v)));
            for (double value : x[v]) {
                mean[v] += value / n;
            }
        }
        for (int i = 0; i < p; i++) {
            for (int j = 0; j <= i; j++) {
                double s = 0;
                for (int r = 0; r < n; r++) {
                    s += (x[i][r] - mean[i]) * (x[j][r] - mean[j]);
                }
                s /= n - 1;
                // Var(s_ij) ≈ (Σ_ii Σ_jj + Σ_ij²) / n for Gaussian data (Wishart moments).
                double se = Math.sqrt((sigma.getEntry(i, i) * sigma.getEntry(j, j)
                        + sigma.getEntry(i, j) * sigma.getEntry(i, j)) / n);
                assertEquals(sigma.getEntry(i, j), s, 5 * se, "Σ[" + dag.name(i) + ", " + dag.name(j) + "]");
            }
        }
    }

    @Test
    void chestClinicTablesReproduceItsMarginals() throws IOException {
        // Lauritzen and Spiegelhalter (1988), marginals as widely reproduced (from memory): P(tub) = 0.0104,
        // P(lung) = 0.055, P(bronc) = 0.45, P(either) = 0.064828, P(xray) = 0.11029, P(dysp) = 0.43597.
        SimulatedTruth t = Simulation.builder().network(ReferenceNetworks.byId(ReferenceNetworks.CHEST_CLINIC))
                .build().drawTruth(31);
        TruthParameters written = throughFile(t);
        Graph dag = written.model().dag();
        int p = dag.size();
        double[] joint = new double[1 << p];
        for (int config = 0; config < joint.length; config++) {
            double prob = 1;
            for (int v = 0; v < p; v++) {
                NodeParameters.Table table = (NodeParameters.Table) written.model().nodes().get(v);
                int row = 0;
                for (String parent : table.parents()) {
                    row = row * 2 + ((config >> dag.index(parent)) & 1);
                }
                prob *= table.probabilities()[row][(config >> v) & 1];
            }
            joint[config] = prob;
        }
        Map<String, Double> published = Map.of("tub", 0.0104, "lung", 0.055, "bronc", 0.45, "either", 0.064828,
                "xray", 0.11029, "dysp", 0.43597);
        for (Map.Entry<String, Double> e : published.entrySet()) {
            assertEquals(e.getValue(), marginal(joint, List.of(dag.index(e.getKey()))), 5e-6, e.getKey());
        }
        // Pairwise joint marginals from the written tables against 200,000 rows drawn, within 4 binomial SE.
        int n = 200_000;
        DataSet data = t.sample(n).data();
        String[][] pairs = {{"either", "xray"}, {"bronc", "dysp"}, {"smoke", "dysp"}, {"asia", "either"}};
        for (String[] pair : pairs) {
            double exact = marginal(joint, List.of(dag.index(pair[0]), dag.index(pair[1])));
            int a = data.indexOf(pair[0]);
            int c = data.indexOf(pair[1]);
            int yes = data.variable(a).categories().indexOf("yes");
            int count = 0;
            for (int r = 0; r < n; r++) {
                if (data.discrete(a)[r] == yes && data.discrete(c)[r] == yes) {
                    count++;
                }
            }
            double se = Math.sqrt(exact * (1 - exact) / n);
            assertEquals(exact, count / (double) n, 4 * se, pair[0] + " and " + pair[1]);
        }
    }

    /** P(every variable in {@code which} takes its second category, "yes"). */
    private static double marginal(double[] joint, List<Integer> which) {
        double s = 0;
        for (int config = 0; config < joint.length; config++) {
            boolean all = true;
            for (int v : which) {
                all &= ((config >> v) & 1) == 1;
            }
            if (all) {
                s += joint[config];
            }
        }
        return s;
    }

    private String refused(String json) throws IOException {
        Path f = dir.resolve("bad.json");
        Files.writeString(f, json);
        return assertThrows(FileFormatException.class, () -> ModelFile.read(f)).getMessage();
    }

    @Test
    void badFilesAreOneLineErrorsNamingTheField() throws IOException {
        String head = "{\"model_file\": 1, \"kind\": \"linear-gaussian\", \"seed\": 1, \"data_seed\": 2,"
                + " \"columns\": [\"A\", \"B\"], \"variables\": [";
        String a = "{\"name\": \"A\", \"mechanism\": \"linear\", \"parents\": [], \"weights\": [],"
                + " \"noise\": {\"distribution\": \"gaussian\", \"scale\": 1.0}}";
        String good = head + a + ", {\"name\": \"B\", \"mechanism\": \"linear\", \"parents\": [\"A\"],"
                + " \"weights\": [0.5], \"noise\": {\"distribution\": \"gaussian\", \"scale\": 1.0}}]}";
        Path ok = dir.resolve("ok.json");
        Files.writeString(ok, good);
        assertEquals(2, ModelFile.read(ok).truth().sample(10).data().columns());
        assertTrue(refused(good.replace("\"model_file\": 1", "\"model_file\": 9"))
                .endsWith("bad.json, field 'model_file': version 9 is not known (this tool reads 1)"));
        assertTrue(refused(good.replace("[0.5]", "[0.5, 1]"))
                .endsWith("bad.json: variable 'B': 2 weights where 1 are needed"));
        assertTrue(refused(good.replace("[\"A\"], \"weights\"", "[\"Z\"], \"weights\""))
                .endsWith("bad.json, variables[2] ('B'): unknown parent 'Z'"));
        assertTrue(refused(good.replace("\"gaussian\", \"scale\": 1.0}}]", "\"cauchy\", \"scale\": 1.0}}]"))
                .contains("bad.json, variables[2] ('B'), noise: unknown noise 'cauchy'"));
        assertTrue(refused(good.replaceFirst("\"mechanism\": \"linear\"", "\"mechanism\": \"magic\""))
                .endsWith("bad.json, variables[1] ('A'), field 'mechanism': unknown mechanism 'magic' (allowed:"
                        + " linear, additive, table, conditional-gaussian, logistic)"));
        assertTrue(refused(good.replace("\"seed\": 1,", "")).endsWith("bad.json, field 'seed': missing"));
        assertTrue(refused(good.replace("\"kind\"", "\"sort\"")).contains("bad.json, field 'sort': unknown field"));
        assertTrue(refused(head + a.replace("\"parents\": [], \"weights\": []", "\"parents\": [\"B\"], \"weights\": [0.3]")
                + ", {\"name\": \"B\", \"mechanism\": \"linear\", \"parents\": [\"A\"], \"weights\": [0.5],"
                + " \"noise\": {\"distribution\": \"gaussian\", \"scale\": 1.0}}]}")
                .contains("the parents form a directed cycle"));
    }
}
