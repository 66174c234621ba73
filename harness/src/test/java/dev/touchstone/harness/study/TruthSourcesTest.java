package dev.touchstone.harness.study;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.generators.SimulatedTruth;
import dev.touchstone.generators.networks.ReferenceNetworks;
import dev.touchstone.harness.io.GraphCsv;
import dev.touchstone.harness.io.GraphJson;
import dev.touchstone.harness.testing.TestWorld;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Truths other than random graphs in study files: a built-in reference network
 * ({@code truth.network}), a graph file ({@code graph: {family: given, file: …}}), and a list
 * of truth blocks run side by side. Uses the real generators' catalogue with the test
 * world's learners and metrics. What a network or a given graph must contain is the
 * generators' concern (checked there against its sources); here: that the study reaches it
 * intact, keys follow it, and bad input is refused at its place.
 */
class TruthSourcesTest {

    private static final GeneratorTruthCatalog TRUTH = new GeneratorTruthCatalog();
    private static final String HEAD = "name: t\nseed: 7\nreplicates: 2\n";
    private static final String TAIL = "samples: [50, 100]\nlearners: [empty-test]\n";

    @TempDir
    Path tmp;

    private static StudyReader reader() {
        return new StudyReader(TRUTH, TestWorld.learners(), TestWorld.METRICS);
    }

    private Plan plan(String yaml) throws IOException {
        Path file = tmp.resolve("study.yaml");
        Files.writeString(file, yaml);
        return plan(file);
    }

    private static Plan plan(Path file) {
        return new Expansion(TRUTH).expand(reader().read(file), TestWorld.learners());
    }

    private static Graph chain(String... names) {
        MutableGraph g = Graph.builder(List.of(names));
        for (int i = 0; i + 1 < names.length; i++) {
            g.addDirected(i, i + 1);
        }
        return g.freeze();
    }

    @Test
    @DisplayName("truth.network names a built-in network; a bare name is enough, and its data are the network's")
    void network() throws IOException {
        Plan p = plan(HEAD + "truth: {network: community-garden, hidden: 1}\n" + TAIL);
        assertEquals(1, p.truths().size());
        TruthSetting t = p.truths().get(0);
        assertEquals("community-garden", t.choice(GeneratorTruthCatalog.NETWORK).kind());
        assertNull(t.choice(GeneratorTruthCatalog.GRAPH), "a network brings its own graph");
        SimulatedTruth drawn = GeneratorTruthCatalog.simulation(t).drawTruth(p.runs().get(0).seeds().replicateSeed());
        Graph garden = ReferenceNetworks.communityGarden().dag();
        assertEquals(garden.names(), drawn.dag().names());
        assertEquals(1, drawn.dag().hiddenNames().size(), "hidden options still apply to a network");
        assertTrue(drawn.sample(20).data().isDiscrete(0), "the garden network is discrete");
        assertEquals(2 * 2, p.runs().size());
    }

    @Test
    @DisplayName("a list under truth runs random graphs and a network side by side; the normalised study reads back to the same keys")
    void blocks() throws IOException {
        String yaml = HEAD + "truth:\n  - graph: {family: erdos-renyi, nodes: [5, 6], mean_degree: 2}\n"
                + "    model: {kind: linear-gaussian}\n  - network: [sprinkler, community-garden]\n" + TAIL;
        Plan p = plan(yaml);
        assertEquals(4, p.truths().size());
        assertEquals(4 * 2 * 2, p.runs().size());
        assertEquals("erdos-renyi", p.truths().get(1).choice("graph").kind());
        assertEquals("sprinkler", p.truths().get(2).choice("network").kind());
        Plan only = plan(HEAD + "truth:\n  graph: {family: erdos-renyi, nodes: [5, 6], mean_degree: 2}\n"
                + "  model: {kind: linear-gaussian}\n" + TAIL);
        for (int i = 0; i < only.runs().size(); i++) {
            assertEquals(only.runs().get(i).key(), p.runs().get(i).key(),
                    "adding a block leaves the keys of the first block's runs as they were");
        }
        Path normalised = tmp.resolve("normalised.yaml");
        Files.writeString(normalised, StudyWriter.yaml(p.study()));
        Plan back = plan(normalised);
        assertEquals(p.runs().stream().map(RunDefinition::key).toList(),
                back.runs().stream().map(RunDefinition::key).toList());
    }

