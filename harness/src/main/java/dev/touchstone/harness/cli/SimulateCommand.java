package dev.touchstone.harness.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.generators.audit.SortabilityAudit;
import dev.touchstone.harness.execution.Cells;
import dev.touchstone.harness.execution.SeedCells;
import dev.touchstone.harness.execution.SettingCells;
import dev.touchstone.harness.execution.GeneratorSimulator;
import dev.touchstone.harness.execution.Replicate;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.io.AtomicFiles;
import dev.touchstone.harness.io.ColumnKinds;
import dev.touchstone.harness.io.DataCsv;
import dev.touchstone.harness.io.GraphDot;
import dev.touchstone.harness.io.GraphFormat;
import dev.touchstone.harness.io.ModelFile;
import dev.touchstone.generators.SimulatedTruth;
import dev.touchstone.generators.TruthParameters;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.harness.study.Canonical;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.ReplicateSeeds;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.harness.study.StudyFields;
import dev.touchstone.harness.study.TruthSetting;
import dev.touchstone.metrics.truth.TruthSelection;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

/**
 * {@code touchstone simulate}: writes data sets with their truth graphs, without running
 * learners. Two forms:
 * <ul>
 * <li>{@code simulate STUDY --out DIR}: every replicate of a study, exactly as {@code run}
 *     would draw them (same seeds). {@code DIR/replicates.csv} indexes one folder
 *     {@code t<setting>-r<replicate>} per replicate, holding the data of the largest sample
 *     size (smaller ones are its first rows).</li>
 * <li>{@code simulate --graph FAMILY --model KIND [--set NAME=VALUE]… --out DIR}, or
 *     {@code --network NAME}: one truth from options, written straight into {@code DIR}. It
 *     is the draw replicate 0 of a study with the same seed and truth would make.</li>
 * <li>{@code simulate --model FILE.json}: the truth a {@code model.json} written before
 *     describes, drawing the same data again (or new data with {@code --seed}).</li>
 * </ul>
 * Each folder holds {@code data.csv}, {@code model.json} (every parameter of the truth,
 * {@link ModelFile}), {@code truth.json} and {@code truth.dot} (the DAG, hidden variables flagged), {@code cpdag.json} when nothing is hidden or else
 * {@code mag.json}, {@code pag.json} (over the observed variables) and {@code audit.json}
 * (varsortability and R²-sortability of the data against the truth).
 */
@Command(name = "simulate", sortOptions = false,
        description = {"Write data sets with their truth graphs, without running learners.",
                "every replicate of a STUDY, or one truth described by options (--network, or --graph and --model).",
                "Example: touchstone simulate --graph erdos-renyi --set nodes=20 --set mean_degree=2"
                        + " --model linear-gaussian --samples 500 --out sim"})
final class SimulateCommand implements Callable<Integer> {

    static final String DEFAULT_GRAPH = "erdos-renyi";
    static final String DEFAULT_MODEL = "linear-gaussian";
    static final int DEFAULT_SAMPLES = 1000;

    @Parameters(arity = "0..1", paramLabel = "STUDY",
            description = "A study file (YAML or JSON); leave it out to describe one truth with the options below.")
    Path study;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder.")
    Path out;

    @Option(names = "--network", paramLabel = "NAME",
            description = "A built-in reference network (chest-clinic, sprinkler, community-garden) with its own"
                    + " graph and parameters; instead of --graph and --model.")
    String network;

    @Option(names = "--graph", paramLabel = "FAMILY",
            description = "The random graph family (default: " + DEFAULT_GRAPH + "); 'given' reads the DAG from"
                    + " --set file=PATH. See docs/study-files.md for every family and parameter.")
    String graph;

    @Option(names = "--model", paramLabel = "KIND|FILE",
            description = "The structural-equation model (default: " + DEFAULT_MODEL + "), or a model file"
                    + " (name ending in .json, such as the model.json simulate writes) giving the whole truth:"
                    + " the same data again, or new data from it with --seed.")
    String model;

    @Option(names = "--hidden", paramLabel = "KIND|COUNT",
            description = "Which variables are hidden: none (default), a kind such as confounders, or a number"
                    + " meaning that many chosen at random.")
    String hidden;

