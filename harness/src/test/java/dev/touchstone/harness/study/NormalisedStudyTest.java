package dev.touchstone.harness.study;

import dev.touchstone.harness.outside.LearnerSources;
import dev.touchstone.harness.outside.LearnersFile;
import dev.touchstone.harness.testing.TestWorld;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The normalised study text ({@link StudyWriter}) and the plan's outline hash, which together
 * let a resume recognise a finished study without building its runs: the text of every bundled
 * study reads back to the same runs and to the same text again, and equal outline hashes go
 * with equal run keys (and unequal with unequal) over studies that differ in each part a key
 * is made of.
 */
class NormalisedStudyTest {

    private static final Path ROOT = Path.of("..").toAbsolutePath().normalize();
    private static final GeneratorTruthCatalog TRUTH = new GeneratorTruthCatalog();
    private static final LearnerSources SOURCES = LearnerSources.gather(NormalisedStudyTest.class.getClassLoader(),
            null, LearnersFile.read(ROOT.resolve("examples/adapters/learners.yaml")), "learners.yaml");

    private static Plan plan(Study study) {
        return new Expansion(TRUTH, SOURCES::fingerprint).expand(study, SOURCES.catalog());
    }

    private static StudyReader reader() {
        return new StudyReader(TRUTH, SOURCES.catalog(), new RegistryMetricCatalog());
    }

    private static List<Path> bundled() throws IOException {
        List<Path> files = new ArrayList<>();
        for (Path dir : List.of(ROOT.resolve("scenarios"), ROOT.resolve("scenarios/reproductions"))) {
            try (Stream<Path> s = Files.list(dir)) {
                s.filter(p -> p.toString().endsWith(".yaml")).sorted().forEach(files::add);
            }
        }
        return files;
    }

    @Test
    @DisplayName("every bundled study's normalised text reads back to the same runs, outline and text")
    void bundledStudiesReadBack() throws IOException {
        List<Path> files = bundled();
        assertTrue(files.size() > 10, "the bundled studies were found: " + files);
        for (Path f : files) {
            Plan first = plan(reader().read(f));
            String text = StudyWriter.yaml(first.study());
            Plan again = plan(reader().read(NodeReader.read("study.yaml", text, false)));
            assertEquals(first.hash(), again.hash(), f + ": same run keys\n" + text);
            assertEquals(first.outlineHash(), again.outlineHash(), f.toString());
            assertEquals(text, StudyWriter.yaml(again.study()), f + ": the normalised text is a fixed point");
        }
    }

    @Test
    @DisplayName("equal outline hashes exactly when the run keys are equal, over a change of each part of a key")
    void outlineFollowsKeys() {
        String base = "name: tiny\nseed: 7\nreplicates: 3\n"
                + "truth:\n  graph: {family: [chain, star], nodes: [4, 6]}\n  model: {kind: linear-gaussian}\n"
                + "samples: [30, 200, oracle]\n"
                + "learners:\n  - {id: empty, use: empty-test, with: {alpha: [0.01, 0.05]}}\n"
                + "  - {id: skel, use: skeleton-test}\n"
                + "metrics: [shd, edges, tests, seconds]\ncompare_to: skel\n";
        List<String> studies = List.of(base,
                base.replace("name: tiny", "name: other"),
                base.replace("compare_to: skel\n", ""),
                base.replace("seed: 7", "seed: 8"),
                base.replace("replicates: 3", "replicates: 4"),
                base.replace("[chain, star]", "[star, chain]"),
                base.replace("nodes: [4, 6]", "nodes: [4, 7]"),
                base.replace("[30, 200, oracle]", "[30, 200]"),
                base.replace("alpha: [0.01, 0.05]", "alpha: [0.01, 0.06]"),
                base.replace("[shd, edges, tests, seconds]", "[shd, edges, seconds]"),
                base + "limits: {seconds: 30}\n");
        List<Plan> plans = studies.stream().map(TestWorld::plan).toList();
        for (int i = 0; i < plans.size(); i++) {
            for (int j = 0; j < plans.size(); j++) {
                Plan a = plans.get(i);
                Plan b = plans.get(j);
                assertEquals(a.hash().equals(b.hash()), a.outlineHash().equals(b.outlineHash()),
                        "studies " + i + " and " + j);
            }
        }
        assertEquals(plans.get(0).outlineHash(), plans.get(1).outlineHash(), "the name is in no key");
        assertNotEquals(StudyWriter.yaml(plans.get(0).study()), StudyWriter.yaml(plans.get(1).study()),
                "but it is in the study text, which the finished marker compares as well");
        assertNotEquals(plans.get(0).outlineHash(), plans.get(3).outlineHash(), "the seed is");
    }

    @Test
    @DisplayName("the outline and the run count need no runs; the runs are built once, when asked for")
    void runsBuiltOnDemand() {
        Plan p = TestWorld.plan("name: t\nseed: 1\nreplicates: 5\ntruth:\n  graph: {family: chain, nodes: 4}\n"
                + "  model: {kind: linear-gaussian}\nsamples: [10, 20]\nlearners: [empty-test, skeleton-test]\n");
        p.outlineHash();
        assertEquals(20, p.runCount());
        assertFalse(p.runsBuilt());
        assertEquals(20, p.runs().size());
        assertTrue(p.runsBuilt());
        assertTrue(p.runs() == p.runs(), "built once");
        for (int i = 0; i < p.runs().size(); i++) {
            assertEquals(i, p.runs().get(i).index());
        }
    }
}
