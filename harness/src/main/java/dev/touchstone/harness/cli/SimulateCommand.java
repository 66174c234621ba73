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
import dev.touchstone.harness.execution.GeneratorSimulator;
import dev.touchstone.harness.execution.Replicate;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.io.AtomicFiles;
import dev.touchstone.harness.io.DataCsv;
import dev.touchstone.harness.io.GraphDot;
import dev.touchstone.harness.io.GraphJson;
import dev.touchstone.harness.study.Canonical;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.ReplicateSeeds;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.harness.study.StudyFields;
import dev.touchstone.harness.study.TruthSetting;
import dev.touchstone.metrics.truth.TruthSelection;
import picocli.CommandLine.Command;
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
 * </ul>
 * Each folder holds {@code data.csv}, {@code truth.json} and {@code truth.dot} (the DAG,
 * hidden variables flagged), {@code cpdag.json} when nothing is hidden or else
 * {@code mag.json}, {@code pag.json} (over the observed variables) and {@code audit.json}
 * (varsortability and R²-sortability of the data against the truth).
 */
@Command(name = "simulate", sortOptions = false,
        description = {"Write data sets with their truth graphs, without running learners:",
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

    @Option(names = "--model", paramLabel = "KIND",
            description = "The structural-equation model (default: " + DEFAULT_MODEL + ").")
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

    @Option(names = "--seed", paramLabel = "N", description = "The root of every random choice (default: 1).")
    Long seed;

    @Option(names = "--learners", paramLabel = "FILE", description = "With STUDY: a learners file, if the study names command learners.")
    Path learnersFile;

    @Option(names = "--plugins", paramLabel = "DIR", description = "With STUDY: a folder of plug-in jars, if the study names plug-ins.")
    Path plugins;

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
        Map<String, Object> truthOptions = truthOptions();
        truthOptions.put("--samples", samples);
        truthOptions.put("--seed", seed);
        for (Map.Entry<String, Object> e : truthOptions.entrySet()) {
            if (e.getValue() != null) {
                throw new UsageException(e.getKey() + ": describes one truth and cannot be combined with a STUDY"
                        + " file (the study says what to simulate)");
            }
        }
        Toolkit kit = new Toolkit(learnersFile, plugins);
        Plan plan = kit.plan(kit.readStudy(study));
        int rows = StudyRunner.largestRows(plan);
        Files.createDirectories(out);
        GeneratorSimulator sim = new GeneratorSimulator();
        List<List<String>> index = new ArrayList<>();
        int written = 0;
        for (TruthSetting t : plan.truths()) {
            for (int r = 0; r < plan.study().replicates(); r++) {
                ReplicateSeeds seeds = new ReplicateSeeds(plan.study().seed(), t, r);
                Replicate rep = sim.draw(t, seeds, rows);
                String name = String.format(Locale.ROOT, "t%d-r%d", t.index(), r);
                write(out.resolve(name), rep.trueDag(), rep.data(), name);
                index.add(List.of(name, Integer.toString(t.index()), Integer.toString(r), Integer.toString(rows),
                        Long.toString(seeds.replicateSeed()), t.label()));
                written++;
            }
        }
        AtomicFiles.writeString(out.resolve("replicates.csv"), Cells.csv(List.of("folder", "truth_setting",
                "replicate", "rows", "seed", "setting"), index));
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
        if (learnersFile != null || plugins != null) {
            throw new UsageException((learnersFile != null ? "--learners" : "--plugins")
                    + ": only used with a STUDY file");
        }
        if (network != null && (graph != null || model != null)) {
            throw new UsageException((graph != null ? "--graph" : "--model") + ": cannot be combined with --network"
                    + " (a network brings its own graph and model)");
        }
        int rows = samples == null ? DEFAULT_SAMPLES : samples;
        if (rows < StudyFields.MIN_SAMPLES) {
            throw new UsageException("--samples: " + rows + " is not a sample size (allowed: whole numbers of at least "
                    + StudyFields.MIN_SAMPLES + ")");
        }
        long root = seed == null ? 1L : seed;
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
        Replicate rep = new GeneratorSimulator().draw(t, seeds, rows);
        write(out, rep.trueDag(), rep.data(), t.label());
        PrintWriter w = spec.commandLine().getOut();
        w.printf(Locale.ROOT, "wrote %,d rows of %d variables (%s; seed %d) to %s: %s%n", rows,
                rep.data().columns(), t.description(), root, out, String.join(", ", files(rep.trueDag())));
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

    /** The names of the files {@link #write} makes for this truth. */
    static List<String> files(Graph dag) {
        List<String> names = new ArrayList<>(List.of("data.csv", "truth.json", "truth.dot"));
        names.add(dag.hasHidden() ? "mag.json" : "cpdag.json");
        names.add("pag.json");
        names.add("audit.json");
        return names;
    }

    /** Writes one truth with its data into {@code dir}. */
    static void write(Path dir, Graph dag, DataSet data, String title) throws IOException {
        Files.createDirectories(dir);
        if (data != null) {
            DataCsv.write(dir.resolve("data.csv"), data);
        }
        GraphJson.write(dir.resolve("truth.json"), dag);
        GraphDot.write(dir.resolve("truth.dot"), dag, "true DAG " + title);
        if (!dag.hasHidden()) {
            GraphJson.write(dir.resolve("cpdag.json"), Cpdags.of(dag));
        } else {
            GraphJson.write(dir.resolve("mag.json"), TruthSelection.as(dag, GraphClass.MAG).reference());
        }
        GraphJson.write(dir.resolve("pag.json"), TruthSelection.as(dag, GraphClass.PAG).reference());
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
