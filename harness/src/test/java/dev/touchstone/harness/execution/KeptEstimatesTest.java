package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.testing.TestWorld;
import dev.touchstone.metrics.results.RunStatus;
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
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The estimates kept beside the journal: one line per run, consistent with the journal after a crash. */
class KeptEstimatesTest {

    @TempDir
    Path tmp;

    private static StudyRunner.Outcome run(Plan plan, Path out, int threads) {
        return TestWorld.runner().run(plan, new StudyRunner.Options(out, threads, Progress.quiet(),
                new PrintWriter(new StringWriter())));
    }

    /** Estimate lines by key, as text. */
    private static Map<String, String> estimateLines(Path out) throws IOException {
        Map<String, String> m = new LinkedHashMap<>();
        for (String l : Files.readAllLines(out.resolve(Journal.ESTIMATES_FILE))) {
            String k = EstimateCodec.key(l);
            assertNull(m.put(k, l), "two estimate lines for run " + k);
        }
        return m;
    }

    private static List<String> journalKeys(Path out) throws IOException {
        List<String> keys = new ArrayList<>();
        for (String l : Files.readAllLines(out.resolve(Journal.FILE_NAME))) {
            keys.add(JournalCodec.read(l).result().key());
        }
        return keys;
    }

    @Test
    @DisplayName("every run has one kept estimate, in journal order; oracle skeletons are complete as d-separation says")
    void oneLinePerRun() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("s");
        run(plan, out, 2);
        assertEquals(journalKeys(out), new ArrayList<>(estimateLines(out).keySet()));
        Map<String, EstimateCodec.Kept> kept = Journal.readEstimates(out.resolve(Journal.FILE_NAME));
        assertEquals(plan.runs().size(), kept.size());
        Map<String, JournalCodec.Line> journal = Journal.read(out.resolve(Journal.FILE_NAME)).lines();
        int checked = 0;
        int skipped = 0;
        for (RunDefinition r : plan.runs()) {
            Estimate e = kept.get(r.key()).estimate();
            if (journal.get(r.key()).result().status() == RunStatus.SKIPPED) {
                assertNull(e, "a skipped run has no estimate: " + r.coordinates());
                skipped++;
                continue;
            }
            assertNotNull(e, "an ok run keeps its estimate: " + r.coordinates());
            int p = r.truth().choice("graph").values().getInt("nodes");
            assertEquals(p, e.graph().size(), r.coordinates());
            if (r.config().learner() == TestWorld.EMPTY) {
                assertEquals(0, e.graph().edgeCount());
            } else if (r.sample().isOracle()) {
                // In a chain and in a star no two variables are d-separated by the empty set
                // (Pearl 1988, "Probabilistic Reasoning in Intelligent Systems", ch. 3: every pair
                // is joined by a path without colliders), so the marginal-dependence skeleton is complete.
                assertEquals(p * (p - 1) / 2, e.graph().edgeCount(), r.coordinates());
                assertEquals(GraphClass.CPDAG, e.graphClass());
                checked++;
            }
        }
        assertTrue(checked > 0);
        assertTrue(skipped > 0, "the empty learner cannot use the oracle, so some runs are skipped");
    }

    @Test
    @DisplayName("a kept estimate equals the learner's output when the run is performed again on the same replicate")
    void keptEqualsRecomputed() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("s");
        run(plan, out, 1);
        Map<String, EstimateCodec.Kept> kept = Journal.readEstimates(out.resolve(Journal.FILE_NAME));
        RunPerformer performer = new RunPerformer(TestWorld.SCORER, new SettingLayout(plan));
        int rows = StudyRunner.largestRows(plan);
        int compared = 0;
        for (RunDefinition r : plan.runs()) {
            if (r.replicate() != 1 || r.sample().isOracle()) {
                continue;
            }
            PerformedRun again = performer.performRun(r, TestWorld.SIMULATOR.draw(r.truth(), r.seeds(), rows));
            assertEquals(RunStatus.OK, again.result().status());
            assertEquals(again.estimate(), kept.get(r.key()).estimate(), r.coordinates());
            compared++;
        }
        assertTrue(compared >= 8, "compared " + compared);
    }

    @Test
    @DisplayName("torn journal tail after the estimates were synced: the extra estimates are cut, the resume matches a clean run")
    void tornJournalTail() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path full = tmp.resolve("full");
        run(plan, full, 1);
        Path out = tmp.resolve("torn");
        Files.createDirectories(out);
        List<String> j = Files.readAllLines(full.resolve(Journal.FILE_NAME));
        List<String> est = Files.readAllLines(full.resolve(Journal.ESTIMATES_FILE));
        // A crash between the estimates' sync and the journal's: the batch's estimate lines
        // (runs 30..44) are on disk, its journal lines only up to half of run 30's.
        Files.writeString(out.resolve(Journal.FILE_NAME), String.join("\n", j.subList(0, 30)) + "\n"
                + j.get(30).substring(0, j.get(30).length() / 2));
        Files.writeString(out.resolve(Journal.ESTIMATES_FILE), String.join("\n", est.subList(0, 45)) + "\n");
        Files.copy(full.resolve(StudyRunner.PROVENANCE_FILE), out.resolve(StudyRunner.PROVENANCE_FILE));

        try (Journal opened = Journal.open(out.resolve(Journal.FILE_NAME))) {
            assertEquals(30, opened.existing().size());
        }
        assertEquals(journalKeys(out), new ArrayList<>(estimateLines(out).keySet()),
                "after opening: no estimate without its journal line");

        StudyRunner.Outcome o = run(plan, out, 2);
        assertEquals(30, o.reused());
        assertEquals(new java.util.HashSet<>(journalKeys(out)), estimateLines(out).keySet());
        assertEquals(plan.runs().size(), journalKeys(out).size());
        assertEquals(estimateLines(full), estimateLines(out), "same estimates as an uninterrupted run");
        assertEquals(StudyRunnerTest.withoutTimings(full.resolve("runs.csv")),
                StudyRunnerTest.withoutTimings(out.resolve("runs.csv")));
    }

    @Test
    @DisplayName("crash while the estimates were written: a torn estimate line is cut, its runs redone, files consistent")
    void tornEstimatesTail() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path full = tmp.resolve("full");
        run(plan, full, 1);
        Path out = tmp.resolve("torn");
        Files.createDirectories(out);
        List<String> j = Files.readAllLines(full.resolve(Journal.FILE_NAME));
        List<String> est = Files.readAllLines(full.resolve(Journal.ESTIMATES_FILE));
        Files.writeString(out.resolve(Journal.FILE_NAME), String.join("\n", j.subList(0, 20)) + "\n");
        Files.writeString(out.resolve(Journal.ESTIMATES_FILE), String.join("\n", est.subList(0, 22)) + "\n"
                + est.get(22).substring(0, 10));
        Files.copy(full.resolve(StudyRunner.PROVENANCE_FILE), out.resolve(StudyRunner.PROVENANCE_FILE));
        StudyRunner.Outcome o = run(plan, out, 2);
        assertEquals(20, o.reused());
        List<String> keys = journalKeys(out);
        assertEquals(plan.runs().size(), keys.size());
        assertEquals(keys, new ArrayList<>(estimateLines(out).keySet()));
    }

    @Test
    @DisplayName("estimate lines round-trip: DAG, PAG with circles and extras, and a run without an estimate")
    void codecRoundTrip() {
        MutableGraph b = Graph.builder(List.of("A", "B", "C", "D"));
        b.addEdge(0, 1, Mark.CIRCLE, Mark.ARROW).addEdge(1, 2, Mark.ARROW, Mark.ARROW).addEdge(3, 2, Mark.TAIL, Mark.ARROW)
                .addEdge(0, 3, Mark.CIRCLE, Mark.CIRCLE);
        Estimate pag = new Estimate(b.freeze(), GraphClass.PAG, Map.of("score", -1234.5678901234567, "tests", 42.0));
        EstimateCodec.Kept back = EstimateCodec.read(EstimateCodec.write("k1", pag));
        assertEquals("k1", back.key());
        assertEquals(pag.graph(), back.estimate().graph());
        assertEquals(pag.graphClass(), back.estimate().graphClass());
        assertEquals(pag.extras(), back.estimate().extras());
        // D → C is written with the mark at D first, then at C: tail then arrow.
        assertTrue(EstimateCodec.write("k1", pag).contains("[3,2,\"ta\"]") || EstimateCodec.write("k1", pag)
                .contains("[2,3,\"at\"]"), EstimateCodec.write("k1", pag));
        assertNull(EstimateCodec.read(EstimateCodec.write("k2", null)).estimate());
        assertThrows(IllegalArgumentException.class, () -> EstimateCodec.read("{\"key\":\"k\",\"class\":\"dag\","
                + "\"nodes\":[\"A\"],\"edges\":[[0,1,\"ta\"]]}"));
        assertThrows(IllegalArgumentException.class, () -> EstimateCodec.read("{\"key\":\"k\",\"class\":\"dag\","
                + "\"nodes\":[\"A\",\"B\"],\"edges\":[[0,1,\"tx\"]]}"));
    }
}
