package dev.touchstone.harness.cli;

import dev.touchstone.harness.testing.Python3;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.harness.execution.EstimateCodec;
import dev.touchstone.harness.execution.Journal;
import dev.touchstone.harness.execution.JournalCodec;
import dev.touchstone.harness.io.GraphFiles;
import org.jgrapht.graph.DefaultEdge;
import org.jgrapht.graph.DirectedPseudograph;
import org.jgrapht.nio.dot.DOTImporter;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import static dev.touchstone.harness.cli.CliTest.cli;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Kept estimates through the command line: export with {@code show}, reports without learners, versions. */
class KeptResultsCliTest {

    @TempDir
    Path tmp;

    static final String STUDY = "name: kept\nseed: 5\nreplicates: 2\n"
            + "truth:\n  graph: {family: erdos-renyi, nodes: 6, mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
            + "samples: [200]\nlearners: [pc, random-dag]\nmetrics: [shd]\n";

    private Path runStudy(String text, String... extra) throws IOException {
        Path study = tmp.resolve("study.yaml");
        Files.writeString(study, text);
        Path out = tmp.resolve("out");
        String[] args = Stream.concat(Stream.of("run", study.toString(), "--out", out.toString(), "--quiet",
                "--threads", "1"), Stream.of(extra)).toArray(String[]::new);
        CliTest.Result r = cli(args);
        assertEquals(0, r.status(), r.err());
        return out;
    }

    @Test
    @DisplayName("show lists the runs, refuses an unknown key with the list, and exports a kept estimate as JSON and DOT")
    void showRoundTrip() throws IOException {
        Path out = runStudy(STUDY);
        Map<String, JournalCodec.Line> runs = Journal.read(out.resolve(Journal.FILE_NAME)).lines();
        assertEquals(4, runs.size());

        CliTest.Result list = cli("show", out.toString());
        assertEquals(0, list.status(), list.err());
        assertEquals(runs.size() + 1, list.out().lines().count(), list.out());
        for (String key : runs.keySet()) {
            assertTrue(list.out().contains(key), list.out());
        }
        CliTest.Result wrong = cli("show", out.toString(), "--run", "0000notakey");
        assertEquals(2, wrong.status());
        assertTrue(wrong.err().startsWith("error: --run 0000notakey: "), wrong.err());
        assertEquals(1, wrong.err().lines().count(), wrong.err());
        assertTrue(wrong.out().contains(runs.keySet().iterator().next()), "the keys are listed: " + wrong.out());

        Map<String, EstimateCodec.Kept> kept = Journal.readEstimates(out.resolve(Journal.FILE_NAME));
        for (JournalCodec.Line l : runs.values()) {
            String key = l.result().key();
            Graph stored = kept.get(key).estimate().graph();
            Path json = tmp.resolve(key + ".json");
            CliTest.Result r = cli("show", out.toString(), "--run", key, "--out", json.toString());
            assertEquals(0, r.status(), r.err());
            assertEquals(stored, GraphFiles.read(json, null), "JSON export reads back to the kept estimate");

            Path dot = tmp.resolve(key + ".dot");
            assertEquals(0, cli("show", out.toString(), "--run", key, "--out", dot.toString()).status());
            assertEquals(stored, GraphFiles.read(dot, null), "DOT export reads back to the kept estimate");
            // Outside reader: JGraphT's DOT importer (jgrapht-io) must see every directed edge
            // of the estimate pointing the same way.
            DirectedPseudograph<String, DefaultEdge> g = new DirectedPseudograph<>(null, DefaultEdge::new, false);
            DOTImporter<String, DefaultEdge> importer = new DOTImporter<>();
            importer.setVertexFactory(id -> id);
            importer.importGraph(g, new StringReader(Files.readString(dot)));
            assertEquals(stored.edgeCount(), g.edgeSet().size());
            for (DefaultEdge e : g.edgeSet()) {
                int from = stored.index(g.getEdgeSource(e));
                int to = stored.index(g.getEdgeTarget(e));
                assertTrue(stored.adjacent(from, to));
                assertFalse(stored.hasDirected(to, from), "JGraphT reads the edge reversed: " + g.getEdgeSource(e)
                        + " -> " + g.getEdgeTarget(e));
            }
        }
    }

    @Test
    @DisplayName("run --out into a folder holding another study's journal is refused")
    void anotherStudysFolder() throws IOException {
        Path out = runStudy(STUDY);
        Path other = tmp.resolve("other.yaml");
        Files.writeString(other, STUDY.replace("name: kept", "name: different"));
        CliTest.Result r = cli("run", other.toString(), "--out", out.toString(), "--quiet", "--threads", "1");
        assertEquals(2, r.status());
        assertTrue(r.err().contains("holds the journal of another study ('kept', not 'different')"), r.err());
        assertEquals(1, r.err().lines().count(), r.err());
    }

