package dev.touchstone.harness.io;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.generators.TruthParameters;
import dev.touchstone.generators.missing.MissingnessDriver;
import dev.touchstone.generators.models.ModelParameters;
import dev.touchstone.generators.models.NodeFunction;
import dev.touchstone.generators.models.NodeParameters;
import dev.touchstone.generators.models.NoiseDistribution;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Model-parameter files: every parameter of one simulated truth in JSON, written by
 * {@code simulate} as {@code model.json} and read back by {@code simulate --model FILE} to
 * draw the same data again. The shape (documented in docs/formats.md):
 * <pre>
 * {"model_file": 1, "kind": "linear-gaussian", "seed": 7, "data_seed": -42,
 *  "columns": ["X2", "X1"],
 *  "variables": [
 *    {"name": "X1", "mechanism": "linear", "parents": [], "weights": [],
 *     "noise": {"distribution": "gaussian", "scale": 1.0}},
 *    {"name": "X2", "hidden": false, "mechanism": "linear", "parents": ["X1"], "weights": [0.8],
 *     "noise": {"distribution": "gaussian", "scale": 0.5}}],
 *  "standardization": {"X1": {"centre": 0.0, "scale": 1.0}},
 *  "missingness": [...], "tiers": [...]}
 * </pre>
 * The DAG is the variables (in order, some hidden) and each mechanism's parents. Mechanisms:
 * {@code linear}, {@code additive}, {@code table}, {@code conditional-gaussian},
 * {@code logistic} (see {@link NodeParameters}). Numbers are written with as many digits as
 * needed to read back the same doubles, so a model read back samples the same values.
 * Reading is strict: unknown or missing fields, wrong types and mechanisms that do not fit
 * the graph are refused with one line naming the file and the field. Cost O(parameters).
 */
public final class ModelFile {

    /** The version of the shape, written as {@code model_file}. */
    public static final int VERSION = 1;

