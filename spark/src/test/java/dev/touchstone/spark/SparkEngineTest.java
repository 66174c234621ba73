package dev.touchstone.spark;

import dev.touchstone.harness.cli.Main;
import dev.touchstone.harness.execution.Journal;
import dev.touchstone.harness.execution.ResultTables;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The Spark engine on {@code local[2]} against the local engine, through the command line:
 * same runs.csv apart from timing columns, resume from a journal the local engine wrote, a
 * task that dies is retried. The reference is the local engine, whose determinism is
 * checked in the harness (StudyRunnerTest); the equality itself is the rule that
 * results do not depend on where or in which order runs are performed.
 */
class SparkEngineTest {

    private static final String STUDY = "name: spark-check\nseed: 7\nreplicates: 3\n"
            + "truth:\n  graph: {family: erdos-renyi, nodes: [5, 7], mean_degree: 2}\n"
            + "  model: {kind: linear-gaussian}\n"
            + "samples: [60, 200, oracle]\n"
            + "learners:\n  - {id: pc, use: pc, with: {alpha: [0.01, 0.05]}}\n  - {id: empty, use: empty}\n"
            + "  - {id: crash, use: crash-once-test}\n"
            + "  - {id: other, use: crash-once-test, with: {outcome: [fail, timeout]}}\n"
            + "metrics: [shd, adjacency_f1, orientation_f1, seconds]\nlimits: {seconds: 30}\ncompare_to: empty\n";

    @TempDir
    static Path tmp;
    private static Path study;
    private static Path local;

    @BeforeAll
    static void runLocally() throws IOException {
        study = tmp.resolve("study.yaml");
        Files.writeString(study, STUDY);
        local = tmp.resolve("local");
        Result r = cli("run", study.toString(), "--out", local.toString(), "--threads", "2", "--quiet");
        assertEquals(0, r.status, r.err);
    }

    record Result(int status, String out, String err) {
    }

    static Result cli(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Result(status, out.toString(), err.toString());
    }

    /** The rows of a table as column → value, without the timing columns. */
    static List<Map<String, String>> withoutTimings(Path csv) throws IOException {
        CSVFormat header = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get();
        try (CSVParser p = CSVParser.parse(csv, java.nio.charset.StandardCharsets.UTF_8, header)) {
            List<Map<String, String>> rows = new ArrayList<>();
            for (CSVRecord r : p) {
                Map<String, String> row = new LinkedHashMap<>(r.toMap());
                row.keySet().removeAll(ResultTables.TIMING_COLUMNS);
                rows.add(row);
            }
            return rows;
        }
    }

    /** summary.csv or comparisons.csv without the rows of the timing metric. */
    private static List<String> withoutTimingRows(Path csv) throws IOException {
        return Files.readString(csv).lines().filter(l -> !l.contains(",seconds,")).toList();
    }

    /** The kept estimate lines by run key. */
    private static Map<String, String> estimates(Path out) throws IOException {
        Map<String, String> m = new java.util.HashMap<>();
        for (String l : Files.readAllLines(out.resolve(Journal.ESTIMATES_FILE))) {
            m.put(dev.touchstone.harness.execution.EstimateCodec.read(l).key(), l);
        }
        return m;
    }

    private static long journalLines(Path out) throws IOException {
        return Files.readString(out.resolve(Journal.FILE_NAME)).lines().count();
    }

