package dev.touchstone.harness.cli;

import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
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
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Mutation fuzzing of every kind of file the command line reads (common practice: start from
 * valid inputs and damage them byte by byte and line by line). Whatever a mutation does, the
 * tool either accepts the file (exit 0) or refuses it cleanly: exit 2 with exactly one
 * {@code error:} line, no Java class or exception names. Exit 1 (a fault of the tool), a hang
 * or a second line fails the test and prints the mutated file. Seeded and bounded: a fixed
 * number of cases per kind of file, about ten seconds on the 2-core CI machine.
 */
class MutatedInputFuzzTest {

    /** Mutated cases per kind of file. */
    private static final int CASES = 80;

    private static final String STUDY = """
            name: fuzzed
            seed: 11
            replicates: 1
            truth:
              graph: {family: erdos-renyi, nodes: [4], mean_degree: 2}
              model: {kind: linear-gaussian}
            samples: [60]
            learners:
              - {id: pc, use: pc, with: {alpha: 0.05}}
              - {id: ges, use: ges}
            metrics: [shd, adjacency_f1]
            limits: {seconds: 10}
            compare_to: ges
            """;
    private static final String KNOWLEDGE = """
            required: [[a, b]]
            forbidden: [[c, a]]
            tiers:
              - [a]
              - [b, c]
            """;
    private static final String GRAPH = """
            {
              "variables": ["a", "b", "c", "d"],
              "edges": [
                {"between": ["a", "b"], "marks": ["tail", "arrow"]},
                {"between": ["b", "c"], "marks": ["tail", "arrow"]},
                {"between": ["a", "d"], "marks": ["tail", "arrow"]}
              ]
            }
            """;
    private static final String DOT = """
            digraph estimate {
              "a" -> "b";
              "b" -> "c";
              "a" -> "d";
            }
            """;

    @TempDir
    Path tmp;

    @Test
    @DisplayName("study files, damaged at random, are accepted by check or refused with one error line")
    void studies() throws IOException {
        fuzz("study.yaml", STUDY, 101, f -> new String[]{"check", f.toString()});
    }

    @Test
    @DisplayName("data files, damaged at random, are learned from or refused with one error line")
    void data() throws IOException {
        fuzz("data.csv", dataText(), 102, f -> new String[]{"learn", "--learner", "pc", "--data", f.toString(),
                "--out", tmp.resolve("estimate.json").toString()});
    }

    @Test
    @DisplayName("knowledge files, damaged at random, are used or refused with one error line")
    void knowledge() throws IOException {
        Path data = Files.writeString(tmp.resolve("clean.csv"), dataText());
        fuzz("knowledge.yaml", KNOWLEDGE, 103, f -> new String[]{"learn", "--learner", "pc", "--data",
                data.toString(), "--knowledge", f.toString(), "--out", tmp.resolve("estimate.json").toString()});
    }

    @Test
    @DisplayName("graph files (JSON and DOT), damaged at random, are scored or refused with one error line")
    void graphs() throws IOException {
        Path truth = Files.writeString(tmp.resolve("truth.json"), GRAPH);
        fuzz("estimate.json", GRAPH, 104, f -> new String[]{"score", "--estimate", f.toString(), "--truth",
                truth.toString()});
        fuzz("estimate.dot", DOT, 105, f -> new String[]{"score", "--estimate", f.toString(), "--truth",
                truth.toString()});
    }

    /** Sixty rows of four columns with a chain a → b → c and an independent d, written as text. */
    private static String dataText() {
        UniformRandomProvider rng = Seeds.random(7);
        StringBuilder sb = new StringBuilder("a,b,c,d\n");
        for (int i = 0; i < 60; i++) {
            double a = gaussian(rng);
            double b = 0.8 * a + gaussian(rng);
            double c = -0.7 * b + gaussian(rng);
            sb.append(String.format(java.util.Locale.ROOT, "%.4f,%.4f,%.4f,%.4f%n", a, b, c, gaussian(rng)));
        }
        return sb.toString();
    }

    private static double gaussian(UniformRandomProvider rng) {
        return Math.sqrt(-2 * Math.log(1 - rng.nextDouble())) * Math.cos(2 * Math.PI * rng.nextDouble());
    }

