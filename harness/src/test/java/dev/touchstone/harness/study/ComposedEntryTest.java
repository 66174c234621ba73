package dev.touchstone.harness.study;

import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.testing.TestWorld;
import dev.touchstone.learners.composed.ComposedLearner;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Composed learner entries ({@code steps}) in study files: read, expanded, written back, and refused when malformed. */
class ComposedEntryTest {

    private static final String HEAD = "name: t\nseed: 1\ntruth:\n  graph: {family: chain, nodes: 4}\n"
            + "  model: {kind: linear-gaussian}\nsamples: [50]\nlearners:\n";
    private static final LearnerCatalog BUILT_IN = LearnerCatalog.builtIn();

    private static Study read(String text) {
        return new StudyReader(TestWorld.TRUTH, BUILT_IN, TestWorld.METRICS).read(NodeReader.read("study.yaml", text, false));
    }

    private static Plan plan(String text) {
        return new Expansion(TestWorld.TRUTH).expand(read(text), BUILT_IN);
    }

    @Test
    @DisplayName("a composed entry expands per step parameter value into composed configurations named by step")
    void expands() {
        Plan p = plan(HEAD + "  - id: pc-hc\n    steps:\n      - {use: pc, with: {alpha: [0.01, 0.05]}}\n"
                + "      - {use: hill-climbing, with: {patience: 3}, given: allowed-edges}\n  - hill-climbing\n");
        assertEquals(3, p.configs().size());
        LearnerConfig c = p.configs().get(0);
        assertTrue(c.learner() instanceof ComposedLearner);
        assertEquals("pc-then-hill-climbing", c.use());
        assertEquals("pc-hc[pc.alpha=0.01]", c.label());
        assertEquals(3, c.values().getInt("hill-climbing.patience"));
        assertTrue(c.canonical().contains("#pc > allowed-edges > hill-climbing"), c.canonical());
        assertEquals("pc-hc[pc.alpha=0.05]", p.configs().get(1).label());
    }

    @Test
    @DisplayName("GES can be given the step before's graph as its start: a study entry pc > start-graph > ges expands")
    void gesTakesAStartGraph() {
        Plan p = plan(HEAD + "  - id: pc-ges\n    steps:\n      - {use: pc}\n      - {use: ges, given: start-graph}\n");
        LearnerConfig c = p.configs().get(0);
        assertEquals("pc-then-ges", c.use());
        assertTrue(c.canonical().contains("#pc > start-graph > ges"), c.canonical());
    }

    @Test
    @DisplayName("the study as written back reads again into the same entries and run keys")
    void roundTrips() {
        String text = HEAD + "  - id: pc-hc\n    knowledge: tiers\n    steps:\n      - {use: pc, with: {alpha: [0.01, 0.05]}}\n"
                + "      - {use: hill-climbing, given: start-graph}\n";
        Plan first = plan(text);
        Plan again = plan(StudyWriter.yaml(first.study()));
        LearnerEntry a = first.study().learners().get(0);
        LearnerEntry b = again.study().learners().get(0);
        assertEquals(a.steps(), b.steps());
        assertEquals(a.knowledge(), b.knowledge());
        assertEquals(first.runs().stream().map(RunDefinition::key).toList(),
                again.runs().stream().map(RunDefinition::key).toList());
    }

    @Test
    @DisplayName("the hand-on is part of what defines a run: the same steps given differently are different configurations")
    void handOnDefinesTheRun() {
        Plan p = plan(HEAD + "  - id: a\n    steps: [{use: hill-climbing}, {use: hill-climbing, given: allowed-edges}]\n"
                + "  - id: b\n    steps: [{use: hill-climbing}, {use: hill-climbing, given: start-graph}]\n");
        assertTrue(!p.runs().get(0).key().equals(p.runs().get(1).key()));
    }

