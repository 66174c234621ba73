package dev.touchstone.spark;

import dev.touchstone.harness.execution.RunRecipe;
import dev.touchstone.harness.study.Plan;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Command learners on a cluster's workers (commands run only where the user allowed them). */
class WorkerCheckTest {

    private static final String STUDY = "name: cmd\nseed: 1\nreplicates: 1\n"
            + "truth:\n  graph: {family: erdos-renyi, nodes: 4, mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
            + "samples: [20]\nlearners:\n  - {id: mine, use: my-method}\n  - {id: e, use: empty}\nmetrics: [shd]\n";

    private static String learners(String extra) {
        return "learners:\n  - id: my-method\n    command: [python3, \"{dir}/m.py\", \"{data}\", \"{output}\"]\n"
                + "    returns: cpdag\n" + extra;
    }

    private static Plan plan(String learnersText) {
        return new RunRecipe(STUDY, "learners.yaml", learnersText, "/tmp", null).rebuild().plan();
    }

    @Test
    @DisplayName("a command not declared installed on the workers is refused on a cluster, allowed when declared or local")
    void refusal() {
        Plan undeclared = plan(learners(""));
        String why = WorkerCheck.refusal(undeclared, "spark://127.0.0.1:7077");
        assertTrue(why != null && why.contains("my-method") && why.contains("installed_on_workers: true")
                && why.contains("learners.yaml"), why);
        assertNull(WorkerCheck.refusal(undeclared, "local[2]"));
        assertNull(WorkerCheck.refusal(undeclared, null));
        assertNull(WorkerCheck.refusal(plan(learners("    installed_on_workers: true\n")), "yarn"));
        assertTrue(WorkerCheck.refusal(plan(learners("    installed_on_workers: false\n")), "yarn") != null);
    }

    @Test
    @DisplayName("a command as a step of a composed learner is refused on a cluster too (the study travels as text)")
    void composedStep() {
        String study = STUDY.replace("  - {id: mine, use: my-method}\n", "  - id: mine\n    steps:\n"
                + "      - {use: my-method}\n      - {use: hill-climbing, given: allowed-edges}\n");
        Plan p = new RunRecipe(study, "learners.yaml", learners(""), "/tmp", null).rebuild().plan();
        assertEquals("my-method-then-hill-climbing", p.configs().get(0).use());
        String why = WorkerCheck.refusal(p, "spark://127.0.0.1:7077");
        assertTrue(why != null && why.contains("my-method"), why);
    }

    @Test
    @DisplayName("through the command line: exit 2 and one line, before any Spark context starts")
    void commandLine(@TempDir Path tmp) throws IOException {
        Path study = Files.writeString(tmp.resolve("s.yaml"), STUDY);
        Path file = Files.writeString(tmp.resolve("learners.yaml"), learners(""));
        SparkEngineTest.Result r = SparkEngineTest.cli("run", study.toString(), "--out", tmp.resolve("o").toString(),
                "--learners", file.toString(), "--engine", "spark", "--master", "spark://127.0.0.1:1", "--quiet");
        assertEquals(2, r.status(), r.err());
        assertEquals(1, r.err().lines().count(), r.err());
        assertTrue(r.err().startsWith("error: the command learner my-method would run on the cluster's workers"),
                r.err());
        assertTrue(!Files.exists(tmp.resolve("o")), "nothing was started");
    }
}