    @Test
    @DisplayName("a given graph file (JSON or CSV) is the truth; its path is relative to the study; editing it changes the keys")
    void givenGraph() throws IOException {
        Path dir = Files.createDirectories(tmp.resolve("graphs"));
        Graph g = chain("rain", "soil", "slugs", "yield");
        GraphJson.write(dir.resolve("g.json"), g);
        GraphCsv.write(dir.resolve("g.csv"), g);
        String yaml = HEAD + "truth:\n  graph: {family: given, file: [graphs/g.json, graphs/g.csv]}\n"
                + "  model: {kind: linear-gaussian}\n" + TAIL;
        Plan p = plan(yaml);
        assertEquals(2, p.truths().size());
        for (TruthSetting t : p.truths()) {
            Graph drawn = GeneratorTruthCatalog.simulation(t).drawTruth(1L).dag();
            assertEquals(g.names(), drawn.names());
            assertEquals(g, drawn, "the file's DAG, edge for edge");
            assertTrue(Path.of(t.choice("graph").values().get("file").toString()).isAbsolute());
        }
        Path normalised = tmp.resolve("out").resolve("study.yaml");
        Files.createDirectories(normalised.getParent());
        Files.writeString(normalised, StudyWriter.yaml(p.study()));
        assertEquals(p.runs().get(0).key(), plan(normalised).runs().get(0).key(),
                "the normalised study names the file absolutely, so it reads back from another folder");
        GraphJson.write(dir.resolve("g.json"), chain("rain", "soil", "yield", "slugs"));
        Plan edited = plan(yaml);
        assertNotEquals(p.runs().get(0).key(), edited.runs().get(0).key(), "the file's content is in the key");
        assertEquals(StudyWriter.yaml(p.study()), StudyWriter.yaml(edited.study()),
                "the normalised study text names the file, not its content");
        assertNotEquals(p.outlineHash(), edited.outlineHash(),
                "so the outline a finished study is recognised by holds the file's digest");
        assertEquals(p.runs().get(p.runs().size() - 1).key(), edited.runs().get(edited.runs().size() - 1).key(),
                "runs on the unchanged CSV file keep their keys");
    }

    @Test
    @DisplayName("moving a study with its graph file to another folder keeps run keys and seeds (run keys derive from definitions, not paths)")
    void givenGraphMoved() throws IOException {
        Graph g = chain("rain", "soil", "slugs", "yield");
        String yaml = HEAD + "truth:\n  graph: {family: given, file: g.json}\n  model: {kind: linear-gaussian}\n" + TAIL;
        List<String> keys = new ArrayList<>();
        List<Long> seeds = new ArrayList<>();
        for (String folder : List.of("first", "second/deeper")) {
            Path dir = Files.createDirectories(tmp.resolve(folder));
            GraphJson.write(dir.resolve("g.json"), g);
            Path study = dir.resolve("study.yaml");
            Files.writeString(study, yaml);
            Plan p = plan(study);
            keys.add(p.runs().get(0).key());
            seeds.add(new ReplicateSeeds(p.study().seed(), p.truths().get(0), 0).data());
        }
        assertEquals(keys.get(0), keys.get(1), "same content, other folder: same key");
        assertEquals(seeds.get(0), seeds.get(1), "same content, other folder: same data seed");
    }

