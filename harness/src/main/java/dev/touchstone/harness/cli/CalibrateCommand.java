package dev.touchstone.harness.cli;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.DeadlineExceededException;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.harness.calibrate.Calibration;
import dev.touchstone.harness.calibrate.CalibrationOutcome;
import dev.touchstone.harness.calibrate.CalibrationSettings;
import dev.touchstone.harness.calibrate.CalibrationSummary;
import dev.touchstone.harness.calibrate.TruthGraphs;
import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.execution.Progress;
import dev.touchstone.harness.io.AtomicFiles;
import dev.touchstone.harness.io.ColumnKinds;
import dev.touchstone.harness.io.DataCsv;
import dev.touchstone.harness.io.GraphFiles;
import dev.touchstone.reports.calibration.CalibrationReport;
import dev.touchstone.reports.calibration.CalibrationView;
import dev.touchstone.reports.tables.Numbers;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

/**
 * {@code touchstone calibrate}: how reliable are these learners on data of this size and
 * shape? Fits truths to the data, simulates, runs, bootstraps and writes the report.
 */
@Command(name = "calibrate", sortOptions = false, description = "Estimate how well learners would do on data like yours: fit truths to"
        + " your data, simulate data sets of its size and shape, run the learners, bootstrap your data.")
final class CalibrateCommand implements Callable<Integer> {

    @Option(names = "--data", required = true, paramLabel = "FILE", description = "Your data (CSV with a header row).")
    Path data;

    @Option(names = "--learner", split = ",", paramLabel = "ID", description = "Learners to calibrate, by id (built-in,"
            + " from --learners FILE or from --plugins DIR); comma-separated or repeated (default: pc,ges).")
    List<String> learners = List.of("pc", "ges");

    @Option(names = "--set", paramLabel = "ID.NAME=VALUE", description = "A learner's parameter value, e.g."
            + " pc.alpha=0.01; repeat for several (also applies to --truth-learner of that id).")
    List<String> settings = List.of();

    @Option(names = "--graph", paramLabel = "FILE", description = "The truth DAG to fit (JSON, or a CSV edge list"
            + " ending in .csv); default: learned from the data by --truth-learner.")
    Path graph;

    @Option(names = "--truth-learner", paramLabel = "ID", description = "Learner that learns the truth graph when"
            + " --graph is not given (default: ges).")
    String truthLearner = "ges";

    @Option(names = "--samples", split = ",", paramLabel = "N", description = "Sample sizes to simulate (default:"
            + " n/2, n, 2n, 4n for data of n rows).")
    List<Integer> samples;

    @Option(names = "--replicates", paramLabel = "R", description = "Simulated data sets per sample size (default: 50).")
    int replicates = 50;

    @Option(names = "--variants", paramLabel = "V", description = "Perturbed truths besides the fitted one (default: 4).")
    int variants = 4;

    @Option(names = "--bootstrap", paramLabel = "B", description = "Bootstrap resamples of your data (default: 50).")
    int bootstrap = 50;

    @Option(names = "--discrete", split = ",", paramLabel = "NAME", description = "Columns to read as discrete.")
    List<String> discrete = List.of();

    @Option(names = "--continuous", split = ",", paramLabel = "NAME", description = "Columns to read as continuous.")
    List<String> continuous = List.of();

    @Option(names = "--kinds", paramLabel = "FILE", description = "A kinds file (CSV: column,kind) declaring"
            + " columns continuous or discrete (default: NAME.kinds.csv beside the data, if there is one).")
    Path kinds;

    @Option(names = "--out", paramLabel = "DIR", description = "Output folder (default: ./calibration).")
    Path out = Path.of("calibration");

    @Mixin
    ThreadsOption threads;

    @Mixin
    SeedOption seed;

    @Mixin
    LearnerSourceOptions sources;

    @Option(names = "--seconds", paramLabel = "S", description = "Time limit per run (default: 60).")
    double seconds = 60;

