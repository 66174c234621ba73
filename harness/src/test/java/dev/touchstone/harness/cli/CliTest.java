package dev.touchstone.harness.cli;

import dev.touchstone.harness.io.GraphJson;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The verbs through {@link Main#execute}: exit status (0 done, 1 failed, 2 bad input) and one-line {@code error:} messages. */
class CliTest {

    static final Path ROOT = Path.of("..").toAbsolutePath().normalize();
    static final Path LEARNERS = ROOT.resolve("examples/adapters/learners.yaml");

    @TempDir
    Path tmp;

    record Result(int status, String out, String err) {
    }

    static Result cli(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Result(status, out.toString(), err.toString());
    }

    @Test
    @DisplayName("every verb answers --help with its usage (exit 0), so the hint after a usage error works")
    void helpOnEveryVerb() {
        for (String verb : List.of("run", "check", "learners", "learn", "simulate", "score", "report", "demo",
                "calibrate", "show")) {
            Result r = cli(verb, "--help");
            assertEquals(0, r.status(), verb + ": " + r.err());
            assertTrue(r.out().startsWith("Usage: touchstone " + verb), r.out());
        }
        Result r = cli("run");
        assertEquals(2, r.status());
        assertTrue(r.err().contains("(see 'touchstone run --help')"), r.err());
    }

    @Test
    @DisplayName("check validates every bundled scenario and prints the grid and the work")
    void checkScenarios() throws IOException {
        List<Path> scenarios = new ArrayList<>();
        try (var s = Files.list(ROOT.resolve("scenarios"))) {
            s.filter(p -> p.toString().endsWith(".yaml")).forEach(scenarios::add);
        }
        assertFalse(scenarios.isEmpty());
        for (Path p : scenarios) {
            Result r = cli("check", p.toString(), "--learners", LEARNERS.toString());
            assertEquals(0, r.status(), r.err());
            assertTrue(r.out().contains(": valid"), r.out());
            assertTrue(r.out().contains("runs in all"), r.out());
            assertTrue(r.out().contains("replicates to draw"), r.out());
            assertTrue(Files.readString(p).startsWith("# "), p + " starts with a comment saying what it is for");
        }
    }

    @Test
    @DisplayName("a bad study gives exit 2 and one line 'error: FILE:LINE:COLUMN: field: …' per problem")
    void badStudy() throws IOException {
        Path f = tmp.resolve("bad.yaml");
        Files.writeString(f, "name: b\nseed: 1\ntruth:\n  graph: {family: erdos-renyi, nodes: 0}\n"
                + "  model: {kind: linear-gaussian}\nsamples: [10]\nlearners: [nobody]\n");
        Result r = cli("check", f.toString());
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("error: bad.yaml:4:"), r.err());
        assertTrue(r.err().contains("truth.graph.nodes: parameter 'nodes': 0 is outside the allowed range"), r.err());
        assertTrue(r.err().contains("\nerror: bad.yaml:7:"), r.err());
        assertTrue(r.err().contains("learners[0]: unknown learner 'nobody'"), r.err());
        assertEquals(2, r.err().lines().count(), r.err());
        assertFalse(r.err().contains("Exception"), r.err());
    }

    @Test
    @DisplayName("a study naming an undeclared command learner is refused by run with exit 2, saying so")
    void undeclaredCommand() throws IOException {
        Result r = cli("run", ROOT.resolve("scenarios/first-look.yaml").toString(), "--out", tmp.resolve("o").toString());
        assertEquals(2, r.status());
        assertTrue(r.err().contains("unknown learner 'corr-skeleton-py'"), r.err());
        assertTrue(r.err().contains("--learners FILE"), r.err());
        assertFalse(Files.exists(tmp.resolve("o")), "nothing runs before the study is valid");
    }

    @Test
    @DisplayName("run writes every output and a final line; a second run resumes with nothing to do")
    void runAndResume() throws IOException {
        Path study = tmp.resolve("quick.yaml");
        Files.writeString(study, Files.readString(ROOT.resolve("scenarios/first-look.yaml"))
                .replace("replicates: 4", "replicates: 1").replace("nodes: [6, 10]", "nodes: 5")
                .replace("samples: [200, 1000]", "samples: [200]"));
        Path out = tmp.resolve("out");
        Result r = cli("run", study.toString(), "--out", out.toString(), "--threads", "2", "--quiet",
                "--learners", LEARNERS.toString());
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().startsWith("done: 2 runs (2 ok"), r.out());
        assertEquals("", r.err());
        for (String f : List.of("study.yaml", "provenance.json", "journal.jsonl", "runs.csv", "summary.csv",
                "comparisons.csv")) {
            assertTrue(Files.isRegularFile(out.resolve(f)), f);
        }
        Result again = cli("run", study.toString(), "--out", out.toString(), "--learners", LEARNERS.toString());
        assertEquals(0, again.status(), again.err());
        assertTrue(again.err().contains("2 of 2 runs already done"), again.err());
        assertTrue(again.out().contains("0 done now"), again.out());
    }

    @Test
    @DisplayName("learners --json lists command learners with their declared parameters")
    void learnersJson() {
        Result r = cli("learners", "--json", "--learners", LEARNERS.toString());
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().contains("\"id\" : \"corr-skeleton-py\""), r.out());
        assertTrue(r.out().contains("\"origin\" : \"command\""), r.out());
        assertTrue(r.out().contains("\"name\" : \"threshold\""), r.out());
        Result text = cli("learners", "--learners", LEARNERS.toString());
        assertTrue(text.out().contains("threshold (real, default 0.3, allowed [0.0, 1.0])"), text.out());
    }

    @Test
    @DisplayName("learn runs one learner on a CSV file; bad parameters and unknown learners are one-line errors")
    void learn() throws IOException {
        Path data = tmp.resolve("d.csv");
        StringBuilder sb = new StringBuilder("A,B,C\n");
        java.util.Random rnd = new java.util.Random(3);
        for (int i = 0; i < 200; i++) {
            double a = rnd.nextGaussian();
            double b = a + 0.5 * rnd.nextGaussian();
            sb.append(a).append(',').append(b).append(',').append(rnd.nextGaussian()).append('\n');
        }
        Files.writeString(data, sb.toString());
        Path g = tmp.resolve("g.json");
        Result r = cli("learn", "--learner", "corr-skeleton-py", "--set", "threshold=0.5", "--data", data.toString(),
                "--out", g.toString(), "--learners", LEARNERS.toString());
        assertEquals(0, r.status(), r.err());
        var graph = GraphJson.read(g);
        assertTrue(graph.adjacent(graph.index("A"), graph.index("B")), "A and B are strongly correlated");
        assertFalse(graph.adjacent(graph.index("A"), graph.index("C")));
        Result bad = cli("learn", "--learner", "corr-skeleton-py", "--set", "threshold=2", "--data", data.toString(),
                "--learners", LEARNERS.toString());
        assertEquals(2, bad.status());
        assertTrue(bad.err().contains("threshold") && bad.err().contains("[0.0, 1.0]"), bad.err());
        Result unknown = cli("learn", "--learner", "nope", "--data", data.toString());
        assertEquals(2, unknown.status());
        assertTrue(unknown.err().startsWith("error: --learner: unknown learner 'nope'"), unknown.err());
    }

    @Test
    @DisplayName("simulate writes each replicate's data and truth, the same draw run uses")
    void simulate() throws IOException {
        Path out = tmp.resolve("sim");
        Result r = cli("simulate", ROOT.resolve("scenarios/first-look.yaml").toString(), "--out", out.toString(),
                "--learners", LEARNERS.toString());
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().startsWith("wrote 8 replicates"), r.out());
        Path one = out.resolve("t1-r3");
        var data = dev.touchstone.harness.io.DataCsv.read(one.resolve("data.csv")).data();
        assertEquals(1000, data.rows());
        assertEquals(10, data.columns());
        var dag = GraphJson.read(one.resolve("truth.json"));
        assertEquals(data.names(), dag.names());
        for (String f : List.of("truth.dot", "cpdag.json", "pag.json", "audit.json")) {
            assertTrue(Files.exists(one.resolve(f)), f);
        }
        List<String> index = Files.readAllLines(out.resolve("replicates.csv"));
        assertEquals(9, index.size());
        assertEquals("folder,truth_setting,replicate,n_rows,seed,seed_high,seed_low,setting", index.get(0));
        assertTrue(index.get(1).startsWith("t0-r0,0,0,1000,"), index.get(1));
    }

    @Test
    @DisplayName("simulate from options writes one truth: data, truth graphs and the audit, the draw of replicate 0 of the same study")
    void simulateFromOptions() throws IOException {
        Path out = tmp.resolve("one");
        Result r = cli("simulate", "--graph", "erdos-renyi", "--set", "nodes=12", "--set", "mean_degree=2",
                "--model", "linear-gaussian", "--samples", "300", "--seed", "5", "--out", out.toString());
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().startsWith("wrote 300 rows of 12 variables"), r.out());
        var data = dev.touchstone.harness.io.DataCsv.read(out.resolve("data.csv")).data();
        assertEquals(300, data.rows());
        var dag = GraphJson.read(out.resolve("truth.json"));
        assertEquals(data.names(), dag.names());
        for (String f : List.of("truth.dot", "cpdag.json", "pag.json")) {
            assertTrue(Files.exists(out.resolve(f)), f);
        }
        assertFalse(Files.exists(out.resolve("mag.json")), "nothing hidden, no MAG");
        var audit = new com.fasterxml.jackson.databind.ObjectMapper().readTree(out.resolve("audit.json").toFile());
        var expected = dev.touchstone.generators.audit.SortabilityAudit.of(dag, data);
        assertEquals(expected.varsortability(), audit.get("varsortability").asDouble(), 1e-12,
                "audit.json is the generators' audit of the files written");
        assertEquals(expected.r2Sortability(), audit.get("r2_sortability").asDouble(), 1e-12);

        Path study = tmp.resolve("same.yaml");
        Files.writeString(study, "name: same\nseed: 5\ntruth:\n  graph: {family: erdos-renyi, nodes: 12, mean_degree: 2}\n"
                + "  model: {kind: linear-gaussian}\nsamples: [300]\nlearners: [empty]\n");
        assertSameDrawAsStudy(study, out);
    }

    /** Options and a study with the same seed and truth draw the same data: replicate 0 of the study. */
    private void assertSameDrawAsStudy(Path study, Path fromOptions) throws IOException {
        Path viaStudy = tmp.resolve("via-" + study.getFileName());
        Result r = cli("simulate", study.toString(), "--out", viaStudy.toString());
        assertEquals(0, r.status(), r.err());
        assertEquals(Files.readString(viaStudy.resolve("t0-r0/data.csv")),
                Files.readString(fromOptions.resolve("data.csv")),
                "options and study with the same seed and truth draw the same data");
    }

    @Test
    @DisplayName("simulate --network writes a reference network's discrete data; hidden variables give a MAG and an undefined audit")
    void simulateNetwork() throws IOException {
        Path out = tmp.resolve("garden");
        Result r = cli("simulate", "--network", "community-garden", "--hidden", "1", "--samples", "200",
                "--out", out.toString());
        assertEquals(0, r.status(), r.err());
        var dag = GraphJson.read(out.resolve("truth.json"));
        assertEquals(dev.touchstone.generators.networks.ReferenceNetworks.communityGarden().dag().names(), dag.names());
        assertEquals(1, dag.hiddenNames().size());
        var data = dev.touchstone.harness.io.DataCsv.read(out.resolve("data.csv")).data();
        assertEquals(dag.size() - 1, data.columns(), "the hidden variable is left out of the data");
        assertTrue(Files.exists(out.resolve("mag.json")));
        assertFalse(Files.exists(out.resolve("cpdag.json")));
        var audit = new com.fasterxml.jackson.databind.ObjectMapper().readTree(out.resolve("audit.json").toFile());
        assertTrue(audit.get("varsortability").isNull(), "sortability is undefined on discrete data: " + audit);
    }

    @Test
    @DisplayName("simulate with a given graph file draws data on that DAG")
    void simulateGivenGraph() throws IOException {
        var g = dev.touchstone.core.graph.Graph.builder(List.of("a", "b", "c"));
        g.addDirected(0, 1);
        g.addDirected(2, 1);
        Path file = tmp.resolve("g.json");
        GraphJson.write(file, g.freeze());
        Path out = tmp.resolve("given");
        Result r = cli("simulate", "--graph", "given", "--set", "file=" + file, "--samples", "50", "--out",
                out.toString());
        assertEquals(0, r.status(), r.err());
        assertEquals(g.freeze(), GraphJson.read(out.resolve("truth.json")));
        // As for the random families: the draw of replicate 0 of a study with the same seed and truth. The file's
        // path is not part of the seeds (its digest is), so the study may name it relative to its own folder.
        Path study = tmp.resolve("given.yaml");
        Files.writeString(study, "name: given\nseed: 1\ntruth:\n  graph: {family: given, file: g.json}\n"
                + "  model: {kind: linear-gaussian}\nsamples: [50]\nlearners: [empty]\n");
        assertSameDrawAsStudy(study, out);
    }

    @Test
    @DisplayName("bad simulate options give exit 2 and one line naming the option")
    void simulateBadOptions() {
        String o = tmp.resolve("bad").toString();
        String[][] cases = {
                {"--set nodez=3", "--set", "nodez=3", "--out", o},
                {"--set nodes=many", "--set", "nodes=many", "--out", o},
                {"--set nodes", "--set", "nodes", "--out", o},
                {"--graph: unknown graph family 'ring'", "--graph", "ring", "--out", o},
                {"--model: unknown model kind", "--model", "cubic", "--out", o},
                {"--graph: cannot be combined with --network", "--network", "sprinkler", "--graph", "erdos-renyi",
                        "--out", o},
                {"--network: unknown network name 'kitchen'", "--network", "kitchen", "--out", o},
                {"--samples: 1 is not a sample size", "--samples", "1", "--out", o},
                {"--set graph.rate=2: unknown parameter", "--missing", "mcar", "--set", "graph.rate=2", "--out", o},
                {"do not fit together", "--set", "nodes=4", "--hidden", "9", "--out", o},
                {"--graph: describes one truth and cannot be combined with a STUDY",
                        ROOT.resolve("scenarios/demo.yaml").toString(), "--graph", "star", "--out", o}};
        for (String[] c : cases) {
            String[] args = new String[c.length];
            args[0] = "simulate";
            System.arraycopy(c, 1, args, 1, c.length - 1);
            Result r = cli(args);
            assertEquals(2, r.status(), c[0] + ": " + r.err());
            assertTrue(r.err().startsWith("error: ") && r.err().contains(c[0]), c[0] + ": " + r.err());
            assertEquals(1, r.err().lines().count(), r.err());
        }
        assertFalse(Files.exists(tmp.resolve("bad")), "nothing is written for bad options");
    }

    @Test
    @DisplayName("usage errors give exit 2")
    void usage() {
        assertEquals(2, cli("run").status());
        assertEquals(2, cli("frobnicate").status());
    }

    @Test
    @DisplayName("score_against adds METRIC_vs_CLASS columns to runs.csv and rows to summary.csv")
    void scoreAgainst() throws IOException {
        Path study = tmp.resolve("extra.yaml");
        Files.writeString(study, "name: extra\nseed: 3\nreplicates: 2\ntruth:\n"
                + "  graph: {family: erdos-renyi, nodes: 5, mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
                + "samples: [60]\nlearners: [pc, empty]\nmetrics: [shd, seconds]\nscore_against: [dag, pag]\n"
                + "compare_to: empty\n");
        Path out = tmp.resolve("extra-out");
        Result r = cli("run", study.toString(), "--out", out.toString(), "--quiet", "--threads", "1");
        assertEquals(0, r.status(), r.err());
        String header = Files.readAllLines(out.resolve("runs.csv")).get(0);
        assertTrue(header.contains("shd,shd_vs_dag,shd_vs_pag"), header);
        assertFalse(header.contains("seconds_vs_"), "measured metrics have no truth: " + header);
        String summary = Files.readString(out.resolve("summary.csv"));
        assertTrue(summary.contains(",shd_vs_pag,"), summary);
        assertTrue(Files.readString(out.resolve("comparisons.csv")).contains(",shd_vs_dag,"));
        // One setting is too few for a Friedman test of two configurations (six are needed), so the report names the
        // ranking of shd_vs_dag in words and says why it draws no diagram.
        String html = Files.readString(out.resolve("report.html"));
        assertTrue(html.contains("No critical-difference diagram for") && html.contains("structural Hamming distance"
                + " (edges) against the true DAG (1 setting with a value for every configuration; 2 configurations"
                + " need at least 6)"), "ranked by the base metric's direction, like shd");
        assertTrue(Files.readString(out.resolve("study.yaml")).contains("score_against"));
        // By hand: an empty estimate differs from the truth on every true edge's pair, and a DAG and its CPDAG share
        // one skeleton, so the empty graph's SHD against the true DAG equals its SHD against the true CPDAG.
        List<String> cols = List.of(header.split(","));
        int config = cols.indexOf("configuration");
        int shd = cols.indexOf("shd");
        int shdDag = cols.indexOf("shd_vs_dag");
        int checked = 0;
        for (String line : Files.readAllLines(out.resolve("runs.csv")).subList(1, 5)) {
            String[] cells = line.split(",", -1);
            if (cells[config].equals("empty")) {
                assertEquals(cells[shd], cells[shdDag], line);
                checked++;
            }
        }
        assertEquals(2, checked);
    }
}
