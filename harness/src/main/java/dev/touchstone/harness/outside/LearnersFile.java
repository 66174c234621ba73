package dev.touchstone.harness.outside;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.harness.study.Node;
import dev.touchstone.harness.study.NodeReader;
import dev.touchstone.harness.study.StudyException;
import dev.touchstone.harness.study.StudyProblems;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * Reads a learners file: the external commands a user allows to run, passed with
 * {@code --learners FILE} (a study file alone can never make a command run: the user names the learners file).
 *
 * <pre>
 * learners:
 *   - id: my-method
 *     summary: my new search
 *     publication: our 2027 preprint
 *     command: [python3, "{dir}/my_method.py", "{data}", "{output}", "--seed", "{seed}", "--alpha", "{alpha}"]
 *     output: json            # or csv
 *     returns: cpdag          # dag, cpdag, mag or pag
 *     accepts: [continuous]   # continuous, discrete, mixed
 *     missing_values: rejects # or own-method (the command handles empty cells itself)
 *     installed_on_workers: false # true: the command is installed on a cluster's workers too
 *     version: "1.2"          # recorded with every run; default: a SHA-256 of the command's files
 *     parameters:
 *       - {name: alpha, type: real, default: 0.05, min: 0, max: 1, meaning: significance level}
 * </pre>
 *
 * Every problem is one {@link StudyException} with file, line, field and what is allowed; the
 * entries' problems are all collected ({@link StudyProblems}) and raised together.
 */
public final class LearnersFile {

    static final List<String> ENTRY_FIELDS = List.of("id", "summary", "publication", "command", "output", "returns",
            "accepts", "missing_values", "parameters", "installed_on_workers", "version");
    static final List<String> PARAMETER_FIELDS = List.of("name", "type", "default", "min", "max", "choices", "meaning");
    private static final Set<String> RESERVED = Set.of("data", "output", "seed", "dir", "workdir", "kinds",
            "knowledge");

    private LearnersFile() {
    }

    /** Reads and checks a learners file. */
    public static List<CommandSpec> read(Path file) {
        return read(NodeReader.read(file), file.toAbsolutePath().getParent(), file.toString());
    }

    /**
     * Reads and checks the text of a learners file (as shipped to a cluster's workers).
     *
     * @param source the file's name as given, for messages; a name ending in {@code .json} is read as JSON
     * @param dir    the folder the file was in, for {@code {dir}}
     */
    public static List<CommandSpec> read(String source, String text, Path dir) {
        boolean json = source.toLowerCase(Locale.ROOT).endsWith(".json");
        return read(NodeReader.read(source, text, json), dir, source);
    }

    static List<CommandSpec> read(Node root, Path dir, String source) {
        keys(root, List.of("learners"));
        Node list = root.get("learners");
        if (list == null || !list.isList() || list.items().isEmpty()) {
            throw new StudyException(list == null ? root.place() : list.place(), "learners",
                    "expected a non-empty list of command learners");
        }
        List<CommandSpec> out = new ArrayList<>();
        Set<String> ids = new HashSet<>();
        StudyProblems problems = new StudyProblems();
        for (Node e : list.items()) {
            CommandSpec s = problems.attempt(() -> entry(e, dir, source), null);
            if (s == null) {
                continue;
            }
            if (!ids.add(s.description().id())) {
                problems.add(StudyException.at(e, "the id '" + s.description().id() + "' is declared twice"));
            }
            out.add(s);
        }
        problems.throwIfAny();
        return out;
    }

