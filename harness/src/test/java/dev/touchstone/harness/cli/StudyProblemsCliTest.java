package dev.touchstone.harness.cli;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static dev.touchstone.harness.cli.CliTest.cli;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A study with several independent problems: {@code check} names every one of them, one
 * {@code error: FILE:LINE:COLUMN: field: …} line each, and {@code run} refuses with the same
 * lines before writing anything.
 */
class StudyProblemsCliTest {

    @TempDir
    Path tmp;

    /** Five independent problems, one per line 4, 5, 8, 9 and 10 (each fixable on its own). */
    private static final String BAD = """
            name: many
            seed: 1
            truth:
              graph: {family: erdos-renyi, nodes: 6, mean_degree: 2, shape: round}
              model: {kind: linear-gaussian, noise_scale: -1}
            samples: [100]
            learners:
              - {id: a, use: no-such-learner}
              - {id: b, use: pc, with: {alpha: 7}}
            metrics: [shd, no_such_metric]
            """;

    /** Each expected line: line number, field path, and a word of the problem. */
    private static final List<String[]> EXPECTED = List.of(
            new String[]{"4", "truth.graph.shape", "unknown parameter 'shape'"},
            new String[]{"5", "truth.model.noise_scale", ""},
            new String[]{"8", "learners[0].use", "unknown learner 'no-such-learner'"},
            new String[]{"9", "learners[1].with.alpha", "alpha"},
            new String[]{"10", "metrics[1]", "unknown metric 'no_such_metric'"});

    @Test
    @DisplayName("check prints one error line per independent problem, each with file:line:column: field")
    void checkListsEveryProblem() throws IOException {
        Path f = tmp.resolve("many.yaml");
        Files.writeString(f, BAD);
        CliTest.Result r = cli("check", f.toString());
        assertEquals(2, r.status(), r.err());
        List<String> lines = r.err().lines().toList();
        assertEquals(EXPECTED.size(), lines.size(), r.err());
        for (int i = 0; i < EXPECTED.size(); i++) {
            String[] e = EXPECTED.get(i);
            String line = lines.get(i);
            assertTrue(line.matches("error: many\\.yaml:" + e[0] + ":\\d+: " + java.util.regex.Pattern.quote(e[1])
                    + ": .+"), line);
            assertTrue(line.contains(e[2]), line);
        }
        assertFalse(r.err().contains("Exception"), r.err());
    }

    @Test
    @DisplayName("run refuses the same study with the same lines, before creating its output folder")
    void runRefusesWithTheSameLines() throws IOException {
        Path f = tmp.resolve("many.yaml");
        Files.writeString(f, BAD);
        CliTest.Result check = cli("check", f.toString());
        CliTest.Result run = cli("run", f.toString(), "--out", tmp.resolve("o").toString());
        assertEquals(2, run.status());
        assertEquals(check.err(), run.err());
        assertFalse(Files.exists(tmp.resolve("o")));
    }

    @Test
    @DisplayName("a problem that follows from another is not repeated: compare_to naming a broken entry")
    void dependentProblemNotRepeated() throws IOException {
        Path f = tmp.resolve("dep.yaml");
        Files.writeString(f, """
                name: dep
                seed: 1
                truth: {graph: {family: erdos-renyi, nodes: 6}, model: {kind: linear-gaussian}}
                samples: [100]
                learners:
                  - {id: a, use: no-such-learner}
                  - {id: b, use: pc}
                compare_to: a
                """);
        CliTest.Result r = cli("check", f.toString());
        assertEquals(2, r.status());
        assertEquals(1, r.err().lines().count(), r.err());
        assertTrue(r.err().startsWith("error: dep.yaml:6:"), r.err());
    }
}
