package dev.touchstone.harness.study;

import dev.touchstone.harness.testing.TestWorld;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Malformed study files: each must be refused before anything runs with one message that
 * names the file, the line (and column), the field and what is allowed.
 */
class MalformedStudyTest {

    private static final String GOOD_TRUTH = "truth:\n  graph: {family: chain, nodes: 4}\n  model: {kind: linear-gaussian}\n";
    private static final String HEAD = "name: t\nseed: 1\n";
    private static final String TAIL = "samples: [50]\nlearners: [empty-test]\n";

    /** (case name, file text, field path expected, line expected, words the message must contain). */
    static Stream<Arguments> cases() {
        return Stream.of(
                Arguments.of("unknown top-level field with a hint", HEAD + "replicats: 3\n" + GOOD_TRUTH + TAIL,
                        "replicats", 3, new String[] {"unknown field", "did you mean 'replicates'", "allowed here"}),
                Arguments.of("missing seed", "name: t\n" + GOOD_TRUTH + TAIL, "seed", 1,
                        new String[] {"required"}),
                Arguments.of("missing truth", HEAD + TAIL, "truth", 1, new String[] {"required"}),
                Arguments.of("missing graph section", HEAD + "truth:\n  model: {kind: linear-gaussian}\n" + TAIL,
                        "truth.graph", 4, new String[] {"required", "chain, star"}),
                Arguments.of("unknown graph family", HEAD + "truth:\n  graph: {family: ring, nodes: 4}\n"
                                + "  model: {kind: linear-gaussian}\n" + TAIL, "truth.graph.family", 4,
                        new String[] {"unknown graph family 'ring'", "allowed: chain, star"}),
                Arguments.of("missing family", HEAD + "truth:\n  graph: {nodes: 4}\n  model: {kind: linear-gaussian}\n"
                        + TAIL, "truth.graph.family", 4, new String[] {"required", "chain"}),
                Arguments.of("unknown graph parameter", HEAD + "truth:\n  graph: {family: chain, nodez: 4}\n"
                                + "  model: {kind: linear-gaussian}\n" + TAIL, "truth.graph.nodez", 4,
                        new String[] {"unknown parameter 'nodez'", "allowed: nodes"}),
                Arguments.of("nodes out of range", HEAD + "truth:\n  graph: {family: chain, nodes: [4, -3]}\n"
                                + "  model: {kind: linear-gaussian}\n" + TAIL, "truth.graph.nodes[1]", 4,
                        new String[] {"-3", "outside the allowed range [2, 1000]"}),
                Arguments.of("nodes not a number", HEAD + "truth:\n  graph: {family: chain, nodes: many}\n"
                                + "  model: {kind: linear-gaussian}\n" + TAIL, "truth.graph.nodes", 4,
                        new String[] {"'many' is not a whole number"}),
                Arguments.of("grouped model parameter out of range", HEAD + "truth:\n  graph: {family: chain}\n"
                                + "  model:\n    kind: linear-gaussian\n    edge_weight: {low: 0.5, high: 20}\n" + TAIL,
                        "truth.model.edge_weight.high", 7, new String[] {"20", "[0.0, 10.0]"}),
                Arguments.of("unknown model kind", HEAD + "truth:\n  graph: {family: chain}\n  model: {kind: cubic}\n"
                        + TAIL, "truth.model.kind", 5, new String[] {"unknown model kind 'cubic'", "linear-gaussian"}),
                Arguments.of("boolean parameter given a number", HEAD + "truth:\n  graph: {family: chain}\n"
                                + "  model: {kind: linear-gaussian, standardize: 3}\n" + TAIL,
                        "truth.model.standardize", 5, new String[] {"not true or false"}),
                Arguments.of("unknown truth section", HEAD + GOOD_TRUTH + "  noise: 3\n" + TAIL, "truth.noise", 6,
                        new String[] {"unknown field", "graph, model, hidden, missing"}),
                Arguments.of("cross-field rule of the truth", HEAD + "truth:\n  graph: {family: chain, nodes: 3}\n"
                                + "  model: {kind: linear-gaussian}\n  hidden: 3\n" + TAIL, "truth", 4,
                        new String[] {"hidden.count must be smaller than graph.nodes", "nodes=3"}),
                Arguments.of("sample size too small", HEAD + GOOD_TRUTH + "samples: [100, 1]\nlearners: [empty-test]\n",
                        "samples[1]", 6, new String[] {"'1' is not a sample size", "oracle"}),
                Arguments.of("sample size a word", HEAD + GOOD_TRUTH + "samples: [infinity]\nlearners: [empty-test]\n",
                        "samples[0]", 6, new String[] {"'infinity' is not a sample size", "oracle"}),
                Arguments.of("sample size twice", HEAD + GOOD_TRUTH + "samples: [100, oracle, 100]\nlearners: [empty-test]\n",
                        "samples[2]", 6, new String[] {"listed twice"}),
                Arguments.of("unknown learner", HEAD + GOOD_TRUTH + "samples: [50]\nlearners:\n  - {use: my-method}\n",
                        "learners[0].use", 8, new String[] {"unknown learner 'my-method'", "empty-test",
                                "--learners FILE"}),
                Arguments.of("unknown learner parameter", HEAD + GOOD_TRUTH + "samples: [50]\nlearners:\n"
                                + "  - use: empty-test\n    with: {alpah: 0.1}\n", "learners[0].with.alpah", 9,
                        new String[] {"unknown parameter 'alpah'", "allowed: alpha"}),
                Arguments.of("learner parameter out of range", HEAD + GOOD_TRUTH + "samples: [50]\nlearners:\n"
                                + "  - use: empty-test\n    with:\n      alpha: [0.01, 1.5]\n",
                        "learners[0].with.alpha[1]", 10, new String[] {"1.5", "[0.0, 1.0]"}),
                Arguments.of("learner entry without use", HEAD + GOOD_TRUTH + "samples: [50]\nlearners:\n  - {id: a}\n",
                        "learners[0].use", 8, new String[] {"required"}),
                Arguments.of("duplicate learner id", HEAD + GOOD_TRUTH + "samples: [50]\nlearners:\n"
                                + "  - {id: a, use: empty-test}\n  - {id: a, use: boom-test}\n", "learners[1]", 9,
                        new String[] {"'a' is already used at line 8"}),
                Arguments.of("identical configurations", HEAD + GOOD_TRUTH + "samples: [50]\nlearners:\n"
                                + "  - {id: a, use: empty-test}\n  - {id: b, use: empty-test, with: {alpha: 0.05}}\n",
                        "learners.b", 9, new String[] {"identical to a"}),
                Arguments.of("unknown metric", HEAD + GOOD_TRUTH + TAIL + "metrics: [shd, f1]\n", "metrics[1]", 8,
                        new String[] {"unknown metric 'f1'", "allowed: shd, edges, seconds, tests"}),
                Arguments.of("negative time limit", HEAD + GOOD_TRUTH + TAIL + "limits: {seconds: -5}\n",
                        "limits.seconds", 8, new String[] {"'-5'", "more than 0"}),
                Arguments.of("grid too large", HEAD + "replicates: 1000\ntruth:\n  graph: {family: chain, nodes: [3, 4, 5]}\n"
                                + "  model: {kind: linear-gaussian}\nsamples: [50, 100]\nlearners: [empty-test]\n"
                                + "limits: {max_runs: 5000}\n", "limits.max_runs", 9,
                        new String[] {"6,000 runs", "3 truth settings x 1000 replicates x 2 sample sizes",
                                "raise limits.max_runs"}),
                Arguments.of("compare_to unknown", HEAD + GOOD_TRUTH + TAIL + "compare_to: pc\n", "compare_to", 8,
                        new String[] {"no learner entry has the id 'pc'", "empty-test"}),
                Arguments.of("score_against an unknown class", HEAD + GOOD_TRUTH + TAIL + "score_against: [dag, tree]\n",
                        "score_against[1]", 8, new String[] {"unknown graph class 'tree'", "allowed: dag, cpdag, mag, pag"}),
                Arguments.of("replicates zero", HEAD + "replicates: 0\n" + GOOD_TRUTH + TAIL, "replicates", 3,
                        new String[] {"outside the allowed range [1, 100000]"}),
                Arguments.of("seed not a number", "name: t\nseed: forty-two\n" + GOOD_TRUTH + TAIL, "seed", 2,
                        new String[] {"expected a whole number", "'forty-two'"}),
                Arguments.of("over-indented line joins the previous value", "name: t\nseed: 1\n  replicates: 3\n"
                        + GOOD_TRUTH + TAIL, "", 3, new String[] {"not valid YAML"}),
                Arguments.of("field given twice", HEAD + "seed: 2\n" + GOOD_TRUTH + TAIL, "seed", 3,
                        new String[] {"given twice", "first at line 2"}),
                Arguments.of("YAML syntax error", HEAD + "truth: {graph: [\n" + TAIL, "", 5,
                        new String[] {"not valid YAML"}),
                Arguments.of("learners not a list", HEAD + GOOD_TRUTH + "samples: [50]\nlearners: {use: empty-test}\n",
                        "learners", 7, new String[] {"expected a list"}),
                Arguments.of("bad study name", "name: 'my study'\nseed: 1\n" + GOOD_TRUTH + TAIL, "name", 1,
                        new String[] {"'my study' is not allowed"}));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    @DisplayName("a malformed study is refused with file, line, field and what is allowed")
    void refused(String name, String text, String field, int line, String[] words) {
        StudyException e = assertThrows(StudyException.class, () -> TestWorld.plan(text), name);
        String m = e.getMessage();
        assertEquals(field, e.field(), m);
        assertEquals(line, e.place().line(), m);
        assertTrue(m.startsWith("study.yaml:" + line + ":"), m);
        if (!field.isEmpty()) {
            assertTrue(m.contains(": " + field + ": "), m);
        }
        for (String w : words) {
            assertTrue(m.contains(w), "message lacks '" + w + "': " + m);
        }
        assertEquals(-1, m.indexOf('\n'), "one line: " + m);
    }

    @org.junit.jupiter.api.Test
    @DisplayName("JSON study files are read too, and their errors have JSON places")
    void json() {
        String text = "{\"name\": \"t\", \"seed\": 1, \"truth\": {\"graph\": {\"family\": \"chain\"},\n"
                + " \"model\": {\"kind\": \"linear-gaussian\"}}, \"samples\": [50],\n"
                + " \"learners\": [\"empty-test\"], \"metrics\": [\"shdd\"]}";
        StudyException e = assertThrows(StudyException.class,
                () -> TestWorld.reader().read(NodeReader.read("s.json", text, true)));
        assertEquals("metrics[0]", e.field());
        assertEquals(3, e.place().line());
        assertTrue(e.getMessage().startsWith("s.json:3:"), e.getMessage());
    }
}