    /** (case, entry text, field expected, line expected, words the message must contain). */
    static Stream<Arguments> malformed() {
        return Stream.of(
                Arguments.of("hand-on the receiver does not honour", "  - id: x\n    steps:\n      - {use: pc}\n"
                                + "      - {use: direct-lingam, given: allowed-edges}\n", "learners[0].steps[1].given", 11,
                        new String[] {"learner direct-lingam does not honour forbidden edges"}),
                Arguments.of("required edges from a CPDAG", "  - id: x\n    steps:\n      - {use: pc}\n"
                                + "      - {use: hill-climbing, given: required-edges}\n", "learners[0].steps[1].given", 11,
                        new String[] {"pc returns a cpdag", "only directed edges"}),
                Arguments.of("start graph to a learner without one", "  - id: x\n    steps:\n      - {use: pc}\n"
                                + "      - {use: direct-lingam, given: start-graph}\n", "learners[0].steps[1].given", 11,
                        new String[] {"learner direct-lingam cannot start from a given graph"}),
                Arguments.of("unknown hand-on", "  - id: x\n    steps:\n      - {use: pc}\n"
                                + "      - {use: ges, given: skeleton}\n", "learners[0].steps[1].given", 11,
                        new String[] {"unknown hand-on 'skeleton'", "allowed: allowed-edges, required-edges, start-graph"}),
                Arguments.of("first step given something", "  - id: x\n    steps:\n      - {use: pc, given: allowed-edges}\n"
                                + "      - {use: ges, given: allowed-edges}\n", "learners[0].steps[0].given", 10,
                        new String[] {"the first step receives nothing"}),
                Arguments.of("later step without a hand-on", "  - id: x\n    steps:\n      - {use: pc}\n"
                                + "      - {use: ges}\n", "learners[0].steps[1].given", 11,
                        new String[] {"must say how it is given", "allowed: allowed-edges"}),
                Arguments.of("a single step", "  - id: x\n    steps:\n      - {use: pc}\n", "learners[0].steps", 10,
                        new String[] {"at least two steps"}),
                Arguments.of("use beside steps", "  - id: x\n    use: pc\n    steps:\n      - {use: pc}\n"
                                + "      - {use: ges, given: allowed-edges}\n", "learners[0].use", 9,
                        new String[] {"unknown field"}),
                Arguments.of("unknown step parameter", "  - id: x\n    steps:\n      - {use: pc, with: {alfa: 0.1}}\n"
                                + "      - {use: ges, given: allowed-edges}\n", "learners[0].steps[0].with.alfa", 10,
                        new String[] {"unknown parameter 'alfa' of learner pc"}),
                Arguments.of("unknown step learner", "  - id: x\n    steps:\n      - {use: pcc}\n"
                                + "      - {use: ges, given: allowed-edges}\n", "learners[0].steps[0].use", 10,
                        new String[] {"unknown learner 'pcc'"}),
                Arguments.of("tiers a step does not honour", "  - id: x\n    knowledge: tiers\n    steps:\n"
                                + "      - {use: direct-lingam}\n      - {use: hill-climbing, given: allowed-edges}\n",
                        "learners[0].knowledge", 9, new String[] {"does not honour tiers"}));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("malformed")
    @DisplayName("a malformed composed entry is refused with file, line, field and what is allowed")
    void refused(String name, String entry, String field, int line, String[] words) {
        StudyException e = assertThrows(StudyException.class, () -> plan(HEAD + entry), name);
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
    @DisplayName("a composed entry's steps are the catalogue's learners, in the order written")
    void stepsUseCatalogueLearners() {
        Plan p = plan(HEAD + "  - id: x\n    steps: [{use: pc}, {use: ges, given: allowed-edges}]\n");
        ComposedLearner c = (ComposedLearner) p.configs().get(0).learner();
        assertEquals(List.of("pc", "ges"), c.steps().stream().map(s -> s.learner().description().id()).toList());
    }
}