    private static CommandSpec entry(Node e, Path dir, String source) {
        keys(e, ENTRY_FIELDS);
        Node idNode = required(e, "id");
        String id = text(idNode);
        LearnerDescription.Builder b;
        try {
            b = LearnerDescription.builder(id);
        } catch (IllegalArgumentException ex) {
            throw StudyException.at(idNode, ex.getMessage());
        }
        b.summary(e.get("summary") == null ? "external command " + id : text(e.get("summary")));
        b.publication(e.get("publication") == null ? "not given" : text(e.get("publication")));
        b.family(LearnerFamily.EXTERNAL);
        Node ret = required(e, "returns");
        try {
            b.returns(exactWord(text(ret), GraphClass.parse(text(ret)).word()));
        } catch (IllegalArgumentException ex) {
            throw StudyException.at(ret, "unknown graph class '" + text(ret) + "' (allowed: dag, cpdag, mag, pag)");
        }
        Node acc = e.get("accepts");
        List<DataKind> kinds = new ArrayList<>();
        for (Node k : acc == null ? List.<Node>of() : acc.isList() ? acc.items() : List.of(acc)) {
            DataKind found = null;
            for (DataKind d : DataKind.values()) {
                if (d.word().equals(text(k))) {
                    found = d;
                }
            }
            if (found == null) {
                throw StudyException.at(k, "unknown data kind '" + text(k) + "' (allowed: continuous, discrete, mixed)");
            }
            kinds.add(found);
        }
        if (kinds.isEmpty()) {
            kinds.add(DataKind.CONTINUOUS);
        }
        b.accepts(kinds.get(0), kinds.subList(1, kinds.size()).toArray(new DataKind[0]));
        Node mv = e.get("missing_values");
        if (mv != null) {
            String w = text(mv);
            MissingValues m = null;
            for (MissingValues x : MissingValues.values()) {
                if (x.word().equals(w)) {
                    m = x;
                }
            }
            if (m == null) {
                List<String> allowed = new ArrayList<>();
                for (MissingValues x : MissingValues.values()) {
                    allowed.add(x.word());
                }
                throw StudyException.at(mv, "unknown value '" + w + "' (allowed: " + String.join(", ", allowed) + ")");
            }
            b.missingValues(m);
        }
        Set<String> paramNames = new HashSet<>();
        Node params = e.get("parameters");
        if (params != null && !params.isNull()) {
            if (!params.isList()) {
                throw StudyException.at(params, "expected a list of parameters {name: …, type: …, default: …}");
            }
            for (Node p : params.items()) {
                ParameterSpec spec = parameter(p);
                if (RESERVED.contains(spec.name()) || !paramNames.add(spec.name())) {
                    throw StudyException.at(p, "the parameter name '" + spec.name() + "' is "
                            + (RESERVED.contains(spec.name()) ? "reserved for a placeholder" : "declared twice"));
                }
                b.parameter(spec);
            }
        }
        Node cmd = required(e, "command");
        if (!cmd.isList() || cmd.items().isEmpty()) {
            throw StudyException.at(cmd, "expected the command as a non-empty list of arguments, e.g. [python3,"
                    + " \"{dir}/method.py\", \"{data}\", \"{output}\"] (no shell is used)");
        }
        List<String> command = new ArrayList<>();
        for (Node a : cmd.items()) {
            if (!a.isScalar() || a.value() == null) {
                throw StudyException.at(a, "expected one argument (text), found " + a.describe());
            }
            command.add(a.value().toString());
        }
        List<String> used = CommandLearner.placeholders(command);
        for (String name : used) {
            if (!RESERVED.contains(name) && !paramNames.contains(name)) {
                throw StudyException.at(cmd, "the placeholder {" + name + "} is neither one of {data}, {output},"
                        + " {seed}, {dir}, {workdir}, {kinds}, {knowledge} nor a declared parameter");
            }
        }
        if (!used.contains("output")) {
            throw StudyException.at(cmd, "the command must say where to write the graph with {output}");
        }
        if (!used.contains("data")) {
            throw StudyException.at(cmd, "the command must be given the data file with {data}");
        }
        CommandSpec.OutputFormat format = CommandSpec.OutputFormat.JSON;
        Node of = e.get("output");
        if (of != null) {
            String w = text(of);
            if (w.equals("csv")) {
                format = CommandSpec.OutputFormat.CSV;
            } else if (!w.equals("json")) {
                throw StudyException.at(of, "unknown output format '" + w + "' (allowed: json, csv)");
            }
        }
        boolean onWorkers = false;
        Node ow = e.get("installed_on_workers");
        if (ow != null && !ow.isNull()) {
            if (!(ow.value() instanceof Boolean)) {
                throw StudyException.at(ow, "expected true or false, found " + ow.describe());
            }
            onWorkers = (Boolean) ow.value();
        }
        String version = null;
        Node vn = e.get("version");
        if (vn != null && !vn.isNull()) {
            if (!vn.isScalar() || vn.value() instanceof Boolean || text(vn).isBlank()) {
                throw StudyException.at(vn, "expected the version as text, e.g. \"1.2\", found " + vn.describe());
            }
            version = text(vn).trim();
        }
        return new CommandSpec(b.build(), command, format, new CommandSpec.Origin(dir, source),
                new CommandSpec.Installation(onWorkers, version));
    }

