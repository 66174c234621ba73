package dev.touchstone.harness.cli;

import dev.touchstone.harness.testing.Python3;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import dev.touchstone.harness.outside.CommandLearner;
import dev.touchstone.harness.outside.CommandSpec;
import dev.touchstone.harness.outside.LearnersFile;
import dev.touchstone.learners.composed.ComposedLearner;
import dev.touchstone.learners.composed.ComposedStep;
import dev.touchstone.learners.composed.Handoff;
import dev.touchstone.learners.score.GesLearner;
import dev.touchstone.learners.score.HillClimbLearner;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Studies with composed learners through {@code touchstone run}: scored and listed in runs.csv like any learner. */
class ComposedLearnersCliTest {

    @TempDir
    Path tmp;

    private static final String HEAD = "name: composed\nseed: 7\nreplicates: 2\n"
            + "truth:\n  graph: {family: erdos-renyi, nodes: 6, mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
            + "samples: [300]\nmetrics: [shd, adjacency_f1]\nlimits: {seconds: 60}\nlearners:\n";

    /** The rows of runs.csv as cells (no quoted commas in these studies' rows). */
    private static List<Map<String, String>> runs(Path out) throws IOException {
        List<String> lines = Files.readAllLines(out.resolve("runs.csv"));
        List<String> header = Arrays.asList(lines.get(0).split(",", -1));
        return lines.subList(1, lines.size()).stream().map(l -> {
            String[] cells = l.split(",", -1);
            Map<String, String> row = new java.util.LinkedHashMap<>();
            for (int i = 0; i < header.size(); i++) {
                row.put(header.get(i), cells[i]);
            }
            return row;
        }).toList();
    }

    @Test
    @DisplayName("a study with PC then hill climbing runs end to end: ok rows named by the entry, counts of both steps, resumable")
    void builtInComposition() throws IOException {
        Path study = tmp.resolve("s.yaml");
        Files.writeString(study, HEAD + "  - id: pc-hc\n    steps:\n      - {use: pc, with: {alpha: [0.01, 0.05]}}\n"
                + "      - {use: hill-climbing, given: allowed-edges}\n  - {id: hc, use: hill-climbing}\n");
        CliTest.Result check = CliTest.cli("check", study.toString());
        assertEquals(0, check.status(), check.err());
        assertTrue(check.out().contains("  pc-hc[pc.alpha=0.01] (pc-then-hill-climbing: "), check.out());
        assertTrue(check.out().contains(";hill-climbing.patience=10;"), check.out());
        Path out = tmp.resolve("out");
        CliTest.Result r = CliTest.cli("run", study.toString(), "--out", out.toString(), "--quiet");
        assertEquals(0, r.status(), r.err());
        List<Map<String, String>> rows = runs(out);
        assertEquals(6, rows.size());
        List<Map<String, String>> composed = rows.stream().filter(m -> m.get("learner").equals("pc-then-hill-climbing")).toList();
        assertEquals(4, composed.size(), rows.toString());
        for (Map<String, String> m : composed) {
            assertEquals("ok", m.get("status"), m.toString());
            assertTrue(m.get("configuration").startsWith("pc-hc[pc.alpha="), m.toString());
            assertEquals("dag", m.get("estimate_class"), m.toString());
            // PC's independence tests and hill climbing's score evaluations both count
            assertTrue(Long.parseLong(m.get("n_tests")) > 0 && Long.parseLong(m.get("n_scores")) > 0, m.toString());
            assertTrue(!m.get("shd").isEmpty(), m.toString());
        }
        CliTest.Result again = CliTest.cli("run", study.toString(), "--out", out.toString());
        assertEquals(0, again.status(), again.err());
        assertTrue(again.err().contains("6 of 6 runs already done"), again.err());
    }

    @Test
    @DisplayName("a bad composed entry is refused by check with exit 2 and one line naming file, line and field")
    void badEntry() throws IOException {
        Path study = tmp.resolve("bad.yaml");
        Files.writeString(study, HEAD + "  - id: x\n    steps:\n      - {use: pc}\n      - {use: direct-lingam, given: allowed-edges}\n");
        CliTest.Result r = CliTest.cli("check", study.toString());
        assertEquals(2, r.status());
        assertEquals("error: bad.yaml:14:37: learners[0].steps[1].given: learner direct-lingam does not honour forbidden"
                + " edges, so it cannot be given allowed-edges", r.err().strip());
    }

    @Test
    @DisplayName("an outside command's graph as the allowed edges of GES and of hill climbing: runs ok, and never leaves its skeleton")
    void outsideCommandFirst() throws IOException {
        Python3.require("the outside-command composition");
        Path study = tmp.resolve("s.yaml");
        Files.writeString(study, HEAD + "  - id: corr-ges\n    steps:\n      - {use: corr-skeleton-py, with: {threshold: 0.2}}\n"
                + "      - {use: ges, given: allowed-edges}\n  - id: corr-hc\n    steps:\n"
                + "      - {use: corr-skeleton-py, with: {threshold: 0.2}}\n      - {use: hill-climbing, given: allowed-edges}\n");
        Path out = tmp.resolve("out");
        CliTest.Result r = CliTest.cli("run", study.toString(), "--out", out.toString(), "--quiet",
                "--learners", CliTest.LEARNERS.toString());
        assertEquals(0, r.status(), r.err());
        List<Map<String, String>> rows = runs(out);
        assertEquals(4, rows.size());
        for (Map<String, String> m : rows) {
            assertEquals("ok", m.get("status"), m.toString());
        }
        assertEquals(List.of("corr-skeleton-py-then-ges", "corr-skeleton-py-then-ges", "corr-skeleton-py-then-hill-climbing",
                "corr-skeleton-py-then-hill-climbing"), rows.stream().map(m -> m.get("learner")).sorted().toList());

        // The same compositions called directly: the second step's estimate stays within the command's skeleton.
        CommandLearner corr = null;
        for (CommandSpec s : LearnersFile.read(CliTest.LEARNERS)) {
            if (s.description().id().equals("corr-skeleton-py")) {
                corr = new CommandLearner(s);
            }
        }
        for (Learner second : List.of(new GesLearner(), new HillClimbLearner())) {
            ComposedLearner c = ComposedLearner.of(List.of(ComposedStep.first(corr),
                    new ComposedStep(second, Handoff.ALLOWED_EDGES)));
            for (long seed = 1; seed <= 3; seed++) {
                LearnerInput in = LearnerInput.of(SmallData.linearGaussian(RandomDags.erdosRenyi(6, 2.5, seed), 300, seed));
                ParameterValues v = ParameterValues.resolve("t", c.description().parameters(),
                        Map.of("corr-skeleton-py.threshold", 0.2));
                Graph skeleton = corr.learn(in, Knowledge.none(), ParameterValues.resolve("t",
                        corr.description().parameters(), Map.of("threshold", 0.2)), RunContext.unlimited(seed)).graph();
                Graph got = c.learn(in, Knowledge.none(), v, RunContext.unlimited(seed)).graph();
                assertTrue(skeleton.edgeCount() > 0);
                for (Edge e : got.edges()) {
                    assertTrue(skeleton.adjacent(e.a(), e.b()), second.description().id() + " seed " + seed + ": " + got
                            + " leaves " + skeleton);
                }
            }
        }
    }
}
