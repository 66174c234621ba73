package dev.touchstone.harness.outside;

import dev.touchstone.harness.testing.Python3;
import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.execution.Progress;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.Expansion;
import dev.touchstone.harness.study.NodeReader;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.StudyException;
import dev.touchstone.harness.study.StudyReader;
import dev.touchstone.harness.testing.TestWorld;
import dev.touchstone.metrics.results.RunStatus;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/** External command learners, with small Python scripts as the commands (the machine has python3). */
class CommandLearnerTest {

    @TempDir
    static Path tmp;

    static Path scripts;
    static Path examples;

    @BeforeAll
    static void locate() throws URISyntaxException {
        scripts = Path.of(CommandLearnerTest.class.getResource("/outside/hang.py").toURI()).getParent();
        examples = Path.of("..", "examples", "adapters").toAbsolutePath().normalize();
        Python3.require("the command-learner tests");
    }

    static String python() {
        return Python3.find();
    }

    private static String learnersFile(String id, String script, String extraArgs, String output) {
        return "learners:\n  - id: " + id + "\n    command: [" + python() + ", \"" + script + "\", " + extraArgs + "]\n"
                + "    output: " + output + "\n    returns: cpdag\n    accepts: [continuous]\n"
                + "    parameters:\n      - {name: threshold, type: real, default: 0.3, min: 0, max: 1}\n";
    }

    private static LearnerCatalog catalog(String learnersYaml) throws IOException {
        Path f = Files.createTempFile(tmp, "learners", ".yaml");
        Files.writeString(f, learnersYaml);
        LearnerCatalog.Builder b = LearnerCatalog.builder().add(TestWorld.EMPTY, LearnerCatalog.Origin.BUILT_IN, "test");
        for (CommandSpec s : LearnersFile.read(f)) {
            b.addCommand(new CommandLearner(s), f.toString());
        }
        return b.build();
    }

    private static StudyRunner.Outcome run(LearnerCatalog catalog, String learner, String limit, Path out) {
        String study = "name: ext\nseed: 2\nreplicates: 2\ntruth:\n  graph: {family: chain, nodes: 4}\n"
                + "  model: {kind: linear-gaussian}\nsamples: [60]\nlearners:\n  - {id: x, use: " + learner + "}\n"
                + "  - {id: e, use: empty-test}\nmetrics: [shd, edges]\n" + limit;
        var s = new StudyReader(TestWorld.TRUTH, catalog, TestWorld.METRICS).read(NodeReader.read("s.yaml", study, false));
        Plan plan = new Expansion(TestWorld.TRUTH).expand(s, catalog);
        return TestWorld.runner().run(plan, new StudyRunner.Options(out, 2, Progress.quiet(),
                new PrintWriter(new StringWriter())));
    }

    @Test
    @DisplayName("the example Python adapter runs as a command learner and its graph is scored")
    void workingScript() throws IOException {
        LearnerCatalog c = catalog(learnersFile("corr", examples.resolve("correlation_skeleton.py").toString(),
                "--data, \"{data}\", --output, \"{output}\", --seed, \"{seed}\", --threshold, \"{threshold}\"", "json"));
        Path out = tmp.resolve("working");
        StudyRunner.Outcome o = run(c, "corr", "", out);
        assertEquals(4, o.count(RunStatus.OK), Files.readString(out.resolve("runs.csv")));
        // a chain X1-X2-X3-X4 with weights in [0.5, 1.5] is strongly correlated: the adapter finds edges
        String runs = Files.readString(out.resolve("runs.csv"));
        assertTrue(runs.lines().anyMatch(l -> l.contains(",corr,") && l.contains(",ok,")
                && !l.matches(".*,ok,,cpdag,cpdag,\\d+,0,.*")), runs);
    }

    @Test
    @DisplayName("a command that hangs is killed at the limit with every process it started, and recorded timeout")
    void hangingScript() throws IOException, InterruptedException {
        Path pids = tmp.resolve("pids.txt");
        LearnerCatalog c = catalog(learnersFile("hang", scripts.resolve("hang.py").toString(),
                "\"" + pids + "\", \"{data}\", \"{output}\"", "json"));
        Path out = tmp.resolve("hanging");
        long t0 = System.nanoTime();
        StudyRunner.Outcome o = run(c, "hang", "limits: {seconds: 4}\n", out);
        double seconds = (System.nanoTime() - t0) / 1e9;
        assertEquals(2, o.count(RunStatus.TIMEOUT));
        assertTrue(seconds < 30, "killed at the limit, not after the script's 120 s: " + seconds);
        String runs = Files.readString(out.resolve("runs.csv"));
        assertTrue(runs.contains("timeout,time limit of 4.0 s reached (external command hang was killed at the time limit)"), runs);
        for (String pid : Files.readString(pids).trim().split("\\s+")) {
            var h = ProcessHandle.of(Long.parseLong(pid));
            assertFalse(h.isPresent() && h.get().isAlive(), "process " + pid + " was left behind");
        }
    }

