package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.testing.TestWorld;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The finished marker ({@link FinishedIndex}): a resume with nothing to do trusts it only while
 * the folder is exactly as the finishing session left it; any other folder is read as before,
 * with the journal's checks.
 */
class FinishedIndexTest {

    @TempDir
    Path tmp;

    private static StudyRunner.Outcome run(Plan plan, Path out, StringWriter said) {
        return TestWorld.runner().run(plan, new StudyRunner.Options(out, 2, Progress.quiet(), new PrintWriter(said)));
    }

    private static StudyRunner.Outcome run(Plan plan, Path out) {
        return run(plan, out, new StringWriter());
    }

    /** Every file of the folder with its bytes and modification time, to show that nothing was written. */
    private static Map<String, String> snapshot(Path out) throws IOException {
        Map<String, String> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(out)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                m.put(out.relativize(p).toString(), FinishedIndex.fingerprint(p) + "@"
                        + Files.getLastModifiedTime(p).toMillis());
            }
        }
        return m;
    }

    /** Sets every file's modification time into the past, so a rewrite would show even within one clock tick. */
    private static void age(Path out) throws IOException {
        try (Stream<Path> s = Files.walk(out)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                Files.setLastModifiedTime(p, FileTime.fromMillis(1_000_000_000_000L));
            }
        }
    }

    @Test
    @DisplayName("a finished study is recognised by its marker: same outcome, nothing read beyond it, nothing written")
    void finishedIsRecognised() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("r");
        StudyRunner.Outcome first = run(plan, out);
        assertFalse(first.alreadyFinished());
        FinishedIndex index = FinishedIndex.read(out);
        assertNotNull(index);
        assertEquals(plan.runs().size(), index.total());
        assertEquals(first.byStatus(), index.byStatus());
        age(out);
        Map<String, String> before = snapshot(out);
        StringWriter said = new StringWriter();
        Plan fresh = TestWorld.plan(StudyRunnerTest.STUDY);
        StudyRunner.Outcome again = run(fresh, out, said);
        assertTrue(again.alreadyFinished());
        assertFalse(fresh.runsBuilt(), "recognised by the plan's outline, without building its runs");
        assertEquals(plan.runs().size(), again.reused());
        assertEquals(0, again.performed());
        assertEquals(first.byStatus(), again.byStatus());
        assertEquals(before, snapshot(out), "a resume of a finished study writes nothing");
        assertTrue(said.toString().contains("0 to do"), said.toString());
    }

    @Test
    @DisplayName("a journal line damaged after the study finished: the marker is not believed and the resume is"
            + " refused with the line number, before anything is written")
    void damagedAfterFinishing() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("bad");
        run(plan, out);
        List<String> lines = new ArrayList<>(Files.readAllLines(out.resolve(Journal.FILE_NAME)));
        lines.set(5, "{\"key\": 12");
        Files.write(out.resolve(Journal.FILE_NAME), lines);
        age(out);
        Map<String, String> before = snapshot(out);
        Journal.JournalException e = assertThrows(Journal.JournalException.class, () -> run(plan, out));
        assertTrue(e.getMessage().contains("journal.jsonl:6:"), e.getMessage());
        assertEquals(before, snapshot(out), "nothing is written, provenance and marker included");
    }

    @Test
    @DisplayName("a journal cut back after finishing (as by a crash of an older session): the missing runs are redone"
            + " and a new marker is written")
    void cutJournalIsRedone() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("cut");
        run(plan, out);
        String runs = StudyRunnerTest.withoutTimings(out.resolve(StudyRunner.RUNS_FILE));
        List<String> lines = Files.readAllLines(out.resolve(Journal.FILE_NAME));
        Files.write(out.resolve(Journal.FILE_NAME), lines.subList(0, 30));
        StudyRunner.Outcome again = run(plan, out);
        assertFalse(again.alreadyFinished());
        assertEquals(30, again.reused());
        assertEquals(plan.runs().size() - 30, again.performed());
        assertEquals(runs, StudyRunnerTest.withoutTimings(out.resolve(StudyRunner.RUNS_FILE)));
        assertTrue(run(plan, out).alreadyFinished(), "the session that finished wrote a marker again");
    }

    @Test
    @DisplayName("an output table removed after finishing is rebuilt: the marker vouches for every output")
    void missingTableIsRebuilt() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("gone");
        run(plan, out);
        String summary = Files.readString(out.resolve(StudyRunner.SUMMARY_FILE));
        Files.delete(out.resolve(StudyRunner.SUMMARY_FILE));
        StudyRunner.Outcome again = run(plan, out);
        assertFalse(again.alreadyFinished());
        assertEquals(0, again.performed());
        assertEquals(summary, Files.readString(out.resolve(StudyRunner.SUMMARY_FILE)));
    }

    @Test
    @DisplayName("another plan in the same folder (a changed study) does not believe the marker")
    void changedStudyIsNotFinished() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("changed");
        run(plan, out);
        Plan more = TestWorld.plan(StudyRunnerTest.STUDY.replace("replicates: 3", "replicates: 4"));
        StudyRunner.Outcome again = run(more, out);
        assertFalse(again.alreadyFinished());
        assertEquals(plan.runs().size(), again.reused());
        assertEquals(more.runs().size() - plan.runs().size(), again.performed());
    }

    @Test
    @DisplayName("the same runs under a changed study text (another description): the marker is not believed, the"
            + " runs are kept and the study copy rewritten")
    void sameRunsOtherTextIsNotFinished() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("described");
        run(plan, out);
        Plan described = TestWorld.plan(StudyRunnerTest.STUDY.replace("seed: 7\n", "seed: 7\ndescription: now said\n"));
        assertEquals(plan.outlineHash(), described.outlineHash());
        StudyRunner.Outcome again = run(described, out);
        assertFalse(again.alreadyFinished());
        assertEquals(plan.runs().size(), again.reused());
        assertEquals(0, again.performed());
        assertTrue(Files.readString(out.resolve(StudyRunner.STUDY_FILE)).contains("now said"));
        assertTrue(run(described, out).alreadyFinished());
    }

    @Test
    @DisplayName("a marker of the earlier layout (the hash of every key instead of the outline) is not believed")
    void earlierMarkerIsNotBelieved() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("earlier");
        run(plan, out);
        Path marker = out.resolve(FinishedIndex.FILE_NAME);
        String text = Files.readString(marker);
        assertTrue(text.contains("\"outline\" : "), text);
        Files.writeString(marker, text.replace("\"outline\" : \"" + plan.outlineHash() + "\"",
                "\"plan\" : \"" + plan.hash() + "\""));
        assertEquals(null, FinishedIndex.read(out));
        StudyRunner.Outcome again = run(plan, out);
        assertFalse(again.alreadyFinished());
        assertEquals(0, again.performed());
        assertTrue(run(plan, out).alreadyFinished(), "the session wrote a marker of the present layout");
    }

    @Test
    @DisplayName("an unreadable marker is not believed: the journal is read as before")
    void unreadableMarker() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("garbled");
        run(plan, out);
        Files.writeString(out.resolve(FinishedIndex.FILE_NAME), "{\"plan\": ");
        assertFalse(run(plan, out).alreadyFinished());
        assertTrue(run(plan, out).alreadyFinished());
    }

    /** Replaces the first byte of a file by another, keeping its size. */
    private static void flipFirstByte(Path p) throws IOException {
        byte[] b = Files.readAllBytes(p);
        b[0] = (byte) (b[0] == 'x' ? 'y' : 'x');
        Files.write(p, b);
    }

    @Test
    @DisplayName("a table changed after finishing with the same size and a new modification time: the digest is"
            + " checked, the marker is not believed, and the table is rebuilt")
    void sameSizeNewTimeIsDigested() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("same-size");
        run(plan, out);
        Path runs = out.resolve(StudyRunner.RUNS_FILE);
        String table = StudyRunnerTest.withoutTimings(runs);
        long size = Files.size(runs);
        FileTime marker = Files.getLastModifiedTime(out.resolve(FinishedIndex.FILE_NAME));
        flipFirstByte(runs);
        // older than the marker, so only the changed time (not the marker guard) sends it to the digest
        Files.setLastModifiedTime(runs, FileTime.fromMillis(marker.toMillis() - 5_000));
        assertEquals(size, Files.size(runs));
        StudyRunner.Outcome again = run(plan, out);
        assertFalse(again.alreadyFinished());
        assertEquals(0, again.performed());
        assertEquals(table, StudyRunnerTest.withoutTimings(runs));
        assertTrue(run(plan, out).alreadyFinished());
    }

    @Test
    @DisplayName("a file with its recorded size and time, older than the marker, is trusted without being read;"
            + " the same file with the marker's own time is digested")
    void unchangedSizeAndTimeAreTrusted() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("trusted");
        run(plan, out);
        Path markerFile = out.resolve(FinishedIndex.FILE_NAME);
        Files.setLastModifiedTime(markerFile, FileTime.fromMillis(Files.getLastModifiedTime(markerFile).toMillis()
                + 2_000));
        FinishedIndex index = FinishedIndex.read(out);
        assertNotNull(index);
        Path summary = out.resolve(StudyRunner.SUMMARY_FILE);
        FileTime kept = Files.getLastModifiedTime(summary);
        flipFirstByte(summary);
        Files.setLastModifiedTime(summary, kept);
        // the documented limit of a size-and-time check: a same-size edit that puts the old time back is not seen
        assertTrue(index.matches(out, index.hashes()));
        Files.setLastModifiedTime(summary, Files.getLastModifiedTime(markerFile));
        assertFalse(index.matches(out, index.hashes()),
                "a file as new as the marker could have changed within the clock tick, so it is digested");
    }
}
