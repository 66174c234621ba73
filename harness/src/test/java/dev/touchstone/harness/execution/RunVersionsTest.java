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
import java.util.HashMap;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Versions recorded per run, and resumes across a change of the tool's or a learner's version. */
class RunVersionsTest {

    @TempDir
    Path tmp;

    private static StudyRunner.Outcome run(StudyRunner runner, Plan plan, Path out) {
        return runner.run(plan, new StudyRunner.Options(out, 2, Progress.quiet(), new PrintWriter(new StringWriter())));
    }

    private static Map<String, Integer> toolCounts(Path out) throws IOException {
        Map<String, Integer> m = new HashMap<>();
        for (JournalCodec.Line l : Journal.read(out.resolve(Journal.FILE_NAME)).lines().values()) {
            m.merge(l.versions().tool(), 1, Integer::sum);
        }
        return m;
    }

    @Test
    @DisplayName("a resume under another tool version refuses with one line naming it; accepted, runs keep their versions")
    void toolChange() throws IOException {
        Plan small = TestWorld.plan(StudyRunnerTest.STUDY);
        Plan bigger = TestWorld.plan(StudyRunnerTest.STUDY.replace("replicates: 3", "replicates: 4"));
        Path out = tmp.resolve("v");
        StudyRunner old = TestWorld.runner().recording(new RunVersions("0.1.0", Map.of()));
        run(old, small, out);
        assertEquals(Map.of("0.1.0", small.runs().size()), toolCounts(out));
        String journal = Files.readString(out.resolve(Journal.FILE_NAME));

        StudyRunner newer = TestWorld.runner().recording(new RunVersions("0.2.0", Map.of()));
        StudyRunner.VersionChangeException e = assertThrows(StudyRunner.VersionChangeException.class,
                () -> run(newer, bigger, out));
        assertTrue(e.getMessage().contains("(tool 0.1.0 → 0.2.0)"), e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
        assertEquals(journal, Files.readString(out.resolve(Journal.FILE_NAME)), "a refused resume leaves the journal");

        StudyRunner.Outcome o = run(newer.acceptingVersionChange(true), bigger, out);
        assertEquals(small.runs().size(), o.reused());
        Map<String, Integer> counts = toolCounts(out);
        assertEquals(small.runs().size(), counts.get("0.1.0"));
        assertEquals(bigger.runs().size() - small.runs().size(), counts.get("0.2.0"));
        String prov = Files.readString(out.resolve(StudyRunner.PROVENANCE_FILE));
        assertTrue(prov.contains("\"mixed\" : true"), prov);

        // Resuming again with the new version still refuses: kept runs of 0.1.0 remain.
        assertThrows(StudyRunner.VersionChangeException.class, () -> run(newer, bigger, out));
    }

    @Test
    @DisplayName("a learner's own version change is named with the learner; lines from builds without versions are no change")
    void learnerChangeAndUnrecorded() throws IOException {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        Path out = tmp.resolve("l");
        run(TestWorld.runner().recording(new RunVersions("1.0", Map.of("skeleton-test", "a1"))), plan, out);
        StudyRunner.VersionChangeException e = assertThrows(StudyRunner.VersionChangeException.class,
                () -> run(TestWorld.runner().recording(new RunVersions("1.0", Map.of("skeleton-test", "a2"))), plan,
                        out));
        assertTrue(e.getMessage().contains("(learner skeleton-test a1 → a2)"), e.getMessage());

        // A journal written before versions were recorded: its lines have none.
        Path legacy = tmp.resolve("legacy");
        Files.createDirectories(legacy);
        StringBuilder sb = new StringBuilder();
        for (String l : Files.readAllLines(out.resolve(Journal.FILE_NAME))) {
            JournalCodec.Line line = JournalCodec.read(l);
            sb.append(JournalCodec.write(new JournalCodec.Line(line.run(), line.coordinates(), line.result())))
                    .append('\n');
        }
        Files.writeString(legacy.resolve(Journal.FILE_NAME), sb.toString());
        for (JournalCodec.Line l : Journal.read(legacy.resolve(Journal.FILE_NAME)).lines().values()) {
            assertNull(l.versions());
        }
        StudyRunner.Outcome o = run(TestWorld.runner().recording(new RunVersions("9.9", Map.of())), plan, legacy);
        assertEquals(plan.runs().size(), o.reused());
        assertTrue(Files.readString(legacy.resolve(StudyRunner.PROVENANCE_FILE)).contains("not recorded"));
    }

    @Test
    @DisplayName("the tool's label carries the source revision for unreleased builds")
    void label() {
        var v = dev.touchstone.harness.version.VersionInfo.current();
        if (v.released()) {
            assertEquals(v.version(), v.label());
        } else {
            assertTrue(v.label().startsWith(v.version() + "+" + v.commit()), v.label());
        }
        assertEquals(v.label(), RunVersions.current().tool());
    }
}