    /** A copy of the example Python adapter and a learners file naming it, in {@code dir}. */
    private static Path adapter(Path dir, String version) throws IOException {
        Files.createDirectories(dir);
        Files.copy(CliTest.ROOT.resolve("examples/adapters/correlation_skeleton.py"),
                dir.resolve("correlation_skeleton.py"));
        Path f = dir.resolve("learners.yaml");
        Files.writeString(f, "learners:\n  - id: corr-py\n    command: [" + Python3.find() + ", \"{dir}/correlation_skeleton.py\","
                + " --data, \"{data}\", --output, \"{output}\", --seed, \"{seed}\", --threshold, \"0.3\"]\n"
                + "    output: json\n    returns: cpdag\n" + (version == null ? "" : "    version: \"" + version + "\"\n"));
        return f;
    }

    private static void delete(Path dir) throws IOException {
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        }
    }

    static final String COMMAND_STUDY = "name: outside\nseed: 3\nreplicates: 2\n"
            + "truth:\n  graph: {family: erdos-renyi, nodes: 5, mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
            + "samples: [150]\nlearners: [corr-py, pc]\nmetrics: [shd]\n";

    @Test
    @DisplayName("report re-renders with the learners file and the script deleted, picturing the kept estimates")
    void reportWithoutLearners() throws IOException {
        Python3.require("the outside-learner tests");
        Path dir = tmp.resolve("adapter");
        Path learners = adapter(dir, null);
        Path out = runStudy(COMMAND_STUDY, "--learners", learners.toString());
        delete(dir);
        Files.delete(out.resolve("report.html"));
        CliTest.Result r = cli("report", out.toString());
        assertEquals(0, r.status(), r.err());
        String html = Files.readString(out.resolve("report.html"));
        // The pictures' titles name the configuration: the outside learner's could only come from
        // its kept estimate, as its script no longer exists.
        assertTrue(html.contains("corr-py on "), "the outside learner's estimate is pictured");
        assertTrue(html.contains("pc on "), "the built-in learner's estimate is pictured");
    }

    @Test
    @DisplayName("versions per run; a resume after the outside script changed refuses in one line, unless accepted")
    void versionChange() throws IOException {
        Python3.require("the outside-learner tests");
        Path dir = tmp.resolve("adapter");
        Path learners = adapter(dir, null);
        Path out = runStudy(COMMAND_STUDY, "--learners", learners.toString());
        String hashed = null;
        for (JournalCodec.Line l : Journal.read(out.resolve(Journal.FILE_NAME)).lines().values()) {
            assertNotNull(l.versions(), "every run records its versions");
            if (l.result().learnerId().equals("corr-py")) {
                assertTrue(l.versions().learner().startsWith("sha256:"), l.versions().learner());
                hashed = l.versions().learner();
            } else {
                assertEquals(l.versions().tool(), l.versions().learner(), "a built-in learner has the tool's version");
            }
        }
        assertNotNull(hashed);
        var prov = new ObjectMapper().readTree(out.resolve("provenance.json").toFile());
        assertEquals(hashed, prov.path("versions").path("learners").path("corr-py").asText());
        assertFalse(prov.path("versions").path("mixed").asBoolean());

        // Same script: resuming is silent.
        Path study = tmp.resolve("study.yaml");
        CliTest.Result same = cli("run", study.toString(), "--out", out.toString(), "--quiet", "--learners",
                learners.toString());
        assertEquals(0, same.status(), same.err());

        Files.writeString(dir.resolve("correlation_skeleton.py"), "\n# edited\n", java.nio.file.StandardOpenOption.APPEND);
        String bigger = COMMAND_STUDY.replace("replicates: 2", "replicates: 3");
        Files.writeString(study, bigger);
        CliTest.Result refused = cli("run", study.toString(), "--out", out.toString(), "--quiet", "--learners",
                learners.toString());
        assertEquals(2, refused.status());
        assertEquals(1, refused.err().lines().count(), refused.err());
        assertTrue(refused.err().contains("learner corr-py " + hashed + " → sha256:"), refused.err());
        assertTrue(refused.err().contains("--accept-version-change"), refused.err());
        assertFalse(refused.err().contains("tool "), "the tool did not change: " + refused.err());

        CliTest.Result accepted = cli("run", study.toString(), "--out", out.toString(), "--quiet", "--learners",
                learners.toString(), "--accept-version-change");
        assertEquals(0, accepted.status(), accepted.err());
        var versions = new java.util.HashSet<String>();
        for (JournalCodec.Line l : Journal.read(out.resolve(Journal.FILE_NAME)).lines().values()) {
            if (l.result().learnerId().equals("corr-py")) {
                versions.add(l.versions().learner());
            }
        }
        assertEquals(2, versions.size(), "kept runs keep their version, new runs have the new one: " + versions);
        prov = new ObjectMapper().readTree(out.resolve("provenance.json").toFile());
        assertTrue(prov.path("versions").path("mixed").asBoolean());
        assertTrue(Files.readString(out.resolve("report.html")).contains("MIXED"), "the report says the study is mixed");

        // A declared version replaces the digest, and a change to it is named.
        Path declared = adapter(tmp.resolve("adapter2"), "2.0");
        CliTest.Result again = cli("run", study.toString(), "--out", out.toString(), "--quiet", "--learners",
                declared.toString());
        assertEquals(2, again.status());
        assertTrue(again.err().contains(" → 2.0"), again.err());
    }
}
