package dev.touchstone.harness.cli;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code run --engine/--master} without the spark module on the class path (as in the
 * harness's own tests): usage errors are exit 2 with one line each, and nothing runs.
 */
class RunEngineOptionTest {

    private static final String STUDY = "name: eng\nseed: 1\nreplicates: 2\n"
            + "truth:\n  graph: {family: erdos-renyi, nodes: 4, mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
            + "samples: [30]\nlearners:\n  - {id: e, use: empty}\nmetrics: [shd]\n";

    @TempDir
    Path tmp;

    private Path study() throws IOException {
        return Files.writeString(tmp.resolve("s.yaml"), STUDY);
    }

    @Test
    @DisplayName("an engine that is not on the class path: exit 2 and one line saying how to get it")
    void missingEngine() throws IOException {
        Path out = tmp.resolve("o");
        CliTest.Result r = CliTest.cli("run", study().toString(), "--out", out.toString(), "--engine", "spark");
        assertEquals(2, r.status(), r.err());
        assertEquals(1, r.err().lines().count(), r.err());
        assertTrue(r.err().startsWith("error: the engine 'spark' is not on the class path (available: local)"), r.err());
        assertTrue(r.err().contains("mvn -B -pl spark -am package") && r.err().contains("docs/spark.md"), r.err());
        assertFalse(Files.exists(out), "nothing was started");
    }

    @Test
    @DisplayName("--master with the local engine is refused; --engine local runs as without the option")
    void localEngine() throws IOException {
        CliTest.Result bad = CliTest.cli("run", study().toString(), "--out", tmp.resolve("a").toString(),
                "--master", "local[2]");
        assertEquals(2, bad.status(), bad.err());
        assertTrue(bad.err().startsWith("error: --master is for a cluster engine"), bad.err());
        CliTest.Result ok = CliTest.cli("run", study().toString(), "--out", tmp.resolve("b").toString(),
                "--engine", "local", "--quiet");
        assertEquals(0, ok.status(), ok.err());
        assertTrue(ok.out().startsWith("done: 2 runs (2 ok"), ok.out());
    }
}