    @Option(names = "--missing", paramLabel = "MECHANISM",
            description = "How cells go missing: none (default), or a mechanism such as mcar with --set rate=0.1.")
    String missing;

    @Option(names = "--set", paramLabel = "NAME=VALUE",
            description = "A parameter of the chosen graph family, model, hidden option or missingness mechanism"
                    + " (e.g. nodes=20, mean_degree=2); write SECTION.NAME (graph.nodes, missing.rate) when two of"
                    + " them declare the same name. Repeat for several.")
    List<String> settings = List.of();

    @Option(names = "--samples", paramLabel = "N",
            description = "Rows of data to draw (default: " + DEFAULT_SAMPLES + ").")
    Integer samples;

    @Mixin
    SeedOption seed;

    @Option(names = "--graph-format", split = ",", paramLabel = "FORMAT",
            description = "More formats for the graph files, besides JSON (and truth.dot): csv (edge list),"
                    + " matrix.csv (adjacency matrix), dot; comma-separated or repeated.")
    List<String> graphFormats = List.of();

    @Mixin
    LearnerSourceOptions sources;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        if (Files.exists(out) && !Files.isDirectory(out)) {
            throw new UsageException("--out: " + out + " is a file, not a folder (choose a folder name)");
        }
        return study != null ? fromStudy() : fromOptions();
    }

    private Integer fromStudy() throws IOException {
        List<GraphFormat> formats = formats(graphFormats);
        Map<String, Object> truthOptions = truthOptions();
        truthOptions.put("--samples", samples);
        truthOptions.put("--seed", seed.seed);
        for (Map.Entry<String, Object> e : truthOptions.entrySet()) {
            if (e.getValue() != null) {
                throw new UsageException(e.getKey() + ": describes one truth and cannot be combined with a STUDY"
                        + " file (the study says what to simulate)");
            }
        }
        Toolkit kit = sources.toolkit();
        Plan plan = kit.plan(kit.readStudy(study));
        int rows = StudyRunner.largestRows(plan);
        Files.createDirectories(out);
        List<List<String>> index = new ArrayList<>();
        int written = 0;
        for (TruthSetting t : plan.truths()) {
            for (int r = 0; r < plan.study().replicates(); r++) {
                ReplicateSeeds seeds = new ReplicateSeeds(plan.study().seed(), t, r);
                SimulatedTruth truth = GeneratorSimulator.truth(t, seeds);
                Replicate rep = GeneratorSimulator.replicate(truth, rows);
                String name = String.format(Locale.ROOT, "t%d-r%d", t.index(), r);
                write(out.resolve(name), truth, rep.data(), name, formats);
                List<String> row = new ArrayList<>(List.of(name, Integer.toString(t.index()), Integer.toString(r),
                        Integer.toString(rows)));
                row.addAll(SeedCells.cells(seeds.replicateSeed()));
                row.add(t.label());
                index.add(row);
                written++;
            }
        }
        AtomicFiles.writeString(out.resolve("replicates.csv"), Cells.csv(List.of("folder",
                SettingCells.TRUTH_SETTING, "replicate", "n_rows", "seed", SeedCells.HIGH, SeedCells.LOW, "setting"),
                index));
        StringBuilder sizes = new StringBuilder();
        for (SampleSize n : plan.study().samples()) {
            sizes.append(sizes.length() == 0 ? "" : ", ").append(n.word());
        }
        PrintWriter w = spec.commandLine().getOut();
        w.printf(Locale.ROOT, "wrote %,d replicates (%s rows each; sample sizes %s are prefixes) to %s%n", written,
                Canonical.value(rows), sizes, out);
        w.flush();
        return Main.DONE;
    }

    private Integer fromOptions() throws IOException {
        List<GraphFormat> formats = formats(graphFormats);
        if (sources.learnersFile != null || sources.plugins != null) {
            throw new UsageException((sources.learnersFile != null ? "--learners" : "--plugins")
                    + ": only used with a STUDY file");
        }
        if (network != null && (graph != null || model != null)) {
            throw new UsageException((graph != null ? "--graph" : "--model") + ": cannot be combined with --network"
                    + " (a network brings its own graph and model)");
        }
        if (isModelFile(model)) {
            return fromModelFile(formats);
        }
        int rows = rows();
        long root = seed.value();
        Map<String, String> kinds = new LinkedHashMap<>();
        Map<String, String> chosen = TruthOptions.options();
        truthOptions().forEach((option, value) -> {
            String section = sectionOf(chosen, option);
            if (value != null && section != null) {
                kinds.put(section, value.toString());
            }
        });
        if (network == null) {
            kinds.putIfAbsent(dev.touchstone.harness.study.GeneratorTruthCatalog.GRAPH, DEFAULT_GRAPH);
            kinds.putIfAbsent(dev.touchstone.harness.study.GeneratorTruthCatalog.MODEL, DEFAULT_MODEL);
        }
        Toolkit kit = new Toolkit(null, null);
        TruthSetting t = new TruthOptions(kit.truth, kinds, chosen)
                .setting(Settings.parse(settings), Path.of("").toAbsolutePath());
        ReplicateSeeds seeds = new ReplicateSeeds(root, t, 0);
        SimulatedTruth truth = GeneratorSimulator.truth(t, seeds);
        Replicate rep = GeneratorSimulator.replicate(truth, rows);
        write(out, truth, rep.data(), t.label(), formats);
        PrintWriter w = spec.commandLine().getOut();
        w.printf(Locale.ROOT, "wrote %,d rows of %d variables (%s; seed %d) to %s: %s%n", rows,
                rep.data().columns(), t.description(), root, out, String.join(", ", files(rep.trueDag(), formats)));
        w.flush();
        return Main.DONE;
    }

    /** Whether a {@code --model} value names a model file rather than a model kind. */
    static boolean isModelFile(String value) {
        return value != null && value.toLowerCase(Locale.ROOT).endsWith(".json");
    }

    private int rows() {
        int rows = samples == null ? DEFAULT_SAMPLES : samples;
        if (rows < StudyFields.MIN_SAMPLES) {
            throw new UsageException("--samples: " + rows + " is not a sample size (allowed: whole numbers of at least "
                    + StudyFields.MIN_SAMPLES + ")");
        }
        return rows;
    }

    /** {@code --model FILE}: the truth a model file describes, with its own data seed unless --seed is given. */
    private Integer fromModelFile(List<GraphFormat> formats) throws IOException {
        for (Map.Entry<String, Object> e : truthOptions().entrySet()) {
            if (e.getValue() != null && !e.getKey().equals("--model")) {
                throw new UsageException(e.getKey() + ": cannot be combined with a model file (--model " + model
                        + " gives the whole truth)");
            }
        }
        int rows = rows();
        Path file = Path.of(model);
        if (!Files.isRegularFile(file)) {
            throw new UsageException("--model: " + model + ": no such file");
        }
        TruthParameters parameters = ModelFile.read(file);
        SimulatedTruth truth = seed.given() ? parameters.truth(Seeds.derive(seed.value(), "data")) : parameters.truth();
        Replicate rep = GeneratorSimulator.replicate(truth, rows);
        write(out, truth, rep.data(), "from " + file.getFileName(), formats);
        PrintWriter w = spec.commandLine().getOut();
        w.printf(Locale.ROOT, "wrote %,d rows of %d variables (the truth of %s; %s) to %s: %s%n", rows,
                rep.data().columns(), file, seed.given() ? "new data with seed " + seed.value() : "its own data seed", out,
                String.join(", ", files(truth.dag(), formats)));
        w.flush();
        return Main.DONE;
    }

    /** The truth options by name, null where not given. */
    private Map<String, Object> truthOptions() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("--network", network);
        m.put("--graph", graph);
        m.put("--model", model);
        m.put("--hidden", hidden);
        m.put("--missing", missing);
        m.put("--set", settings.isEmpty() ? null : settings);
        return m;
    }

    private static String sectionOf(Map<String, String> optionBySection, String option) {
        for (Map.Entry<String, String> e : optionBySection.entrySet()) {
            if (e.getValue().equals(option)) {
                return e.getKey();
            }
        }
        return null;
    }

    /** The graph formats named by {@code --graph-format}, JSON first and each once. */
    static List<GraphFormat> formats(List<String> words) {
        List<GraphFormat> out = new ArrayList<>(List.of(GraphFormat.JSON));
        for (String w : words) {
            GraphFormat f = GraphFormat.forName("graph." + w.trim().replaceFirst("^\\.", ""));
            if (f == null) {
                throw new UsageException("--graph-format: unknown format '" + w + "' (allowed: json, csv, matrix.csv,"
                        + " dot)");
            }
            if (!out.contains(f)) {
                out.add(f);
            }
        }
        return out;
    }

    /** The graphs written for a truth, by file stem: the DAG, its CPDAG or MAG, and the PAG. */
    private static Map<String, Graph> graphs(Graph dag) {
        Map<String, Graph> out = new LinkedHashMap<>();
        out.put("truth", dag);
        if (!dag.hasHidden()) {
            out.put("cpdag", Cpdags.of(dag));
        } else {
            out.put("mag", TruthSelection.as(dag, GraphClass.MAG).reference());
        }
        out.put("pag", TruthSelection.as(dag, GraphClass.PAG).reference());
        return out;
    }

    /** The names of the graph files {@link #write} makes for this truth, before data.csv and audit.json. */
    static List<String> files(Graph dag, List<GraphFormat> formats) {
        List<String> names = new ArrayList<>(List.of("data.csv", "data.kinds.csv", "model.json"));
        for (String stem : List.of("truth", dag.hasHidden() ? "mag" : "cpdag", "pag")) {
            for (GraphFormat f : formats) {
                names.add(stem + f.endings().get(0));
            }
            if (stem.equals("truth") && !formats.contains(GraphFormat.DOT)) {
                names.add("truth.dot");
            }
        }
        names.add("audit.json");
        return names;
    }

    /** Writes one truth with its data into {@code dir}, each graph in every one of {@code formats}. */
    static void write(Path dir, SimulatedTruth truth, DataSet data, String title, List<GraphFormat> formats)
            throws IOException {
        Graph dag = truth.dag();
        Files.createDirectories(dir);
        if (data != null) {
            DataCsv.write(dir.resolve("data.csv"), data);
            ColumnKinds.write(ColumnKinds.besideData(dir.resolve("data.csv")), data);
        }
        ModelFile.write(dir.resolve("model.json"), truth.parameters());
        for (Map.Entry<String, Graph> g : graphs(dag).entrySet()) {
            String what = g.getKey().equals("truth") ? "true DAG " : "true " + g.getKey().toUpperCase(Locale.ROOT) + " ";
            for (GraphFormat f : formats) {
                f.write(dir.resolve(g.getKey() + f.endings().get(0)), g.getValue(), what + title);
            }
        }
        if (!formats.contains(GraphFormat.DOT)) {
            GraphDot.write(dir.resolve("truth.dot"), dag, "true DAG " + title);
        }
        if (data != null) {
            AtomicFiles.writeString(dir.resolve("audit.json"), auditJson(SortabilityAudit.of(dag, data)));
        }
    }

    /** The sortability audit as JSON; undefined values (discrete data, no paths) are null. */
    static String auditJson(SortabilityAudit a) {
        ObjectMapper json = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
        ObjectNode o = json.createObjectNode();
        putNumber(o, "varsortability", a.varsortability());
        putNumber(o, "r2_sortability", a.r2Sortability());
        o.put("path_pairs", a.pathPairs());
        if (a.r2Skipped()) {
            o.put("r2_sortability_note", "not computed for more than " + SortabilityAudit.R2_MAX_VARIABLES
                    + " variables: R² of each variable on all others needs the inverse of the p × p covariance");
        }
        o.put("note", a.isDefined() ? "0.5 is what a random order scores; near 1 means sorting by the criterion"
                + " finds the causal order (Reisach, Seiler and Weichwald 2021)"
                : "undefined: the audit needs continuous data with at least one directed path between observed"
                + " variables");
        try {
            return json.writeValueAsString(o) + "\n";
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    private static void putNumber(ObjectNode o, String name, double v) {
        if (Double.isNaN(v)) {
            o.putNull(name);
        } else {
            o.put(name, v);
        }
    }
}
