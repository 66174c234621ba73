package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.testing.TestWorld;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.File;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CrashSafetyTest {

    /** 160 runs of about 15 ms each: long enough to be killed in the middle. */
    static final String STUDY = "name: crash\nseed: 11\nreplicates: 10\n"
            + "truth:\n  graph: {family: chain, nodes: [3, 5]}\n  model: {kind: linear-gaussian}\n"
            + "samples: [40, 80]\n"
            + "learners:\n  - {id: slow, use: sleeper-test, with: {millis: 15}}\n"
            + "  - {id: skel, use: skeleton-test, with: {threshold: [0.1, 0.3]}}\n  - {id: e, use: empty-test}\n"
            + "metrics: [shd, edges, tests]\n";

    @TempDir
    Path tmp;

    @Test
    @DisplayName("SIGKILL in the middle of a study, then resume: no run lost or duplicated, results equal an uninterrupted run's")
    void killAndResume() throws Exception {
        Plan plan = TestWorld.plan(STUDY);
        Path out = tmp.resolve("killed");
        Path journal = out.resolve(Journal.FILE_NAME);
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String cp = System.getProperty("java.class.path");
        Process child = new ProcessBuilder(java, "-cp", cp, CrashChild.class.getName(), out.toString())
                .redirectErrorStream(true).redirectOutput(tmp.resolve("child.log").toFile()).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
        int seen = 0;
        while (System.nanoTime() < deadline && child.isAlive()) {
            seen = Files.exists(journal) ? lines(journal) : 0;
            if (seen >= 20) {
                break;
            }
            Thread.sleep(5);
        }
        assertTrue(child.isAlive(), "the child finished before it could be killed (saw " + seen + " lines); log: "
                + (Files.exists(tmp.resolve("child.log")) ? Files.readString(tmp.resolve("child.log")) : ""));
        child.destroyForcibly(); // SIGKILL on Unix
        assertTrue(child.waitFor(30, TimeUnit.SECONDS));
        int survived = lines(journal);
        assertTrue(survived < plan.runs().size(), "killed mid-study: " + survived);
        // Right after the kill: every run the journal holds has its kept estimate (estimates are
        // synced first), and what is kept beyond the journal's runs is left out when read.
        var afterKill = Journal.read(journal).lines().keySet();
        assertEquals(afterKill, Journal.readEstimates(journal).keySet(), "estimates consistent with the journal");

        StudyRunner.Outcome o = TestWorld.runner().run(plan, new StudyRunner.Options(out, 2, Progress.quiet(),
                new PrintWriter(new StringWriter())));
        assertEquals(plan.runs().size(), o.reused() + o.performed());
        assertTrue(o.reused() >= 20, "runs in the journal were kept: " + o.reused());

        List<String> journalLines = Files.readAllLines(journal);
        Set<String> keys = new HashSet<>();
        for (String l : journalLines) {
            assertTrue(keys.add(JournalCodec.read(l).result().key()), "duplicated run in the journal: " + l);
        }
        assertEquals(plan.runs().size(), keys.size(), "no run lost");
        List<String> estimateLines = Files.readAllLines(out.resolve(Journal.ESTIMATES_FILE));
        Set<String> estimateKeys = new HashSet<>();
        for (String l : estimateLines) {
            assertTrue(estimateKeys.add(EstimateCodec.key(l)), "duplicated estimate: " + l);
        }
        assertEquals(keys, estimateKeys, "one kept estimate per journal line after the resume");

        Path clean = tmp.resolve("clean");
        TestWorld.runner().run(plan, new StudyRunner.Options(clean, 1, Progress.quiet(),
                new PrintWriter(new StringWriter())));
        assertEquals(StudyRunnerTest.withoutTimings(clean.resolve("runs.csv")),
                StudyRunnerTest.withoutTimings(out.resolve("runs.csv")));
        assertFalse(Files.readString(out.resolve("runs.csv")).isEmpty());
    }

    private static int lines(Path f) throws IOException {
        byte[] b = Files.readAllBytes(f);
        int n = 0;
        for (byte x : b) {
            if (x == '\n') {
                n++;
            }
        }
        return n;
    }

    static String pathSeparator() {
        return File.pathSeparator;
    }
}