    private static ParameterSpec parameter(Node p) {
        keys(p, PARAMETER_FIELDS);
        String name = text(required(p, "name"));
        Node typeNode = required(p, "type");
        String type = text(typeNode);
        String meaning = p.get("meaning") == null ? name : text(p.get("meaning"));
        Node def = required(p, "default");
        try {
            switch (type) {
                case "integer":
                    return ParameterSpec.integer(name, (int) number(def), p.get("min") == null ? Integer.MIN_VALUE
                            : (int) number(p.get("min")), p.get("max") == null ? Integer.MAX_VALUE
                            : (int) number(p.get("max")), meaning);
                case "real":
                    return ParameterSpec.real(name, number(def), p.get("min") == null ? Double.NEGATIVE_INFINITY
                            : number(p.get("min")), p.get("max") == null ? Double.POSITIVE_INFINITY
                            : number(p.get("max")), meaning);
                case "boolean":
                    if (!(def.value() instanceof Boolean)) {
                        throw StudyException.at(def, "expected true or false");
                    }
                    return ParameterSpec.bool(name, (Boolean) def.value(), meaning);
                case "choice": {
                    Node ch = required(p, "choices");
                    List<String> choices = new ArrayList<>();
                    for (Node c : ch.isList() ? ch.items() : List.of(ch)) {
                        choices.add(text(c));
                    }
                    return ParameterSpec.choice(name, text(def), choices, meaning);
                }
                case "text":
                    return ParameterSpec.text(name, text(def), meaning);
                default:
                    throw StudyException.at(typeNode, "unknown parameter type '" + type
                            + "' (allowed: integer, real, boolean, choice, text)");
            }
        } catch (IllegalArgumentException e) {
            throw StudyException.at(p, e.getMessage());
        }
    }

    private static double number(Node n) {
        if (!(n.value() instanceof Number)) {
            throw StudyException.at(n, "expected a number, found " + n.describe());
        }
        return ((Number) n.value()).doubleValue();
    }

    private static Node required(Node map, String key) {
        Node n = map.get(key);
        if (n == null || n.isNull()) {
            throw new StudyException(map.place(), (map.path().isEmpty() ? "" : map.path() + ".") + key,
                    "this field is required");
        }
        return n;
    }

    private static String text(Node n) {
        if (!n.isScalar() || n.value() == null) {
            throw StudyException.at(n, "expected text, found " + n.describe());
        }
        return n.value().toString();
    }

    private static void keys(Node map, List<String> allowed) {
        if (!map.isMap()) {
            throw StudyException.at(map, "expected a map, found " + map.describe());
        }
        for (String k : map.entries().keySet()) {
            if (!allowed.contains(k)) {
                throw new StudyException(map.keyPlace(k), (map.path().isEmpty() ? "" : map.path() + ".") + k,
                        "unknown field; allowed here: " + String.join(", ", allowed));
            }
        }
    }

    /** The class whose word is exactly {@code word} (lower case, as the docs spell it); else refused. */
    private static GraphClass exactWord(String word, String canonical) {
        if (!word.equals(canonical)) {
            throw new IllegalArgumentException("not spelled as documented");
        }
        return GraphClass.parse(word);
    }
}
