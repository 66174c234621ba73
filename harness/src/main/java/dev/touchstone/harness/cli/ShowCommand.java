package dev.touchstone.harness.cli;

import dev.touchstone.core.learner.Estimate;
import dev.touchstone.harness.execution.EstimateCodec;
import dev.touchstone.harness.execution.Journal;
import dev.touchstone.harness.execution.JournalCodec;
import dev.touchstone.harness.io.GraphFiles;
import dev.touchstone.harness.io.GraphFormat;
import dev.touchstone.harness.io.GraphJson;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.Callable;

/**
 * {@code touchstone show OUT --run KEY [--out FILE]}: exports the estimate one run of a study
 * returned, as kept in its output folder, in the graph format the file name says (JSON, CSV
 * edge list, adjacency-matrix CSV, DOT), or as graph JSON on standard output; the learner's
 * extras are printed. Without {@code --run}, or with a key the folder does not hold, it lists
 * the runs with their keys. Reads only; works on a running or interrupted study too.
 */
@Command(name = "show", description = "Export the estimate one run of a study returned, or list the runs.")
final class ShowCommand implements Callable<Integer> {

    @Parameters(paramLabel = "OUT", description = "The study's output folder (holding journal.jsonl and"
            + " estimates.jsonl).")
    Path folder;

    @Option(names = "--run", paramLabel = "KEY", description = "The run's key (as in runs.csv); without it the runs"
            + " are listed.")
    String key;

    @Option(names = "--out", paramLabel = "FILE", description = "Where to write the estimate; the format follows"
            + " the name (.json, .csv, .matrix.csv, .dot). Default: graph JSON on standard output.")
    Path file;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Path journal = folder.resolve(Journal.FILE_NAME);
        if (!Files.isRegularFile(journal)) {
            throw new UsageException(folder + ": not a study's output folder (it has no " + Journal.FILE_NAME + ")");
        }
        if (file != null && GraphFormat.forName(file.getFileName().toString()) == null) {
            throw new UsageException("--out " + file + ": the name must end in " + GraphFormat.accepted());
        }
        Map<String, JournalCodec.Line> runs;
        Map<String, EstimateCodec.Kept> kept;
        try {
            runs = Journal.read(journal).lines();
            // The journal is decoded once, the estimates are reconciled with its keys, and only
            // the graphs to be shown are decoded (all of them for the listing).
            boolean listing = key == null || !runs.containsKey(key);
            kept = Journal.readEstimates(journal, runs.keySet(), k -> listing || k.equals(key));
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + journal + ": " + e.getMessage(), e);
        }
        PrintWriter w = spec.commandLine().getOut();
        if (key == null) {
            list(w, runs, kept);
            return Main.DONE;
        }
        JournalCodec.Line line = runs.get(key);
        if (line == null) {
            list(w, runs, kept);
            throw new UsageException("--run " + key + ": the folder " + folder + " holds no run with this key (the "
                    + runs.size() + " runs it holds are listed above)");
        }
        EstimateCodec.Kept k = kept.get(key);
        Estimate e = k == null ? null : k.estimate();
        if (e == null) {
            throw new UsageException("--run " + key + ": the run " + (k == null ? "has no kept estimate (it was made"
                    + " before estimates were kept)" : "returned no estimate (" + line.result().status().word()
                    + (line.result().message() == null ? "" : ": " + line.result().message()) + ")"));
        }
        try {
            if (file == null) {
                w.print(GraphJson.toJson(e.graph()));
            } else {
                GraphFiles.write(file, e.graph(), line.result().configurationId() + " on "
                        + line.result().setting().label() + ", replicate " + line.result().replicate());
                w.printf(Locale.ROOT, "%s: %s with %d edges (%s) written%n", file, e.graphClass().word(),
                        e.graph().edgeCount(), GraphFormat.of(file).description());
            }
        } catch (IOException ex) {
            throw new UncheckedIOException("cannot write " + file + ": " + ex.getMessage(), ex);
        }
        if (!e.extras().isEmpty()) {
            w.printf(Locale.ROOT, "extras: %s%n", new TreeMap<>(e.extras()));
        }
        w.flush();
        return Main.DONE;
    }

    private static void list(PrintWriter w, Map<String, JournalCodec.Line> runs, Map<String, EstimateCodec.Kept> kept) {
        w.println("key\tstatus\testimate\tconfiguration\treplicate\tsetting");
        for (JournalCodec.Line l : runs.values()) {
            EstimateCodec.Kept k = kept.get(l.result().key());
            String est = k == null ? "not kept" : k.estimate() == null ? "none" : k.estimate().graphClass().word();
            w.printf(Locale.ROOT, "%s\t%s\t%s\t%s\t%d\t%s%n", l.result().key(), l.result().status().word(), est,
                    l.result().configurationId(), l.result().replicate(), l.result().setting().label());
        }
        w.flush();
    }
}
