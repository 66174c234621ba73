package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.testing.TestWorld;
import dev.touchstone.metrics.results.RunStatus;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringReader;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class StudyRunnerTest {

    static final String STUDY = "name: tiny\nseed: 7\nreplicates: 3\n"
            + "truth:\n  graph: {family: [chain, star], nodes: [4, 6]}\n  model: {kind: linear-gaussian}\n"
            + "samples: [30, 200, oracle]\n"
            + "learners:\n  - {id: empty, use: empty-test, with: {alpha: [0.01, 0.05]}}\n"
            + "  - {id: skel, use: skeleton-test}\n"
            + "metrics: [shd, edges, tests, seconds]\ncompare_to: skel\n";

    @TempDir
    Path tmp;

    private StudyRunner.Outcome run(Plan plan, Path out, int threads, Long shuffle) {
        return TestWorld.runner().run(plan, new StudyRunner.Options(out, threads, Progress.quiet(),
                new PrintWriter(new StringWriter()), shuffle));
    }

    /** runs.csv without the timing columns. */
    static String withoutTimings(Path runsCsv) throws IOException {
        String text = Files.readString(runsCsv);
        StringBuilder sb = new StringBuilder();
        try (CSVParser p = CSVParser.parse(new StringReader(text), CSVFormat.DEFAULT)) {
            List<CSVRecord> records = p.getRecords();
            List<String> header = new ArrayList<>();
            records.get(0).forEach(header::add);
            for (CSVRecord r : records) {
                for (int i = 0; i < header.size(); i++) {
                    if (!ResultTables.TIMING_COLUMNS.contains(header.get(i))) {
                        sb.append(r.get(i)).append('|');
                    }
                }
                sb.append('\n');
            }
        }
        return sb.toString();
    }

    @Test
    @DisplayName("1 thread, 2 threads and shuffled order give identical runs.csv apart from timing columns (results never depend on execution order)")
    void deterministic() throws IOException {
        Plan plan = TestWorld.plan(STUDY);
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        Path c = tmp.resolve("c");
        run(plan, a, 1, null);
        run(plan, b, 2, null);
        run(plan, c, 2, 12345L);
        String ra = withoutTimings(a.resolve("runs.csv"));
        assertEquals(ra, withoutTimings(b.resolve("runs.csv")));
        assertEquals(ra, withoutTimings(c.resolve("runs.csv")));
        assertEquals(Files.readString(a.resolve("summary.csv")).lines().filter(l -> !l.contains(",seconds,")).toList(),
                Files.readString(b.resolve("summary.csv")).lines().filter(l -> !l.contains(",seconds,")).toList());
        // the result is not trivially constant: the skeleton learner finds edges at n = 200
        assertTrue(ra.contains("|ok|"), ra);
        assertEquals(2 * 2 * 3 * 3 * 3 + 1, ra.lines().count());
    }

    @Test
    @DisplayName("every output file is written; the oracle goes to learners that use it, others are skipped with a reason")
    void outputsAndOracle() throws IOException {
        Plan plan = TestWorld.plan(STUDY);
        Path out = tmp.resolve("o");
        StudyRunner.Outcome o = run(plan, out, 2, null);
        for (String f : List.of("study.yaml", "provenance.json", "journal.jsonl", "runs.csv", "summary.csv",
                "comparisons.csv")) {
            assertTrue(Files.isRegularFile(out.resolve(f)), f);
        }
        // 12 replicates x 2 empty configurations can't use the oracle
        assertEquals(2 * 2 * 3 * 2, o.count(RunStatus.SKIPPED));
        String runs = Files.readString(out.resolve("runs.csv"));
        assertTrue(runs.contains("skipped,learner empty-test cannot use the oracle"), runs);
        // the oracle skeleton of a chain/star is the true skeleton: shd 0 at the oracle for skel
        int oracleSkeletons = 0;
        try (CSVParser p = CSVParser.parse(new StringReader(runs), CSVFormat.DEFAULT.builder().setHeader()
                .setSkipHeaderRecord(true).get())) {
            for (CSVRecord r : p) {
                if (r.get("oracle").equals("true") && r.get("configuration").equals("skel")) {
                    assertEquals("ok", r.get("status"), r.toString());
                    assertEquals("", r.get("samples"), "the oracle has no sample size: " + r);
                    oracleSkeletons++;
                }
            }
        }
        assertEquals(2 * 2 * 3, oracleSkeletons, "one oracle run of skel per replicate");
        assertTrue(Files.readString(out.resolve("provenance.json")).contains("\"finished\""));
        assertEquals(plan.runs().size(), Files.readAllLines(out.resolve("journal.jsonl")).size());
    }

    @Test
    @DisplayName("resuming a finished study does nothing and rewrites the same tables")
    void resumeFinished() throws IOException {
        Plan plan = TestWorld.plan(STUDY);
        Path out = tmp.resolve("r");
        run(plan, out, 2, null);
        String before = Files.readString(out.resolve("runs.csv"));
        StudyRunner.Outcome again = run(plan, out, 2, null);
        assertEquals(plan.runs().size(), again.reused());
        assertEquals(0, again.performed());
        assertEquals(before, Files.readString(out.resolve("runs.csv")));
        assertEquals(plan.runs().size(), Files.readAllLines(out.resolve("journal.jsonl")).size());
    }

    @Test
    @DisplayName("a torn last journal line is ignored and its run redone; the result equals an uninterrupted run's")
    void tornLine() throws IOException {
        Plan plan = TestWorld.plan(STUDY);
        Path full = tmp.resolve("full");
        run(plan, full, 1, null);
        Path out = tmp.resolve("torn");
        Files.createDirectories(out);
        List<String> lines = Files.readAllLines(full.resolve("journal.jsonl"));
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < 40; i++) {
            sb.append(lines.get(i)).append('\n');
        }
        sb.append(lines.get(40), 0, lines.get(40).length() / 2); // torn: half a line, no newline
        Files.writeString(out.resolve("journal.jsonl"), sb.toString());
        StringWriter said = new StringWriter();
        StudyRunner.Outcome o = TestWorld.runner().run(plan, new StudyRunner.Options(out, 2, Progress.quiet(),
                new PrintWriter(said)));
        assertEquals(40, o.reused());
        assertEquals(plan.runs().size() - 40, o.performed());
        assertTrue(said.toString().contains("torn"), said.toString());
        assertEquals(withoutTimings(full.resolve("runs.csv")), withoutTimings(out.resolve("runs.csv")));
        List<String> journal = Files.readAllLines(out.resolve("journal.jsonl"));
        assertEquals(plan.runs().size(), journal.size());
        assertEquals(plan.runs().size(), journal.stream().map(l -> JournalCodec.read(l).result().key()).distinct().count());
    }

    @Test
    @DisplayName("a damaged line in the middle of the journal is refused with its line number")
    void damagedMiddleLine() throws IOException {
        Plan plan = TestWorld.plan(STUDY);
        Path out = tmp.resolve("bad");
        run(plan, out, 1, null);
        List<String> lines = new ArrayList<>(Files.readAllLines(out.resolve("journal.jsonl")));
        lines.set(5, "{\"key\": 12");
        Files.write(out.resolve("journal.jsonl"), lines);
        Journal.JournalException e = assertThrows(Journal.JournalException.class, () -> run(plan, out, 1, null));
        assertTrue(e.getMessage().contains("journal.jsonl:6:"), e.getMessage());
    }

    @Test
    @DisplayName("a changed study recomputes only the runs whose definition changed, and says how many")
    void changedStudy() throws IOException {
        Path out = tmp.resolve("changed");
        run(TestWorld.plan(STUDY), out, 2, null);
        // change the skeleton learner's threshold: only its runs change
        String changed = STUDY.replace("{id: skel, use: skeleton-test}", "{id: skel, use: skeleton-test, with: {threshold: 0.3}}");
        Plan plan2 = TestWorld.plan(changed);
        StringWriter said = new StringWriter();
        StudyRunner.Outcome o = TestWorld.runner().run(plan2, new StudyRunner.Options(out, 2, Progress.quiet(),
                new PrintWriter(said)));
        int skelRuns = 2 * 2 * 3 * 3;
        assertEquals(skelRuns, o.changed());
        assertEquals(skelRuns, o.performed());
        assertEquals(plan2.runs().size() - skelRuns, o.reused());
        assertTrue(said.toString().contains(skelRuns + " runs whose definition changed will be recomputed"), said.toString());
        Path fresh = tmp.resolve("fresh");
        run(plan2, fresh, 1, null);
        assertEquals(withoutTimings(fresh.resolve("runs.csv")), withoutTimings(out.resolve("runs.csv")));
    }

    @Test
    @DisplayName("a run over its time limit is recorded timeout, one that throws failed with its message; the study goes on")
    void limitsAndFailures() throws IOException {
        String study = "name: lim\nseed: 3\nreplicates: 2\ntruth:\n  graph: {family: chain, nodes: 3}\n"
                + "  model: {kind: linear-gaussian}\nsamples: [20]\nlearners:\n"
                + "  - {id: slow, use: sleeper-test, with: {millis: 5000}}\n  - {id: boom, use: boom-test}\n"
                + "  - {id: ok, use: empty-test}\nlimits: {seconds: 0.1}\n";
        Plan plan = TestWorld.plan(study);
        StudyRunner.Outcome o = run(plan, tmp.resolve("lim"), 2, null);
        assertEquals(2, o.count(RunStatus.TIMEOUT));
        assertEquals(2, o.count(RunStatus.FAILED));
        assertEquals(2, o.count(RunStatus.OK));
        String runs = Files.readString(tmp.resolve("lim").resolve("runs.csv"));
        assertTrue(runs.contains("timeout,time limit of 0.1 s reached"), runs);
        assertTrue(runs.contains("failed,the test learner always fails"), runs);
    }

    @Test
    @DisplayName("a folder that is not a study's output is refused")
    void foreignFolder() throws IOException {
        Path out = tmp.resolve("foreign");
        Files.createDirectories(out);
        Files.writeString(out.resolve("notes.txt"), "mine");
        assertThrows(StudyRunner.OutputFolderException.class, () -> run(TestWorld.plan(STUDY), out, 1, null));
    }

    @Test
    @DisplayName("the normalised study.yaml reads back to the same plan (same keys)")
    void normalisedReadsBack() throws IOException {
        Plan plan = TestWorld.plan(STUDY.replace("model: {kind: linear-gaussian}",
                "model: {kind: linear-gaussian, edge_weight: {low: 0.2, high: [1.0, 2.0]}}\n  hidden: 1"));
        Path out = tmp.resolve("norm");
        run(plan, out, 2, null);
        Plan again = TestWorld.plan(Files.readString(out.resolve("study.yaml")));
        assertEquals(plan.hash(), again.hash());
        assertNotEquals(TestWorld.plan(STUDY).hash(), plan.hash());
    }

    @Test
    @DisplayName("journal lines are appended whole even when a previous session left no newline")
    void appendAfterCleanTail() throws IOException {
        Path f = tmp.resolve("j.jsonl");
        Files.writeString(f, "", StandardOpenOption.CREATE);
        try (Journal j = Journal.open(f)) {
            assertFalse(j.hadTornLine());
            assertTrue(j.existing().isEmpty());
        }
        assertEquals("", Files.readString(f, StandardCharsets.UTF_8));
    }
}
