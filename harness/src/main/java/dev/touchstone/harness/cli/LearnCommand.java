package dev.touchstone.harness.cli;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeadlineExceededException;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.io.ColumnKinds;
import dev.touchstone.harness.io.DataCsv;
import dev.touchstone.harness.io.GraphFiles;
import dev.touchstone.harness.io.GraphFormat;
import dev.touchstone.harness.io.GraphJson;
import dev.touchstone.harness.io.KnowledgeFile;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.FutureTask;

/** {@code touchstone learn}: runs one learner on one data file and writes the graph it returns. */
@Command(name = "learn", description = "Run one learner on a data file and write the estimated graph.")
final class LearnCommand implements Callable<Integer> {

    @Option(names = "--learner", required = true, paramLabel = "ID", description = "The learner (see 'touchstone learners').")
    String learner;

    @Option(names = "--set", paramLabel = "ID.NAME=VALUE", description = "A parameter of the learner, e.g."
            + " pc.alpha=0.01 (as in calibrate; the ID may be left out here, there being one learner); repeat for"
            + " several.")
    List<String> settings = List.of();

    @Option(names = "--data", required = true, paramLabel = "FILE", description = "The data (CSV with a header row).")
    Path data;

    @Option(names = "--discrete", split = ",", paramLabel = "NAME", description = "Columns to read as discrete.")
    List<String> discrete = List.of();

    @Option(names = "--continuous", split = ",", paramLabel = "NAME", description = "Columns to read as continuous.")
    List<String> continuous = List.of();

    @Option(names = "--kinds", paramLabel = "FILE", description = "A kinds file (CSV: column,kind) declaring"
            + " columns continuous or discrete (default: NAME.kinds.csv beside the data, if there is one).")
    Path kinds;

    @Option(names = "--knowledge", paramLabel = "FILE", description = "Background knowledge (YAML or JSON).")
    Path knowledge;

    @Option(names = "--out", paramLabel = "FILE", description = "Where to write the graph, in the format its name"
            + " says: .json graph JSON, .csv edge list, .matrix.csv adjacency matrix, .dot or .gv DOT"
            + " (default: print it as JSON).")
    Path out;

    @Mixin
    SeedOption seed;

    @Option(names = "--seconds", paramLabel = "S", description = "Time limit (default: none).")
    Double seconds;

    @Mixin
    LearnerSourceOptions sources;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        if (out != null) {
            GraphFormat.of(out);
        }
        // The data is read on a thread of its own while the learner catalogue loads, since on a
        // large file both take a while; its result or error is taken where it was read before,
        // so the messages come in the same order.
        FutureTask<Loaded> reading = new FutureTask<>(() -> {
            ColumnKinds.Declared declared = ColumnKinds.declared(data, kinds, discrete, continuous);
            return new Loaded(declared, DataCsv.read(data, declared.kinds()));
        });
        Thread reader = new Thread(reading, "touchstone-learn-read");
        reader.setDaemon(true);
        reader.start();
        try {
            return learn(reading);
        } finally {
            reading.cancel(true);
        }
    }

    /** The kinds declared for the data file and the data read with them. */
    private record Loaded(ColumnKinds.Declared declared, DataCsv.Result read) {
    }

    private static Loaded await(FutureTask<Loaded> reading) throws Exception {
        try {
            return reading.get();
        } catch (ExecutionException e) {
            if (e.getCause() instanceof Exception cause) {
                throw cause;
            }
            if (e.getCause() instanceof Error error) {
                throw error;
            }
            throw e;
        }
    }

    private Integer learn(FutureTask<Loaded> reading) throws Exception {
        LearnerCatalog catalog = sources.toolkit().learners;
        LearnerCatalog.Entry entry = catalog.find(learner);
        if (entry == null) {
            throw new UsageException("--learner: unknown learner '" + learner + "' (available: "
                    + String.join(", ", catalog.ids()) + ")");
        }
        LearnerDescription d = entry.learner().description();
        Map<String, String> raw = Settings.forLearner(Settings.parse(settings), learner);
        ParameterValues values;
        try {
            values = ParameterValues.resolve("learner " + d.id(), d.parameters(), raw);
        } catch (ParameterException e) {
            throw new UsageException("--set: " + e.getMessage(), e);
        }
        Loaded loaded = await(reading);
        ColumnKinds.Declared declared = loaded.declared();
        DataCsv.Result read = loaded.read();
        String assumed = ColumnKinds.assumption(read, declared);
        String why = assumed == null ? "" : " (" + assumed + ")";
        Knowledge k = knowledge == null ? Knowledge.none() : KnowledgeFile.read(knowledge, read.data().names());
        LearnerInput input = LearnerInput.of(read.data());
        try {
            d.checkAccepts(input);
        } catch (LearnerException e) {
            throw new UsageException(data + ": " + e.getMessage() + why, e);
        }
        RunContext context = RunContext.of(seed.value(), seconds == null ? null : Duration.ofNanos((long) (seconds * 1e9)), 1);
        long t0 = System.nanoTime();
        Estimate est;
        try {
            est = entry.learner().learn(input, k, values, context);
        } catch (DeadlineExceededException e) {
            throw new UsageException("learner " + d.id() + " reached the time limit of " + seconds + " s");
        } catch (LearnerException e) {
            // the run failed (a fault of the learner, not of the tool): say why, exit 1
            spec.commandLine().getErr().println("error: learner " + d.id() + " failed: "
                    + dev.touchstone.harness.BadInputException.oneLine(e.getMessage() + why));
            spec.commandLine().getErr().flush();
            return Main.FAILED;
        }
        if (assumed != null) {
            spec.commandLine().getErr().println(assumed);
        }
        double secs = (System.nanoTime() - t0) / 1e9;
        PrintWriter err = spec.commandLine().getErr();
        if (out != null) {
            GraphFiles.write(out, est.graph(), d.id() + " on " + data.getFileName());
            err.printf(Locale.ROOT, "%s: %d edges (%s) in %.3f s, %d tests, %d scores; written to %s%n", d.id(),
                    est.graph().edgeCount(), est.graphClass().word(), secs, context.tests(), context.scores(), out);
        } else {
            spec.commandLine().getOut().println(GraphJson.toJson(est.graph()));
        }
        spec.commandLine().getOut().flush();
        err.flush();
        return Main.DONE;
    }
}