    private void fuzz(String name, String valid, long seed, Function<Path, String[]> command) throws IOException {
        Path file = tmp.resolve(name);
        Files.writeString(file, valid);
        CliTest.Result clean = run(command.apply(file));
        assertEquals(0, clean.status(), "the unmutated " + name + " is accepted: " + clean.err());
        UniformRandomProvider rng = Seeds.random(seed);
        byte[] original = valid.getBytes(StandardCharsets.UTF_8);
        int refused = 0;
        for (int i = 0; i < CASES; i++) {
            byte[] mutated = mutate(original, rng);
            Files.write(file, mutated);
            CliTest.Result r = run(command.apply(file));
            String shown = "case " + i + " of " + name + ":\n" + new String(mutated, StandardCharsets.UTF_8)
                    + "\n--- stderr:\n" + r.err();
            if (r.status() == 2) {
                refused++;
                // One line per independent problem of the file, each an error line.
                List<String> lines = r.err().lines().filter(l -> !l.isBlank()).toList();
                assertFalse(lines.isEmpty(), shown);
                for (String line : lines) {
                    assertTrue(line.startsWith("error: "), shown);
                    assertTrue(!line.contains("Exception") && !line.matches(
                            ".*\\b(java|javax|com|org)\\.[a-z]+\\..*"), "a Java name: " + shown);
                }
            } else if (r.status() != 0) {
                fail("exit " + r.status() + " (not 0 or 2) for " + shown);
            }
        }
        // Most damage must be caught: a reader that accepted everything would pass the loop above.
        assertTrue(refused >= CASES / 4, name + ": only " + refused + " of " + CASES + " mutations refused");
    }

    private static CliTest.Result run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new CliTest.Result(status, out.toString(), err.toString());
    }

    /** One to three random edits: bytes deleted, inserted or replaced, lines dropped or repeated, a cut. */
    static byte[] mutate(byte[] in, UniformRandomProvider rng) {
        List<Byte> b = new ArrayList<>(in.length + 8);
        for (byte x : in) {
            b.add(x);
        }
        byte[] alphabet = "{}[]:,\"'-#\n\t 0.5e9xyz\\".getBytes(StandardCharsets.US_ASCII);
        int edits = 1 + rng.nextInt(3);
        for (int e = 0; e < edits && !b.isEmpty(); e++) {
            int at = rng.nextInt(b.size());
            switch (rng.nextInt(6)) {
                case 0 -> b.subList(at, Math.min(b.size(), at + 1 + rng.nextInt(6))).clear();
                case 1 -> b.add(at, alphabet[rng.nextInt(alphabet.length)]);
                case 2 -> b.set(at, rng.nextInt(8) == 0 ? (byte) 0xFF : alphabet[rng.nextInt(alphabet.length)]);
                case 3 -> dropLine(b, at);
                case 4 -> repeatLine(b, at);
                default -> b.subList(at, b.size()).clear();
            }
        }
        byte[] out = new byte[b.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = b.get(i);
        }
        return out;
    }

    private static int lineStart(List<Byte> b, int at) {
        int s = at;
        while (s > 0 && b.get(s - 1) != '\n') {
            s--;
        }
        return s;
    }

    private static int lineEnd(List<Byte> b, int at) {
        int e = at;
        while (e < b.size() && b.get(e) != '\n') {
            e++;
        }
        return Math.min(b.size(), e + 1);
    }

    private static void dropLine(List<Byte> b, int at) {
        b.subList(lineStart(b, at), lineEnd(b, at)).clear();
    }

    private static void repeatLine(List<Byte> b, int at) {
        int s = lineStart(b, at);
        List<Byte> line = new ArrayList<>(b.subList(s, lineEnd(b, at)));
        b.addAll(s, line);
    }

    /** The edits are reproducible: the same seed mutates the same way (what makes a failure re-runnable). */
    @Test
    @DisplayName("mutations are reproducible from their seed")
    void mutationsAreSeeded() {
        byte[] in = STUDY.getBytes(StandardCharsets.UTF_8);
        UniformRandomProvider a = Seeds.random(5);
        UniformRandomProvider b = Seeds.random(5);
        for (int i = 0; i < 20; i++) {
            assertTrue(Arrays.equals(mutate(in, a), mutate(in, b)));
        }
    }
}