    @Option(names = "--quiet", description = "Print no progress.")
    boolean quiet;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        PrintWriter stdout = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        int n = threads.value();
        atLeast("--replicates", replicates, 1);
        atLeast("--variants", variants, 0);
        atLeast("--bootstrap", bootstrap, 0);
        if (!(seconds > 0) || Double.isInfinite(seconds)) {
            throw new UsageException("--seconds: " + seconds + " is not a positive number of seconds");
        }
        ColumnKinds.Declared declared = ColumnKinds.declared(data, kinds, discrete, continuous);
        DataCsv.Result read = DataCsv.read(data, declared.kinds());
        String assumed = ColumnKinds.assumption(read, declared);
        DataSet d = read.data();
        if (d.rows() < 4) {
            throw new UsageException(data + ": " + d.rows() + " rows; calibration needs at least 4");
        }
        LearnerCatalog catalog = sources.toolkit().learners;
        Map<String, Map<String, String>> raw = parameterSettings();
        List<String> ids = learners.stream().map(String::trim).toList();
        once("--learner", ids);
        List<CalibrationSettings.Choice> choices = new ArrayList<>();
        for (String id : ids) {
            CalibrationSettings.Choice c = choice(catalog, id, "--learner", raw);
            refuseUnaccepted(c, d, "--learner");
            choices.add(c);
        }
        for (String id : raw.keySet()) {
            if (!ids.contains(id) && !id.equals(truthLearner)) {
                throw new UsageException("--set: learner '" + id + "' is not among --learner or --truth-learner");
            }
        }
        Duration limit = Duration.ofNanos((long) (seconds * 1e9));
        List<Integer> sizes = samples == null ? CalibrationSettings.defaultSamples(d.rows()) : samples;
        for (int s : sizes) {
            if (s < 2) {
                throw new UsageException("--samples: " + s + " is not a sample size of at least 2");
            }
        }
        once("--samples", sizes);
        CalibrationSettings settings = CalibrationSettings.builder(choices, sizes).replicates(replicates)
                .variants(variants).bootstrap(bootstrap).seed(seed.value()).threads(n).limit(limit).build();
        err.print(read.describeKinds());
        Graph truth;
        List<String> truthLines = new ArrayList<>();
        String learnedBy = null;
        try {
            if (graph != null) {
                truth = TruthGraphs.given(GraphFiles.read(graph, d.names(), GraphClass.DAG), d, graph.toString());
                truthLines.add("Truth graph given in " + graph + " (" + truth.edgeCount() + " edges).");
            } else {
                CalibrationSettings.Choice c = choice(catalog, truthLearner, "--truth-learner", raw);
                refuseUnaccepted(c, d, "--truth-learner");
                if (!quiet) {
                    err.println("learning the truth graph from the data with " + c.id() + " (--graph FILE gives one)");
                    err.flush();
                }
                truth = learnedTruth(c, d, limit);
                learnedBy = c.id();
                truthLines.add("Truth graph learned from the data by " + c.id() + " (" + truth.edgeCount()
                        + " edges; a CPDAG is extended to one of its DAGs).");
            }
        } catch (IllegalArgumentException | LearnerException e) {
            throw new UsageException(e.getMessage(), e);
        }
        truthLines.add("Truth edges: " + (truth.edgeCount() == 0 ? "none" : String.join(", ",
                TruthGraphs.edgeLines(truth))) + ".");
        err.printf(Locale.ROOT, "truth: %d edges; %d truths, %d runs on %d threads%n", truth.edgeCount(),
                variants + 1, (replicates * sizes.size() + bootstrap) * choices.size(), n);
        err.flush();
        Progress progress = Toolkit.progress(quiet, err);
        CalibrationOutcome o;
        if (assumed != null) {
            err.println(assumed);
        }
        try {
            o = Calibration.run(d, truth, settings, progress);
        } catch (IllegalArgumentException e) {
            throw new UsageException(data + ": " + e.getMessage(), e);
        }
        List<String> dataLines = new ArrayList<>();
        dataLines.add(String.format(Locale.ROOT, "%s: %,d rows, %d columns (%s data); %d columns have missing"
                + " cells.", data.getFileName(), d.rows(), d.columns(), d.kind().name().toLowerCase(Locale.ROOT),
                missingColumns(d)));
        for (DataCsv.ColumnKind k : read.columns()) {
            dataLines.add(k.describe());
        }
        CalibrationView view = CalibrationSummary.view(o, "Calibration of " + String.join(", ", ids) + " on "
                + data.getFileName(), dataLines, truthLines, learnedBy);
        Files.createDirectories(out);
        AtomicFiles.writeString(out.resolve("calibration.html"), CalibrationReport.html(view));
        AtomicFiles.writeString(out.resolve("calibration.md"), CalibrationReport.markdown(view));
        AtomicFiles.writeString(out.resolve("calibration-runs.csv"), CalibrationRunsCsv.render(o));
        for (CalibrationView.Expectation e : view.expectations()) {
            if (e.metric().equals("orientation_precision") || e.metric().equals("adjacency_f1")) {
                stdout.printf(Locale.ROOT, "%s at %,d rows%s: %s median %s, 10%%–90%% of replicates %s – %s, mean %s%n",
                        e.learner(), view.expectedAt(), view.expectedAt() == view.analystRows() ? " (your size)"
                                : String.format(Locale.ROOT, " (nearest to your %,d)", view.analystRows()),
                        e.metric(), Numbers.format(e.spread().median()), Numbers.format(e.spread().p10()),
                        Numbers.format(e.spread().p90()), Numbers.format(e.means().allTruths()));
            }
        }
        for (String answer : CalibrationReport.answers(view)) {
            stdout.println(answer);
        }
        for (String w : view.warnings()) {
            stdout.println("warning: " + w);
        }
        stdout.printf(Locale.ROOT, "report: %s%n", out.resolve("calibration.html"));
        stdout.flush();
        return Main.DONE;
    }

    private Graph learnedTruth(CalibrationSettings.Choice c, DataSet d, Duration limit) {
        try {
            return TruthGraphs.learned(c, d, seed.value(), limit);
        } catch (DeadlineExceededException e) {
            throw new UsageException("--truth-learner " + c.id() + ": did not finish within " + seconds
                    + " s (--seconds); give --graph FILE or allow more time", e);
        } catch (IllegalArgumentException | LearnerException e) {
            throw new UsageException("--truth-learner " + c.id() + ": " + e.getMessage(), e);
        }
    }

    /** Refuses a value listed twice: it would make runs with the same coordinates, hence the same keys. */
    private static void once(String option, List<?> values) {
        Set<Object> seen = new HashSet<>();
        for (Object v : values) {
            if (!seen.add(v)) {
                throw new UsageException(option + ": " + v + " is listed twice");
            }
        }
    }

    private static void atLeast(String option, int value, int least) {
        if (value < least) {
            throw new UsageException(option + ": " + value + " is less than " + least);
        }
    }

    private static int missingColumns(DataSet d) {
        int n = 0;
        for (int j = 0; j < d.columns(); j++) {
            n += d.missingCount(j) > 0 ? 1 : 0;
        }
        return n;
    }

    /** The {@code --set ID.NAME=VALUE} values by learner id (read by {@link Settings}, as for the other verbs). */
    private Map<String, Map<String, String>> parameterSettings() {
        Map<String, Map<String, String>> out = new LinkedHashMap<>();
        Settings.parse(settings).forEach((name, value) -> {
            int dot = name.indexOf('.');
            if (dot <= 0 || dot == name.length() - 1) {
                throw new UsageException("--set " + name + "=" + value + ": expected ID.NAME=VALUE, e.g. pc.alpha=0.01");
            }
            out.computeIfAbsent(name.substring(0, dot).trim(), k -> new LinkedHashMap<>())
                    .put(name.substring(dot + 1).trim(), value);
        });
        return out;
    }

    /**
     * A learner that cannot take these data would only add a column of undefined expectations
     * and a warning about runs it never did, so it is refused before anything runs.
     */
    private static void refuseUnaccepted(CalibrationSettings.Choice c, DataSet d, String option) {
        Set<DataKind> accepted = c.learner().description().accepts();
        if (!accepted.contains(d.kind())) {
            throw new UsageException(option + ": " + c.id() + " does not accept " + word(d.kind()) + " data (it takes "
                    + accepted.stream().map(CalibrateCommand::word).sorted().collect(Collectors.joining(", "))
                    + "); leave it out or declare the column kinds with --kinds");
        }
    }

    private static String word(DataKind k) {
        return k.name().toLowerCase(Locale.ROOT);
    }

    private static CalibrationSettings.Choice choice(LearnerCatalog catalog, String id, String option,
                                                     Map<String, Map<String, String>> raw) {
        LearnerCatalog.Entry e = catalog.find(id);
        if (e == null) {
            throw new UsageException(option + ": unknown learner '" + id + "' (available: "
                    + String.join(", ", catalog.ids()) + ")");
        }
        try {
            ParameterValues values = ParameterValues.resolve("learner " + id, e.learner().description().parameters(),
                    raw.getOrDefault(id, Map.of()));
            return new CalibrationSettings.Choice(e.learner(), values);
        } catch (ParameterException ex) {
            throw new UsageException("--set: " + ex.getMessage(), ex);
        }
    }
}