    @Test
    @DisplayName("a command that writes garbage is recorded failed with a clear message")
    void garbage() throws IOException {
        LearnerCatalog c = catalog(learnersFile("junk", scripts.resolve("garbage.py").toString(), "\"{output}\", \"{data}\"",
                "json"));
        Path out = tmp.resolve("garbage");
        StudyRunner.Outcome o = run(c, "junk", "", out);
        assertEquals(2, o.count(RunStatus.FAILED));
        String runs = Files.readString(out.resolve("runs.csv"));
        assertTrue(runs.contains("external command junk wrote a graph that cannot be read"), runs);
    }

    @Test
    @DisplayName("a graph over other variables, a non-zero exit and no output file are each recorded failed with the reason")
    void otherFailures() throws IOException {
        LearnerCatalog c = catalog(learnersFile("wrong", scripts.resolve("wrong_vars.py").toString(),
                "\"{output}\", \"{data}\"", "json")
                .replace("learners:\n", "learners:\n  - id: dies\n    command: [" + python() + ", \""
                        + scripts.resolve("fail.py") + "\", \"{data}\", \"{output}\"]\n    returns: dag\n"
                        + "  - id: silent\n    command: [" + python() + ", -c, \"pass\", \"{data}\", \"{output}\"]\n"
                        + "    returns: dag\n"));
        String wrong = Files.readString(runCsv(c, "wrong"));
        assertTrue(wrong.contains("external command wrong wrote a graph over [P, Q], not over the data's variables [X1, X2, X3, X4]"), wrong);
        String dies = Files.readString(runCsv(c, "dies"));
        assertTrue(dies.contains("exited with status 3; it said: something went wrong inside the method"), dies);
        String silent = Files.readString(runCsv(c, "silent"));
        assertTrue(silent.contains("external command silent wrote no graph file"), silent);
    }

    private static Path runCsv(LearnerCatalog c, String id) {
        Path out = tmp.resolve("other-" + id);
        run(c, id, "", out);
        return out.resolve("runs.csv");
    }

    @Test
    @DisplayName("a study naming a command learner that no learners file declares is refused, saying so")
    void undeclared() {
        String study = "name: ext\nseed: 2\ntruth:\n  graph: {family: chain}\n  model: {kind: linear-gaussian}\n"
                + "samples: [60]\nlearners:\n  - {use: corr-skeleton-py}\n";
        StudyException e = assertThrows(StudyException.class, () -> TestWorld.plan(study));
        assertTrue(e.getMessage().contains("unknown learner 'corr-skeleton-py'"), e.getMessage());
        assertTrue(e.getMessage().contains("must be declared in a learners file given with --learners FILE"),
                e.getMessage());
        assertEquals("learners[0].use", e.field());
    }

    @Test
    @DisplayName("learners files are checked: placeholders, required fields, reserved names")
    void learnersFileChecks() {
        StudyException a = assertThrows(StudyException.class, () -> LearnersFile.read(NodeReader.read("l.yaml",
                "learners:\n  - id: m\n    command: [x, \"{data}\", \"{outptu}\"]\n    returns: dag\n", false),
                tmp, "l.yaml"));
        assertTrue(a.getMessage().contains("{outptu} is neither"), a.getMessage());
        assertEquals(3, a.place().line());
        StudyException b = assertThrows(StudyException.class, () -> LearnersFile.read(NodeReader.read("l.yaml",
                "learners:\n  - id: m\n    command: [x, \"{data}\", \"{output}\"]\n", false), tmp, "l.yaml"));
        assertEquals("learners[0].returns", b.field());
        StudyException c = assertThrows(StudyException.class, () -> LearnersFile.read(NodeReader.read("l.yaml",
                "learners:\n  - id: m\n    command: \"x {data} {output}\"\n    returns: dag\n", false), tmp, "l.yaml"));
        assertTrue(c.getMessage().contains("no shell is used"), c.getMessage());
        StudyException d = assertThrows(StudyException.class, () -> LearnersFile.read(NodeReader.read("l.yaml",
                "learners:\n  - id: m\n    command: [x, \"{data}\", \"{output}\"]\n    returns: dag\n"
                        + "    parameters:\n      - {name: seed, type: integer, default: 1}\n", false), tmp, "l.yaml"));
        assertTrue(d.getMessage().contains("reserved"), d.getMessage());
    }

    @Test
    @DisplayName("arguments are passed as given, never split or interpreted by a shell")
    void noShell() throws IOException {
        Path marker = tmp.resolve("shell-ran");
        LearnerCatalog c = catalog(learnersFile("lit", examples.resolve("correlation_skeleton.py").toString(),
                "--data, \"{data}\", --output, \"{output}\", --threshold, \"{threshold}\", --seed, \"1; touch "
                        + marker + "\"", "json"));
        StudyRunner.Outcome o = run(c, "lit", "", tmp.resolve("noshell"));
        assertEquals(2, o.count(RunStatus.FAILED)); // argparse refuses "1; touch …" as an integer
        assertFalse(Files.exists(marker));
        assertEquals(List.of(), List.of());
    }
}
