package dev.touchstone.harness.cli;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Refusals through the command line: exit 2, one {@code error:} line naming the file (and
 * place) with what to do, no Java class names, and nothing written before the input is
 * found sound.
 */
class BadInputTest {

    private static final String VARIABLES = "\"variables\": [\"a\", \"b\", \"c\"]";

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

    /** Exit 2 with exactly one line, starting {@code error: } and containing every fragment. */
    static String refused(Result r, String... fragments) {
        assertEquals(2, r.status(), r.err());
        List<String> lines = r.err().lines().filter(l -> !l.isBlank()).toList();
        assertEquals(1, lines.stream().filter(l -> l.startsWith("error: ")).count(), r.err());
        assertTrue(lines.get(0).startsWith("error: "), r.err());
        assertFalse(r.err().matches("(?s).*\\b(java|com|org)\\.[a-z]+\\..*"), "a Java class name: " + r.err());
        assertFalse(r.err().contains("Exception"), r.err());
        for (String f : fragments) {
            assertTrue(lines.get(0).contains(f), "'" + f + "' in " + r.err());
        }
        return lines.get(0);
    }

    private Path write(String name, String text) throws IOException {
        Path f = tmp.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    private static String edge(String a, String b, String ma, String mb) {
        return "{\"between\": [\"" + a + "\", \"" + b + "\"], \"marks\": [\"" + ma + "\", \"" + mb + "\"]}";
    }

    private Path graph(String name, String... edges) throws IOException {
        return write(name, "{" + VARIABLES + ", \"edges\": [" + String.join(", ", edges) + "]}");
    }

    @Test
    @DisplayName("missing, folder and invalid UTF-8 files are refused naming the file, for data, knowledge, graphs and studies")
    void unreadableFiles() throws IOException {
        Path good = graph("good.json", edge("a", "b", "tail", "arrow"));
        Path folder = Files.createDirectories(tmp.resolve("folder.json"));
        Path latin = tmp.resolve("latin.json");
        Files.write(latin, ("{" + VARIABLES + ", \"edges\": []} ").getBytes(StandardCharsets.UTF_8));
        Files.write(latin, new byte[] {'\n', (byte) 0xE9, '\n'}, java.nio.file.StandardOpenOption.APPEND);
        refused(cli("score", "--estimate", tmp.resolve("none.json").toString(), "--truth", good.toString()),
                "none.json", "no such file");
        refused(cli("score", "--estimate", folder.toString(), "--truth", good.toString()), "folder.json", "is a folder");
        refused(cli("score", "--estimate", latin.toString(), "--truth", good.toString()), "latin.json, line 2",
                "not valid UTF-8");
        refused(cli("learn", "--data", tmp.resolve("none.csv").toString(), "--learner", "pc"), "none.csv", "no such file");
        Path data = write("d.csv", "a,b,c\n1,2,3\n2,3,1\n3,1,2\n4,4,4\n");
        refused(cli("learn", "--data", data.toString(), "--learner", "empty", "--knowledge", folder.toString()),
                "folder.json", "is a folder");
        Path badYaml = tmp.resolve("k.yaml");
        Files.write(badYaml, new byte[] {'r', 'e', 'q', 'u', 'i', 'r', 'e', 'd', ':', ' ', (byte) 0xFF, '\n'});
        refused(cli("learn", "--data", data.toString(), "--learner", "empty", "--knowledge", badYaml.toString()),
                "k.yaml, line 1", "not valid UTF-8");
        refused(cli("learn", "--data", data.toString(), "--learner", "empty", "--knowledge",
                write("e.yaml", "# nothing\n").toString()), "e.yaml", "the file is empty");
        refused(cli("run", tmp.resolve("none.yaml").toString()), "none.yaml", "no such file");
        String yaml = refused(cli("check", write("broken.yaml", "name: x\ntiers: [a\n  - [b]\n").toString()),
                "broken.yaml:");
        assertTrue(yaml.matches("error: broken\\.yaml:\\d+:\\d+: not valid YAML: .*"), yaml);
        // found by the mutation fuzzer: the parser named what it found by its event class
        String event = refused(cli("check", write("event.yaml", "name: x\nlearners:\n  - {id: a, use]: b}\n")
                .toString()), "event.yaml:3:");
        assertTrue(event.contains("the start of a map") && !event.contains("snakeyaml"), event);
    }

    @Test
    @DisplayName("a graph that breaks its class is refused wherever it enters: cyclic estimate or truth, capitalised or bad PAG marks, trailing data")
    void graphClasses() throws IOException {
        Path dag = graph("dag.json", edge("a", "b", "tail", "arrow"), edge("b", "c", "tail", "arrow"));
        Path cycle = graph("cycle.json", edge("a", "b", "tail", "arrow"), edge("b", "c", "tail", "arrow"),
                edge("c", "a", "tail", "arrow"));
        refused(cli("score", "--estimate", cycle.toString(), "--truth", dag.toString(), "--as", "cpdag"),
                "cycle.json", "directed cycle (a -> b -> c -> a)");
        refused(cli("score", "--estimate", cycle.toString(), "--truth", dag.toString()), "cycle.json", "directed cycle");
        // the cyclic truth is named, not the estimate
        String truth = refused(cli("score", "--estimate", dag.toString(), "--truth", cycle.toString(), "--as", "pag"),
                "cycle.json", "directed cycle");
        assertFalse(truth.contains("dag.json"), truth);
        Path tailCircle = graph("tc.json", edge("a", "b", "tail", "circle"));
        refused(cli("score", "--estimate", dag.toString(), "--truth", tailCircle.toString(), "--as", "pag"),
                "tc.json", "tails only on directed edges");
        refused(cli("score", "--estimate", graph("caps.json", edge("a", "b", "Tail", "arrow")).toString(),
                "--truth", dag.toString()), "caps.json, edge 1", "unknown mark 'Tail' (allowed: tail, arrow, circle)");
        refused(cli("score", "--estimate", dag.toString(), "--truth", dag.toString(), "--as", "CPDAG"),
                "--as", "allowed: dag, cpdag, pag");
        refused(cli("score", "--estimate", write("t.json", "{" + VARIABLES + ", \"edges\": []}\n{}").toString(),
                "--truth", dag.toString()), "t.json, line 2", "unexpected content after the end of the JSON object");
        Path hidden = write("hidden.json", "{" + VARIABLES + ", \"hidden\": [\"a\", \"b\", \"c\"], \"edges\": ["
                + edge("a", "b", "tail", "arrow") + "]}");
        Path sim = tmp.resolve("sim");
        refused(cli("simulate", "--graph", "given", "--set", "file=" + hidden, "--out", sim.toString()),
                "hidden.json", "every variable of the graph is hidden");
        assertFalse(Files.exists(sim.resolve("data.csv")), "nothing written");
    }

    @Test
    @DisplayName("an outside learner that declares a CPDAG and returns a directed cycle fails that run with the reason")
    void outsideCycle() throws IOException {
        Path out = graph("o.json", edge("a", "b", "tail", "arrow"), edge("b", "c", "tail", "arrow"),
                edge("c", "a", "tail", "arrow"));
        Path learners = write("learners.yaml", String.join("\n",
                "learners:",
                "  - id: cyclic",
                "    returns: cpdag",
                "    command: [sh, -c, 'cp \"$0\" \"$1\"', '" + out + "', '{output}', '{data}']", ""));
        Path data = write("d.csv", "a,b,c\n1,2,3\n2,3,1\n3,1,2\n4,4,4\n");
        Result r = cli("learn", "--data", data.toString(), "--learner", "cyclic", "--learners", learners.toString());
        assertEquals(1, r.status(), r.err());
        assertTrue(r.err().startsWith("error: learner cyclic failed: ") && r.err().contains("directed cycle"), r.err());
    }

    @Test
    @DisplayName("unknown spellings in a learners file are refused with the accepted ones (own_method for own-method)")
    void spellings() throws IOException {
        Path learners = write("learners.yaml", String.join("\n",
                "learners:",
                "  - id: mine",
                "    returns: cpdag",
                "    missing_values: own_method",
                "    command: [echo, '{data}', '{output}']", ""));
        refused(cli("learners", "--learners", learners.toString()), "learners.yaml:4:", "own_method",
                "own-method");
    }

    @Test
    @DisplayName("simulate --out onto a file, and a damaged journal on run and report: exit 2, and provenance.json is left as it was")
    void outputsAndJournal() throws IOException {
        Path file = write("taken", "x");
        refused(cli("simulate", "--network", "sprinkler", "--out", file.toString()), "--out", "taken", "not a folder");
        Path study = write("s.yaml", String.join("\n",
                "name: small", "seed: 3", "replicates: 3",
                "truth:", "  - graph: {family: erdos-renyi, nodes: 4, mean_degree: 1}",
                "    model: {kind: linear-gaussian}",
                "samples: [50]", "learners: [empty]", "metrics: [shd]", ""));
        Path out = tmp.resolve("out");
        assertEquals(0, cli("run", study.toString(), "--out", out.toString(), "--quiet").status());
        Path journal = out.resolve("journal.jsonl");
        List<String> lines = new ArrayList<>(Files.readAllLines(journal));
        lines.set(0, lines.get(0).substring(0, lines.get(0).length() / 2));
        Files.write(journal, lines);
        byte[] provenance = Files.readAllBytes(out.resolve("provenance.json"));
        refused(cli("report", out.toString()), "journal.jsonl:1:", "damaged");
        refused(cli("run", study.toString(), "--out", out.toString(), "--quiet"), "journal.jsonl:1:", "damaged");
        assertArrayEquals(provenance, Files.readAllBytes(out.resolve("provenance.json")), "provenance.json rewritten");
    }
}
