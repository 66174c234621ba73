package dev.touchstone.harness.study;

import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.TruthParameters;
import dev.touchstone.generators.graphs.GivenGraphFamily;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.graphs.GraphFamily;
import dev.touchstone.generators.hidden.HiddenOption;
import dev.touchstone.generators.hidden.HiddenOptions;
import dev.touchstone.generators.missing.MissingnessMechanism;
import dev.touchstone.generators.missing.MissingnessMechanisms;
import dev.touchstone.generators.models.ModelKind;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.generators.networks.ReferenceNetwork;
import dev.touchstone.generators.networks.ReferenceNetworks;
import dev.touchstone.harness.io.FileFormatException;
import dev.touchstone.harness.io.ModelFile;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.harness.io.GraphFiles;
import dev.touchstone.harness.io.Sha256;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The truth catalogue over the generators' registries: {@code network} (key {@code name}; a
 * built-in reference network that brings its own graph and model, so {@code network:
 * sprinkler} stands in for {@code graph} and {@code model}), {@code graph} (key {@code family}),
 * {@code model} ({@code kind}), {@code hidden} ({@code kind}, default {@code none};
 * {@code hidden: 2} means {@code {kind: random, count: 2}}) and {@code missing}
 * ({@code mechanism}, default {@code none}). Parameters are the generators' own
 * declarations, so study files, listings and the reference page follow them.
 *
 * <p>The {@code given} graph family names a graph file (JSON or CSV edge list) relative to
 * the study file; {@link #bind} reads it when the study is read (so a bad file is reported
 * at the study's line and column), keeps its absolute path, and {@link #fingerprint} puts a
 * digest of its bytes into the run keys, so editing the file recomputes its runs.
 *
 * <p>Cross-field rules are checked by building each setting's {@link Simulation} and drawing
 * one truth from a fixed seed, so a rule the generators enforce only when drawing (say, more
 * edges than a graph can hold) is reported before the study starts. Cost: one truth draw per
 * truth setting.
 */
public final class GeneratorTruthCatalog implements TruthCatalog {

    public static final String NETWORK = "network";
    public static final String GRAPH = "graph";
    public static final String MODEL = "model";
    public static final String HIDDEN = "hidden";
    public static final String MISSING = "missing";
    /** A model file written by {@code simulate}: a truth with every parameter fixed. */
    public static final String MODEL_FILE = "model_file";
    /** The one format of a model file. */
    static final String MODEL_FILE_FORMAT = "json";

    /** The given graph family's parameter naming the file. */
    static final String GIVEN_FILE = "file";

    private final List<Section> sections;

    public GeneratorTruthCatalog() {
        List<Kind> networks = new ArrayList<>();
        for (ReferenceNetwork n : ReferenceNetworks.all()) {
            networks.add(new Kind(n.id(), n.title() + " (" + n.source() + ")" + (n.notes() == null
                    || n.notes().isEmpty() ? "" : ". Note: " + n.notes()), List.of()));
        }
        List<Kind> families = new ArrayList<>();
        for (GraphFamily f : GraphFamilies.all()) {
            families.add(new Kind(f.id(), f.id().equals(GivenGraphFamily.ID)
                    ? "a fixed DAG read from a graph file (JSON, or a CSV edge list when the name ends in .csv);"
                    + " a relative path is read from the study file's folder" : f.summary(), f.parameters()));
        }
        List<Kind> models = new ArrayList<>();
        for (ModelKind k : ModelKinds.all()) {
            models.add(new Kind(k.id(), k.summary(), k.parameters()));
        }
        List<Kind> hidden = new ArrayList<>();
        for (HiddenOption h : HiddenOptions.all()) {
            hidden.add(new Kind(h.id(), h.summary(), h.parameters()));
        }
        List<Kind> missing = new ArrayList<>();
        for (MissingnessMechanism m : MissingnessMechanisms.all()) {
            missing.add(new Kind(m.id(), m.summary(), m.parameters()));
        }
        Kind modelFile = new Kind(MODEL_FILE_FORMAT, "a model.json written by simulate (docs/formats.md): graph, hidden"
                + " variables, every mechanism's parameters, missingness and tiers as written; each replicate draws"
                + " new data from it; a relative path is read from the study file's folder",
                List.of(ParameterSpec.text(GIVEN_FILE, "", "the model file")));
        sections = List.of(
                Section.builder(MODEL_FILE, "format").shorthand(MODEL_FILE_FORMAT, GIVEN_FILE)
                        .meaning("A truth read from a model file, used instead of `graph`, `model`, `hidden` and"
                                + " `missing` (a bare path is enough: `model_file: truths/model.json`).")
                        .kinds(List.of(modelFile)).replaces(List.of(GRAPH, MODEL, HIDDEN, MISSING)).build(),
                Section.builder(NETWORK, "name").shorthand(null, "name")
                        .meaning("A built-in reference network with its own graph and parameters, used instead of"
                                + " `graph` and `model` (a bare name or list of names is enough: `network: sprinkler`).")
                        .kinds(networks).replaces(List.of(GRAPH, MODEL)).build(),
                Section.builder(GRAPH, "family")
                        .meaning("The random graph family the true DAG is drawn from, with its parameters.")
                        .kinds(families).build(),
                Section.builder(MODEL, "kind")
                        .meaning("The structural-equation model that generates data on the graph, with its parameters.")
                        .kinds(models).build(),
                Section.builder(HIDDEN, "kind").defaultKind(HiddenOptions.NONE).shorthand(HiddenOptions.RANDOM, "count")
                        .meaning("Which variables are hidden from the learners (a bare number means that many chosen"
                                + " at random).")
                        .kinds(hidden).build(),
                Section.builder(MISSING, "mechanism").defaultKind(MissingnessMechanisms.NONE)
                        .meaning("How cells of the observed data go missing.").kinds(missing).build());
    }

    @Override
    public List<Section> sections() {
        return sections;
    }

    @Override
    public void checkCombination(TruthSetting setting) {
        try {
            simulation(setting).drawTruth(0L);
        } catch (IllegalStateException e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
    }

    @Override
    public Object bind(String section, String kind, String parameter, Object value, Path baseDir) {
        if (isModelFile(section, parameter)) {
            String text = value.toString().trim();
            if (text.isEmpty()) {
                throw new IllegalArgumentException("model_file needs the path of a model file (model.json)");
            }
            Path file = baseDir.resolve(text).toAbsolutePath().normalize();
            modelFile(file.toString());
            return file.toString();
        }
        if (!isGraphFile(section, kind, parameter)) {
            return value;
        }
        String text = value.toString().trim();
        if (text.isEmpty()) {
            throw new IllegalArgumentException("the given graph family needs a graph file (JSON or CSV edge list)");
        }
        Path file = baseDir.resolve(text).toAbsolutePath().normalize();
        given(file.toString());
        return file.toString();
    }

    @Override
    public String fingerprint(String section, String kind, ParameterValues values) {
        if (section.equals(MODEL_FILE) && !values.get(GIVEN_FILE).toString().isBlank()) {
            return modelFile(values.get(GIVEN_FILE).toString()).digest();
        }
        if (!section.equals(GRAPH) || !kind.equals(GivenGraphFamily.ID)
                || values.get(GIVEN_FILE).toString().isBlank()) {
            return ""; // no file: refused with a clear message by checkCombination
        }
        return given(values.get(GIVEN_FILE).toString()).digest();
    }

    @Override
    public Set<String> locations(String section, String kind) {
        return section.equals(GRAPH) && kind.equals(GivenGraphFamily.ID) || section.equals(MODEL_FILE)
                ? Set.of(GIVEN_FILE) : Set.of();
    }

    private static boolean isModelFile(String section, String parameter) {
        return section.equals(MODEL_FILE) && parameter.equals(GIVEN_FILE);
    }

    private static boolean isGraphFile(String section, String kind, String parameter) {
        return section.equals(GRAPH) && kind.equals(GivenGraphFamily.ID) && parameter.equals(GIVEN_FILE);
    }


    /** A file as parsed, with the digest of its bytes. */
    private record ReadFile<T>(T value, String digest) {
    }

    /** How a kind of file named in a study is parsed into what the truth needs. */
    @FunctionalInterface
    private interface FileParser<T> {
        T parse(Path file) throws IOException;
    }

    /** Parsed graph and model files by path and digest: a file edited while the tool runs is read again. */
    private static final Map<String, ReadFile<GivenGraphFamily>> GIVEN = new ConcurrentHashMap<>();
    private static final Map<String, ReadFile<TruthParameters>> MODELS = new ConcurrentHashMap<>();

    /**
     * The file's content as it is now, parsed once per path and content.
     *
     * @param noun what the file is in messages ("graph", "model")
     * @throws IllegalArgumentException naming the file and what is wrong with it
     */
    private static <T> ReadFile<T> read(String path, String noun, Map<String, ReadFile<T>> cache,
                                        FileParser<T> parser) {
        Path file = Path.of(path);
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new IllegalArgumentException(path + ": no such " + noun + " file (check the path)");
        } catch (IOException e) {
            throw new IllegalArgumentException(path + ": cannot be read: " + e.getMessage());
        }
        String digest = digest(bytes);
        ReadFile<T> found = cache.get(path + "#" + digest);
        if (found != null) {
            return found;
        }
        try {
            found = new ReadFile<>(parser.parse(file), digest);
        } catch (IOException e) {
            throw new IllegalArgumentException(path + ": cannot be read: " + e.getMessage());
        } catch (FileFormatException e) {
            throw new IllegalArgumentException(e.getMessage());
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(path + ": " + e.getMessage());
        }
        cache.putIfAbsent(path + "#" + digest, found);
        return found;
    }

    /** The content of the file a choice names, refusing a file that changed since the study was read. */
    private static <T> T current(TruthSetting.Choice c, String noun, Map<String, ReadFile<T>> cache,
                                 FileParser<T> parser) {
        String path = c.values().get(GIVEN_FILE).toString();
        ReadFile<T> found = read(path, noun, cache, parser);
        if (!c.fingerprint().isEmpty() && !found.digest().equals(c.fingerprint())) {
            throw new IllegalStateException(path + ": the " + noun + " file changed since the study was read; read"
                    + " the study again");
        }
        return found.value();
    }

    private static ReadFile<TruthParameters> modelFile(String path) {
        return read(path, "model", MODELS, ModelFile::read);
    }

    /** The truth of a model-file choice. */
    private static TruthParameters modelFile(TruthSetting.Choice c) {
        if (c.values().get(GIVEN_FILE).toString().isBlank()) {
            throw new IllegalArgumentException("model_file needs the path of a model file (model.json)");
        }
        return current(c, "model", MODELS, ModelFile::read);
    }

    private static ReadFile<GivenGraphFamily> given(String path) {
        return read(path, "graph", GIVEN, GeneratorTruthCatalog::givenGraph);
    }

    /** The DAG of a graph file, refused when it leaves no variable observed. */
    private static GivenGraphFamily givenGraph(Path file) throws IOException {
        Graph dag = GraphFiles.read(file, null);
        if (dag.observedIndices().length == 0) {
            throw new IllegalArgumentException(dag.size() == 0 ? "the graph has no variables; list at least one"
                    : "every variable of the graph is hidden, so there would be no data; leave at least one"
                    + " variable out of 'hidden'");
        }
        return GivenGraphFamily.of(dag);
    }

    /** The graph of a given-graph choice. */
    private static GivenGraphFamily given(TruthSetting.Choice g) {
        if (g.values().get(GIVEN_FILE).toString().isBlank()) {
            throw new IllegalArgumentException("the given graph family needs a graph file: set graph.file to a JSON"
                    + " or CSV edge-list file");
        }
        return current(g, "graph", GIVEN, GeneratorTruthCatalog::givenGraph);
    }

    private static String digest(byte[] bytes) {
        return Sha256.hex(bytes, 8);
    }

    /** The generators' recipe for a truth setting. */
    public static Simulation simulation(TruthSetting t) {
        TruthSetting.Choice f = t.choice(MODEL_FILE);
        TruthSetting.Choice n = t.choice(NETWORK);
        TruthSetting.Choice g = t.choice(GRAPH);
        TruthSetting.Choice m = t.choice(MODEL);
        TruthSetting.Choice h = t.choice(HIDDEN);
        TruthSetting.Choice x = t.choice(MISSING);
        Simulation.Builder b = Simulation.builder();
        if (f != null) {
            b.fixed(modelFile(f));
        } else if (n != null) {
            b.network(ReferenceNetworks.byId(n.kind()));
        } else {
            GraphFamily family = g.kind().equals(GivenGraphFamily.ID) ? given(g) : GraphFamilies.byId(g.kind());
            b.graph(family, g.values()).model(ModelKinds.byId(m.kind()), m.values());
        }
        if (h != null) {
            b.hidden(HiddenOptions.byId(h.kind()), h.values());
        }
        if (x != null) {
            b.missing(MissingnessMechanisms.byId(x.kind()), x.values());
        }
        return b.build();
    }
}