    @Test
    @DisplayName("local[2] gives the local engine's runs.csv and summary apart from timing columns")
    void sparkEqualsLocal() throws IOException {
        Path spark = tmp.resolve("spark");
        Result r = cli("run", study.toString(), "--out", spark.toString(), "--engine", "spark", "--master", "local[2]",
                "--quiet");
        assertEquals(0, r.status, r.err);
        List<Map<String, String>> runs = withoutTimings(local.resolve("runs.csv"));
        assertEquals(runs, withoutTimings(spark.resolve("runs.csv")));
        assertEquals(108, runs.size(), "2 settings x 3 replicates x 3 sample sizes x 6 configurations");
        assertEquals(18, runs.stream().filter(row -> row.get("status").equals("failed")
                && row.get("message").equals("test: this run fails")).count(), "failed runs recorded as locally");
        assertEquals(18, runs.stream().filter(row -> row.get("status").equals("timeout")).count());
        assertEquals(72, runs.stream().filter(row -> row.get("status").equals("ok")).count());
        assertTrue(runs.stream().anyMatch(row -> !row.get("shd").equals("0")), "pc finds edges");
        assertEquals(withoutTimingRows(local.resolve("summary.csv")), withoutTimingRows(spark.resolve("summary.csv")));
        assertEquals(withoutTimingRows(local.resolve("comparisons.csv")),
                withoutTimingRows(spark.resolve("comparisons.csv")));
        assertEquals(journalLines(local), journalLines(spark));
        // Each estimate travels from its task to the driver with its journal line.
        assertEquals(estimates(local), estimates(spark), "the same estimates are kept by both engines");
        assertEquals(journalLines(spark), Files.readAllLines(spark.resolve(Journal.ESTIMATES_FILE)).size());
    }

    @Test
    @DisplayName("a study begun by the local engine is finished on Spark: done runs are kept, the rest done once")
    void resumeFromLocalJournal() throws IOException {
        Path mixed = tmp.resolve("mixed");
        Files.createDirectories(mixed);
        List<String> lines = Files.readAllLines(local.resolve(Journal.FILE_NAME));
        int kept = lines.size() / 3;
        Files.write(mixed.resolve(Journal.FILE_NAME), lines.subList(0, kept));
        Result r = cli("run", study.toString(), "--out", mixed.toString(), "--engine", "spark", "--master",
                "local[2]");
        assertEquals(0, r.status, r.err);
        assertTrue(r.err.contains(String.format(java.util.Locale.ROOT, "%,d of %,d runs already done", kept,
                lines.size())), r.err);
        assertTrue(r.out.contains(String.format(java.util.Locale.ROOT, "%,d done now", lines.size() - kept)), r.out);
        assertEquals(lines.size(), journalLines(mixed), "no run done twice");
        assertEquals(withoutTimings(local.resolve("runs.csv")), withoutTimings(mixed.resolve("runs.csv")));
        List<String> journal = Files.readAllLines(mixed.resolve(Journal.FILE_NAME));
        assertEquals(lines.subList(0, kept), journal.subList(0, kept), "the local engine's lines are untouched");
    }

    /** A Spark run on this master whose first crash-once-test run kills its task. */
    private static Result withOneDeadTask(Path out, String master) {
        CrashOnceLearner.ARMED.set(true);
        return cli("run", study.toString(), "--out", out.toString(), "--engine", "spark", "--master", master,
                "--quiet");
    }

    @Test
    @DisplayName("a task that dies is retried by Spark (spark.task.maxFailures) and the study completes unchanged")
    void deadTaskIsRetried() throws IOException {
        Path retried = tmp.resolve("retried");
        Result r = withOneDeadTask(retried, "local[2]");
        assertEquals(0, r.status, r.err);
        assertTrue(!CrashOnceLearner.ARMED.get(), "the learner did kill one task");
        assertEquals(withoutTimings(local.resolve("runs.csv")), withoutTimings(retried.resolve("runs.csv")));
        assertEquals(journalLines(local), journalLines(retried), "the dead task left no line, its retry one per run");
    }

    @Test
    @DisplayName("without retries (local[2,1]) a dead task stops the job with one line; a resume finishes the study")
    void deadTaskWithoutRetriesThenResume() throws IOException {
        Path out = tmp.resolve("no-retry");
        Result r = withOneDeadTask(out, "local[2,1]");
        assertEquals(1, r.status, r.out + r.err);
        assertTrue(r.err.startsWith("error: the Spark job stopped:") && r.err.contains("run again to resume"), r.err);
        assertEquals(1, r.err.lines().count(), r.err);
        Result again = cli("run", study.toString(), "--out", out.toString(), "--quiet");
        assertEquals(0, again.status, again.err);
        assertEquals(withoutTimings(local.resolve("runs.csv")), withoutTimings(out.resolve("runs.csv")));
    }
}