    private static final ObjectMapper MAPPER = new ObjectMapper()
            .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION);

    private ModelFile() {
    }

    /** Writes {@code t} to {@code file} atomically. */
    public static void write(Path file, TruthParameters t) throws IOException {
        AtomicFiles.writeString(file, toJson(t));
    }

    /** The JSON text of {@code t}: objects one field per line, number lists on one line. */
    public static String toJson(TruthParameters t) {
        ObjectNode root = MAPPER.createObjectNode();
        ModelParameters m = t.model();
        Graph dag = m.dag();
        root.put("model_file", VERSION);
        root.put("kind", m.kind());
        root.put("seed", t.seed());
        root.put("data_seed", t.dataSeed());
        strings(root.putArray("columns"), m.columns());
        ArrayNode vars = root.putArray("variables");
        for (int v = 0; v < dag.size(); v++) {
            ObjectNode o = vars.addObject();
            o.put("name", dag.name(v));
            if (dag.isHidden(v)) {
                o.put("hidden", true);
            }
            node(o, m.nodes().get(v));
        }
        if (!m.standardisation().isEmpty()) {
            ObjectNode s = root.putObject("standardization");
            for (String name : dag.names()) {
                NodeParameters.Scaling sc = m.standardisation().get(name);
                if (sc != null) {
                    scaling(s.putObject(name), sc);
                }
            }
        }
        if (!t.missingness().isEmpty()) {
            ArrayNode miss = root.putArray("missingness");
            for (MissingnessDriver d : t.missingness()) {
                ObjectNode o = miss.addObject();
                o.put("variable", d.variable());
                o.put("mechanism", d.mechanism());
                if (d.driver() == null) {
                    o.putNull("driver");
                } else {
                    o.put("driver", d.driver());
                }
                o.put("rate", d.rate());
                o.put("intercept", d.link().intercept());
                o.put("slope", d.link().slope());
                o.put("driver_centre", d.link().driverCentre());
                o.put("driver_scale", d.link().driverScale());
            }
        }
        if (!t.tiers().isEmpty()) {
            ArrayNode tiers = root.putArray("tiers");
            for (List<String> tier : t.tiers()) {
                strings(tiers.addArray(), tier);
            }
        }
        DefaultPrettyPrinter pp = new DefaultPrettyPrinter();
        pp.indentArraysWith(DefaultPrettyPrinter.FixedSpaceIndenter.instance);
        try {
            return MAPPER.writer(pp).writeValueAsString(root) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    private static void node(ObjectNode o, NodeParameters n) {
        if (n instanceof NodeParameters.Linear l) {
            o.put("mechanism", "linear");
            strings(o.putArray("parents"), l.parents());
            numbers(o.putArray("weights"), l.weights());
            ObjectNode noise = o.putObject("noise");
            noise.put("distribution", l.noise().distribution().word());
            noise.put("scale", l.noise().scale());
            if (l.noise().distribution() == NoiseDistribution.STUDENT_T) {
                noise.put("degrees_of_freedom", l.noise().degreesOfFreedom());
            }
        } else if (n instanceof NodeParameters.Additive a) {
            o.put("mechanism", "additive");
            ArrayNode inputs = o.putArray("parents");
            for (NodeParameters.Input in : a.inputs()) {
                ObjectNode p = inputs.addObject();
                p.put("name", in.parent());
                scaling(p, in.scaling());
            }
            function(o.putObject("function"), a.function());
            scaling(o.putObject("output"), a.output());
            o.put("noise_scale", a.noiseScale());
        } else if (n instanceof NodeParameters.Table t) {
            o.put("mechanism", "table");
            strings(o.putArray("categories"), t.categories());
            strings(o.putArray("parents"), t.parents());
            matrix(o.putArray("probabilities"), t.probabilities());
        } else if (n instanceof NodeParameters.ConditionalGaussian g) {
            o.put("mechanism", "conditional-gaussian");
            o.put("intercept", g.intercept());
            ArrayNode con = o.putArray("continuous_parents");
            for (NodeParameters.Slope s : g.continuousParents()) {
                ObjectNode p = con.addObject();
                p.put("name", s.parent());
                scaling(p, s.scaling());
                p.put("weight", s.values()[0]);
            }
            ArrayNode dis = o.putArray("discrete_parents");
            for (NodeParameters.Shift s : g.discreteParents()) {
                ObjectNode p = dis.addObject();
                p.put("name", s.parent());
                numbers(p.putArray("shifts"), s.byCategory());
            }
            o.put("noise_scale", g.noiseScale());
        } else {
            NodeParameters.Logistic l = (NodeParameters.Logistic) n;
            o.put("mechanism", "logistic");
            strings(o.putArray("categories"), l.categories());
            strings(o.putArray("discrete_parents"), l.discreteParents());
            matrix(o.putArray("log_intercepts"), l.logIntercepts());
            ArrayNode con = o.putArray("continuous_parents");
            for (NodeParameters.Slope s : l.slopes()) {
                ObjectNode p = con.addObject();
                p.put("name", s.parent());
                scaling(p, s.scaling());
                numbers(p.putArray("slopes"), s.values());
            }
        }
    }

    private static void function(ObjectNode o, NodeFunction f) {
        o.put("class", f.word());
        if (f instanceof NodeFunction.Sigmoid s) {
            numbers(o.putArray("weights"), s.weights());
            numbers(o.putArray("slopes"), s.slopes());
        } else if (f instanceof NodeFunction.Polynomial p) {
            numbers(o.putArray("linear"), p.linear());
            numbers(o.putArray("quadratic"), p.quadratic());
        } else if (f instanceof NodeFunction.NeuralNet nn) {
            matrix(o.putArray("input_weights"), nn.input());
            numbers(o.putArray("biases"), nn.bias());
            numbers(o.putArray("output_weights"), nn.output());
        } else if (f instanceof NodeFunction.Fourier fo) {
            matrix(o.putArray("frequencies"), fo.frequency());
            numbers(o.putArray("phases"), fo.phase());
            numbers(o.putArray("amplitudes"), fo.amplitude());
        }
    }

    private static void scaling(ObjectNode o, NodeParameters.Scaling s) {
        o.put("centre", s.centre());
        o.put("scale", s.scale());
    }

    private static void strings(ArrayNode a, List<String> values) {
        values.forEach(a::add);
    }

    private static void numbers(ArrayNode a, double[] values) {
        for (double v : values) {
            a.add(v);
        }
    }

    private static void matrix(ArrayNode a, double[][] rows) {
        for (double[] r : rows) {
            numbers(a.addArray(), r);
        }
    }

    // ---- reading ----

    /**
     * Reads a model file.
     *
     * @throws FileFormatException naming the file and the field at fault
     */
    public static TruthParameters read(Path file) throws IOException {
        JsonNode root = JsonTrees.read(file, MAPPER);
        if (root == null || !root.isObject()) {
            throw new FileFormatException(file, null, "expected a JSON object with the model's parameters");
        }
        return new Reader(file).truth(root);
    }

    /** Strict reading with places in messages. */
    private static final class Reader {
        private final Path file;

        Reader(Path file) {
            this.file = file;
        }

        TruthParameters truth(JsonNode root) {
            fields(root, "", Set.of("model_file", "kind", "seed", "data_seed", "columns", "variables",
                    "standardization", "missingness", "tiers"));
            long version = integer(root, "model_file", "");
            if (version != VERSION) {
                throw bad("field 'model_file'", "version " + version + " is not known (this tool reads " + VERSION + ")");
            }
            String kind = text(root, "kind", "");
            long seed = integer(root, "seed", "");
            long dataSeed = integer(root, "data_seed", "");
            JsonNode vars = array(root, "variables", "");
            List<String> names = new ArrayList<>();
            for (int v = 0; v < vars.size(); v++) {
                names.add(text(vars.get(v), "name", "variables[" + (v + 1) + "]"));
            }
            MutableGraph g;
            try {
                g = Graph.builder(names);
            } catch (IllegalArgumentException e) {
                throw bad("field 'variables'", e.getMessage());
            }
            List<NodeParameters> nodes = new ArrayList<>();
            for (int v = 0; v < vars.size(); v++) {
                String place = "variables[" + (v + 1) + "] ('" + names.get(v) + "')";
                JsonNode o = vars.get(v);
                NodeParameters n = node(o, names.get(v), place);
                nodes.add(n);
                if (o.has("hidden") && bool(o, "hidden", place)) {
                    g.setHidden(v, true);
                }
                for (String p : parentsOf(n)) {
                    int q = g.indexOf(p);
                    if (q < 0) {
                        throw bad(place, "unknown parent '" + p + "'");
                    }
                    if (q == v || g.hasDirected(q, v)) {
                        throw bad(place, "parent '" + p + "' is the variable itself or given twice");
                    }
                    if (g.adjacent(q, v)) {
                        throw bad("field 'variables'", "the parents form a directed cycle ('" + p + "' and '"
                                + names.get(v) + "' are parents of each other)");
                    }
                    g.addDirected(q, v);
                }
            }
            Graph dag = g.freeze();
            if (Ancestry.topologicalOrder(dag) == null) {
                throw bad("field 'variables'", "the parents form a directed cycle");
            }
            List<String> columns = strings(root, "columns", "");
            Map<String, NodeParameters.Scaling> std = new LinkedHashMap<>();
            if (root.has("standardization")) {
                JsonNode s = object(root, "standardization", "");
                for (Iterator<String> it = s.fieldNames(); it.hasNext(); ) {
                    String name = it.next();
                    std.put(name, scaling(s.get(name), "standardization." + name));
                }
            }
            List<MissingnessDriver> missing = new ArrayList<>();
            if (root.has("missingness")) {
                JsonNode miss = array(root, "missingness", "");
                for (int k = 0; k < miss.size(); k++) {
                    String place = "missingness[" + (k + 1) + "]";
                    JsonNode o = miss.get(k);
                    fields(o, place, Set.of("variable", "mechanism", "driver", "rate", "intercept", "slope",
                            "driver_centre", "driver_scale"));
                    JsonNode driver = o.get("driver");
                    if (driver == null || !(driver.isNull() || driver.isTextual())) {
                        throw bad(place + ", field 'driver'", "expected a variable name or null");
                    }
                    missing.add(new MissingnessDriver(text(o, "variable", place), text(o, "mechanism", place),
                            driver.isNull() ? null : driver.asText(), number(o, "rate", place),
                            new MissingnessDriver.Link(number(o, "intercept", place), number(o, "slope", place),
                                    number(o, "driver_centre", place), number(o, "driver_scale", place))));
                }
            }
            List<List<String>> tiers = new ArrayList<>();
            if (root.has("tiers")) {
                JsonNode t = array(root, "tiers", "");
                for (int k = 0; k < t.size(); k++) {
                    tiers.add(stringList(t.get(k), "tiers[" + (k + 1) + "]"));
                }
            }
            TruthParameters out = new TruthParameters(seed, dataSeed,
                    new ModelParameters(kind, dag, nodes, columns, std), missing, tiers);
            try {
                out.truth();
            } catch (IllegalArgumentException e) {
                throw bad(null, e.getMessage());
            }
            return out;
        }

        private List<String> parentsOf(NodeParameters n) {
            List<String> out = new ArrayList<>();
            if (n instanceof NodeParameters.Linear l) {
                out.addAll(l.parents());
            } else if (n instanceof NodeParameters.Additive a) {
                a.inputs().forEach(i -> out.add(i.parent()));
            } else if (n instanceof NodeParameters.Table t) {
                out.addAll(t.parents());
            } else if (n instanceof NodeParameters.ConditionalGaussian c) {
                c.continuousParents().forEach(s -> out.add(s.parent()));
                c.discreteParents().forEach(s -> out.add(s.parent()));
            } else if (n instanceof NodeParameters.Logistic l) {
                out.addAll(l.discreteParents());
                l.slopes().forEach(s -> out.add(s.parent()));
            }
            return out;
        }

        private NodeParameters node(JsonNode o, String name, String place) {
            String mechanism = text(o, "mechanism", place);
            switch (mechanism) {
                case "linear": {
                    fields(o, place, Set.of("name", "hidden", "mechanism", "parents", "weights", "noise"));
                    JsonNode noise = object(o, "noise", place);
                    String np = place + ", noise";
                    fields(noise, np, Set.of("distribution", "scale", "degrees_of_freedom"));
                    NoiseDistribution d;
                    try {
                        d = NoiseDistribution.parse(text(noise, "distribution", np));
                    } catch (IllegalArgumentException e) {
                        throw bad(np, e.getMessage());
                    }
                    double dof = noise.has("degrees_of_freedom") ? number(noise, "degrees_of_freedom", np) : Double.NaN;
                    return new NodeParameters.Linear(name, strings(o, "parents", place), numbers(o, "weights", place),
                            new NodeParameters.Noise(d, number(noise, "scale", np), dof));
                }
                case "additive": {
                    fields(o, place, Set.of("name", "hidden", "mechanism", "parents", "function", "output",
                            "noise_scale"));
                    List<NodeParameters.Input> inputs = new ArrayList<>();
                    JsonNode ps = array(o, "parents", place);
                    for (int k = 0; k < ps.size(); k++) {
                        String pp = place + ", parents[" + (k + 1) + "]";
                        fields(ps.get(k), pp, Set.of("name", "centre", "scale"));
                        inputs.add(new NodeParameters.Input(text(ps.get(k), "name", pp), scaling(ps.get(k), pp)));
                    }
                    NodeFunction f = function(object(o, "function", place), place + ", function");
                    return new NodeParameters.Additive(name, inputs, f, scaling(object(o, "output", place),
                            place + ", output"), number(o, "noise_scale", place));
                }
                case "table":
                    fields(o, place, Set.of("name", "hidden", "mechanism", "categories", "parents", "probabilities"));
                    return new NodeParameters.Table(name, strings(o, "categories", place), strings(o, "parents", place),
                            matrix(o, "probabilities", place));
                case "conditional-gaussian": {
                    fields(o, place, Set.of("name", "hidden", "mechanism", "intercept", "continuous_parents",
                            "discrete_parents", "noise_scale"));
                    List<NodeParameters.Slope> con = new ArrayList<>();
                    JsonNode cs = array(o, "continuous_parents", place);
                    for (int k = 0; k < cs.size(); k++) {
                        String pp = place + ", continuous_parents[" + (k + 1) + "]";
                        fields(cs.get(k), pp, Set.of("name", "centre", "scale", "weight"));
                        con.add(new NodeParameters.Slope(text(cs.get(k), "name", pp), scaling(cs.get(k), pp),
                                new double[] {number(cs.get(k), "weight", pp)}));
                    }
                    List<NodeParameters.Shift> dis = new ArrayList<>();
                    JsonNode ds = array(o, "discrete_parents", place);
                    for (int k = 0; k < ds.size(); k++) {
                        String pp = place + ", discrete_parents[" + (k + 1) + "]";
                        fields(ds.get(k), pp, Set.of("name", "shifts"));
                        dis.add(new NodeParameters.Shift(text(ds.get(k), "name", pp), numbers(ds.get(k), "shifts", pp)));
                    }
                    return new NodeParameters.ConditionalGaussian(name, number(o, "intercept", place), con, dis,
                            number(o, "noise_scale", place));
                }
                case "logistic": {
                    fields(o, place, Set.of("name", "hidden", "mechanism", "categories", "discrete_parents",
                            "log_intercepts", "continuous_parents"));
                    List<NodeParameters.Slope> con = new ArrayList<>();
                    JsonNode cs = array(o, "continuous_parents", place);
                    for (int k = 0; k < cs.size(); k++) {
                        String pp = place + ", continuous_parents[" + (k + 1) + "]";
                        fields(cs.get(k), pp, Set.of("name", "centre", "scale", "slopes"));
                        con.add(new NodeParameters.Slope(text(cs.get(k), "name", pp), scaling(cs.get(k), pp),
                                numbers(cs.get(k), "slopes", pp)));
                    }
                    return new NodeParameters.Logistic(name, strings(o, "categories", place),
                            strings(o, "discrete_parents", place), matrix(o, "log_intercepts", place), con);
                }
                default:
                    throw bad(place + ", field 'mechanism'", "unknown mechanism '" + mechanism
                            + "' (allowed: linear, additive, table, conditional-gaussian, logistic)");
            }
        }

        private NodeFunction function(JsonNode o, String place) {
            String c = text(o, "class", place);
            switch (c) {
                case "none":
                    fields(o, place, Set.of("class"));
                    return new NodeFunction.None();
                case "sigmoid":
                    fields(o, place, Set.of("class", "weights", "slopes"));
                    return new NodeFunction.Sigmoid(numbers(o, "weights", place), numbers(o, "slopes", place));
                case "polynomial":
                    fields(o, place, Set.of("class", "linear", "quadratic"));
                    return new NodeFunction.Polynomial(numbers(o, "linear", place), numbers(o, "quadratic", place));
                case "neural-net":
                    fields(o, place, Set.of("class", "input_weights", "biases", "output_weights"));
                    return new NodeFunction.NeuralNet(matrix(o, "input_weights", place), numbers(o, "biases", place),
                            numbers(o, "output_weights", place));
                case "fourier":
                    fields(o, place, Set.of("class", "frequencies", "phases", "amplitudes"));
                    return new NodeFunction.Fourier(matrix(o, "frequencies", place), numbers(o, "phases", place),
                            numbers(o, "amplitudes", place));
                default:
                    throw bad(place + ", field 'class'", "unknown function class '" + c
                            + "' (allowed: none, sigmoid, polynomial, neural-net, fourier)");
            }
        }

        private NodeParameters.Scaling scaling(JsonNode o, String place) {
            if (o == null || !o.isObject()) {
                throw bad(place, "expected an object with centre and scale");
            }
            return new NodeParameters.Scaling(number(o, "centre", place), number(o, "scale", place));
        }

        private FileFormatException bad(String place, String detail) {
            return new FileFormatException(file, place, detail);
        }

        private static String at(String place, String field) {
            return (place.isEmpty() ? "" : place + ", ") + "field '" + field + "'";
        }

        private void fields(JsonNode o, String place, Set<String> allowed) {
            if (o == null || !o.isObject()) {
                throw bad(place.isEmpty() ? null : place, "expected an object");
            }
            for (Iterator<String> it = o.fieldNames(); it.hasNext(); ) {
                String f = it.next();
                if (!allowed.contains(f)) {
                    throw bad(at(place, f), "unknown field (allowed: " + String.join(", ", new java.util.TreeSet<>(allowed))
                            + ")");
                }
            }
        }

        private JsonNode get(JsonNode o, String field, String place) {
            JsonNode v = o == null ? null : o.get(field);
            if (v == null || v.isNull()) {
                throw bad(at(place, field), "missing");
            }
            return v;
        }

        private String text(JsonNode o, String field, String place) {
            JsonNode v = get(o, field, place);
            if (!v.isTextual()) {
                throw bad(at(place, field), "expected text, got " + v);
            }
            return v.asText();
        }

        private boolean bool(JsonNode o, String field, String place) {
            JsonNode v = get(o, field, place);
            if (!v.isBoolean()) {
                throw bad(at(place, field), "expected true or false, got " + v);
            }
            return v.asBoolean();
        }

        private long integer(JsonNode o, String field, String place) {
            JsonNode v = get(o, field, place);
            if (!v.isIntegralNumber() || !v.canConvertToLong()) {
                throw bad(at(place, field), "expected a whole number, got " + v);
            }
            return v.asLong();
        }

        private double number(JsonNode o, String field, String place) {
            return number(get(o, field, place), at(place, field));
        }

        private double number(JsonNode v, String where) {
            if (!v.isNumber()) {
                throw bad(where, "expected a number, got " + v);
            }
            return v.doubleValue();
        }

        private JsonNode array(JsonNode o, String field, String place) {
            JsonNode v = get(o, field, place);
            if (!v.isArray()) {
                throw bad(at(place, field), "expected a list");
            }
            return v;
        }

        private JsonNode object(JsonNode o, String field, String place) {
            JsonNode v = get(o, field, place);
            if (!v.isObject()) {
                throw bad(at(place, field), "expected an object");
            }
            return v;
        }

        private List<String> strings(JsonNode o, String field, String place) {
            return stringList(array(o, field, place), at(place, field));
        }

        private List<String> stringList(JsonNode a, String where) {
            if (a == null || !a.isArray()) {
                throw bad(where, "expected a list of names");
            }
            List<String> out = new ArrayList<>();
            for (JsonNode v : a) {
                if (!v.isTextual()) {
                    throw bad(where, "expected text, got " + v);
                }
                out.add(v.asText());
            }
            return out;
        }

        private double[] numbers(JsonNode o, String field, String place) {
            return numberList(array(o, field, place), at(place, field));
        }

        private double[] numberList(JsonNode a, String where) {
            if (!a.isArray()) {
                throw bad(where, "expected a list of numbers");
            }
            double[] out = new double[a.size()];
            for (int k = 0; k < out.length; k++) {
                out[k] = number(a.get(k), where);
            }
            return out;
        }

        private double[][] matrix(JsonNode o, String field, String place) {
            JsonNode a = array(o, field, place);
            double[][] out = new double[a.size()][];
            for (int r = 0; r < out.length; r++) {
                out[r] = numberList(a.get(r), at(place, field) + ", row " + (r + 1));
            }
            return out;
        }
    }
}