    /** (case name, truth text from line 4, field expected, line expected, words the message must contain). */
    static Stream<Arguments> malformed() {
        return Stream.of(
                Arguments.of("network with a graph", "truth:\n  network: sprinkler\n  graph: {family: chain}\n",
                        "truth.graph", 6, new String[] {"not allowed together with truth.network"}),
                Arguments.of("unknown network", "truth: {network: kitchen-garden}\n", "truth.network", 4,
                        new String[] {"unknown network name 'kitchen-garden'", "chest-clinic, sprinkler, community-garden"}),
                Arguments.of("neither graph nor network", "truth: {model: {kind: linear-gaussian}}\n", "truth.graph", 4,
                        new String[] {"required", "or give model_file or network instead"}),
                Arguments.of("network with a parameter", "truth: {network: {name: sprinkler, nodes: 5}}\n",
                        "truth.network.nodes", 4, new String[] {"unknown parameter 'nodes'", "allowed: none"}),
                Arguments.of("missing graph file", "truth:\n  graph: {family: given, file: nowhere.json}\n"
                        + "  model: {kind: linear-gaussian}\n", "truth.graph.file", 5,
                        new String[] {"nowhere.json: no such graph file"}),
                Arguments.of("given without a file", "truth:\n  graph: {family: given}\n"
                        + "  model: {kind: linear-gaussian}\n", "truth", 5,
                        new String[] {"needs a graph file"}),
                Arguments.of("empty truth list", "truth: []\n", "truth", 4, new String[] {"an empty list gives no truth"}),
                Arguments.of("unknown knowledge", "truth: {network: sprinkler}\nsamples: [50]\nlearners:\n"
                        + "  - {use: empty-test, knowledge: layers}\n", "learners[0].knowledge", 7,
                        new String[] {"unknown knowledge 'layers'", "allowed: none, tiers"}),
                Arguments.of("tiers for a learner that ignores them", "truth: {network: sprinkler}\nsamples: [50]\n"
                        + "learners:\n  - {use: empty-test, knowledge: tiers}\n", "learners[0].knowledge", 7,
                        new String[] {"learner empty-test does not honour tiers"}),
                Arguments.of("bad block in a truth list", "truth:\n  - network: sprinkler\n  - network: sprinkler\n"
                        + "    model: {kind: linear-gaussian}\n", "truth[1].model", 7,
                        new String[] {"not allowed together with truth[1].network"}));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("malformed")
    @DisplayName("a bad network or graph file is refused at its file, line and column")
    void refused(String name, String truth, String field, int line, String[] words) throws IOException {
        Path file = tmp.resolve("study.yaml");
        Files.writeString(file, HEAD + truth + (truth.contains("learners:") ? "" : TAIL));
        StudyException e = assertThrows(StudyException.class, () -> plan(file), name);
        String m = e.getMessage();
        assertEquals(field, e.field(), m);
        assertEquals(line, e.place().line(), m);
        assertTrue(m.startsWith("study.yaml:" + line + ":"), m);
        for (String w : words) {
            assertTrue(m.contains(w), "message lacks '" + w + "': " + m);
        }
        assertEquals(-1, m.indexOf('\n'), "one line: " + m);
    }

    @Test
    @DisplayName("a graph file that is not a DAG is refused at the study's line, naming the file")
    void notADag() throws IOException {
        Files.writeString(tmp.resolve("cycle.csv"), "node_a,node_b,mark_a,mark_b\na,b,tail,arrow\nb,a,tail,arrow\n");
        Path file = tmp.resolve("study.yaml");
        Files.writeString(file, HEAD + "truth:\n  graph: {family: given, file: cycle.csv}\n"
                + "  model: {kind: linear-gaussian}\n" + TAIL);
        StudyException e = assertThrows(StudyException.class, () -> plan(file));
        assertEquals(5, e.place().line(), e.getMessage());
        assertTrue(e.getMessage().contains("cycle.csv"), e.getMessage());
        assertEquals(-1, e.getMessage().indexOf('\n'), e.getMessage());
    }

    /** A learner honouring tiers that returns the empty graph and remembers the knowledge it was given. */
    private static final class TierSpy implements dev.touchstone.core.learner.Learner {
        final java.util.List<dev.touchstone.core.knowledge.Knowledge> seen =
                java.util.Collections.synchronizedList(new java.util.ArrayList<>());
        private final dev.touchstone.core.learner.LearnerDescription d =
                dev.touchstone.core.learner.LearnerDescription.builder("tier-spy").summary("records its knowledge")
                        .publication("test only").family(dev.touchstone.core.learner.LearnerFamily.BASELINE)
                        .accepts(dev.touchstone.core.data.DataKind.CONTINUOUS)
                        .returns(dev.touchstone.core.graph.GraphClass.CPDAG)
                        .missingValues(dev.touchstone.core.learner.MissingValues.REJECTS)
                        .knowledge(dev.touchstone.core.learner.KnowledgeUse.TIERS).build();

        @Override
        public dev.touchstone.core.learner.LearnerDescription description() {
            return d;
        }

        @Override
        public dev.touchstone.core.learner.Estimate learn(dev.touchstone.core.learner.LearnerInput input,
                                                        dev.touchstone.core.knowledge.Knowledge k,
                                                        dev.touchstone.core.param.ParameterValues p,
                                                        dev.touchstone.core.learner.RunContext c) {
            seen.add(k);
            return dev.touchstone.core.learner.Estimate.of(Graph.empty(input.variableNames()),
                    dev.touchstone.core.graph.GraphClass.CPDAG);
        }
    }

    @Test
    @DisplayName("knowledge: tiers hands a layered truth's layers (observed variables only) to the runs; none by default")
    void tiersAsKnowledge() throws IOException {
        TierSpy spy = new TierSpy();
        var catalog = dev.touchstone.harness.catalog.LearnerCatalog.builder()
                .add(spy, dev.touchstone.harness.catalog.LearnerCatalog.Origin.BUILT_IN, "test").build();
        Path file = tmp.resolve("layers.yaml");
        Files.writeString(file, "name: t\nseed: 3\ntruth:\n  graph: {family: layered, nodes: 9, layers: 3}\n"
                + "  model: {kind: linear-gaussian}\n  hidden: 1\nsamples: [40]\nlearners:\n"
                + "  - {id: with-tiers, use: tier-spy, knowledge: tiers}\n  - {id: plain, use: tier-spy}\n");
        Study study = new StudyReader(TRUTH, catalog, TestWorld.METRICS).read(file);
        Plan p = new Expansion(TRUTH).expand(study, catalog);
        assertNotEquals(p.runs().get(0).key(), p.runs().get(1).key(), "knowledge is part of the run key");
        var layout = new dev.touchstone.harness.execution.SettingLayout(p);
        var performer = new dev.touchstone.harness.execution.RunPerformer(TestWorld.SCORER, layout);
        var rep = new dev.touchstone.harness.execution.GeneratorSimulator().draw(p.truths().get(0),
                p.runs().get(0).seeds(), 40);
        performer.perform(p.runs().get(0), rep);
        performer.perform(p.runs().get(1), rep);
        SimulatedTruth drawn = GeneratorTruthCatalog.simulation(p.truths().get(0))
                .drawTruth(p.runs().get(0).seeds().replicateSeed());
        List<List<String>> expected = new java.util.ArrayList<>();
        for (List<String> tier : drawn.knowledge().tiers()) {
            if (!tier.isEmpty()) {
                expected.add(tier);
            }
        }
        assertEquals(3, drawn.knowledge().tiers().size(), "three layers, three tiers (generators' own check)");
        assertEquals(expected, spy.seen.get(0).tiers(), "the run with knowledge: tiers gets the layers");
        assertEquals(8, spy.seen.get(0).variables().size(), "the hidden variable is in no tier");
        assertTrue(spy.seen.get(1).isEmpty(), "the default entry gets no knowledge");

        Path normalised = tmp.resolve("n.yaml");
        Files.writeString(normalised, StudyWriter.yaml(study));
        assertTrue(Files.readString(normalised).contains("knowledge: tiers"));
        assertEquals(p.runs().get(0).key(), new Expansion(TRUTH).expand(
                new StudyReader(TRUTH, catalog, TestWorld.METRICS).read(normalised), catalog).runs().get(0).key());
    }
}
