package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

/**
 * GES on seeded linear Gaussian cases gives the same CPDAG and the same score as the search
 * before its data structures were made sparse (per-node neighbour lists instead of a p × p
 * edge table, sparse operator bookkeeping, a final sweep limited to the pairs whose rating
 * was cut by the path condition). The expected CPDAGs and scores in
 * {@code ges-recorded.txt} were produced by running the earlier search (the commit before
 * that change) with {@code -Dtouchstone.recordGes=true}; they are not hand-written.
 * Cases: classical BIC at p = 20 to 400, the extended BIC, a larger penalty, background
 * knowledge (tiers, required and forbidden edges), the repeated and turning phases, two
 * threads, and perturbed starts.
 */
class GesRecordedResultsTest {

    private static final GesLearner GES = new GesLearner();
    private static final String RESOURCE = "ges-recorded.txt";

    private record Case(String name, int p, double degree, long seed, Map<String, Object> raw, boolean knowledge,
                        int threads) {
    }

    private static List<Case> cases() {
        List<Case> out = new ArrayList<>();
        int[] sizes = {20, 50, 100, 200, 400};
        for (int p : sizes) {
            for (long seed = 1; seed <= (p <= 100 ? 3 : 1); seed++) {
                out.add(new Case("bic-p" + p + "-s" + seed, p, 2.0, 500 + p + seed, Map.of(), false, 1));
            }
        }
        out.add(new Case("bic-dense-p40", 40, 4.0, 911, Map.of(), false, 1));
        out.add(new Case("ebic-p200", 200, 2.0, 733, Map.of("score", "ebic"), false, 1));
        out.add(new Case("bic-c2-p300", 300, 2.0, 734, Map.of("penalty", 2.0), false, 2));
        out.add(new Case("knowledge-p40", 40, 2.0, 735, Map.of(), true, 1));
        out.add(new Case("knowledge-p120", 120, 2.0, 736, Map.of(), true, 2));
        out.add(new Case("variants-p30", 30, 2.0, 737,
                Map.of("repeat_phases", true, "turning_phase", true), false, 1));
        out.add(new Case("perturbed-p30", 30, 3.0, 738,
                Map.of("perturbed_starts", 3, "random_moves_per_start", 4), false, 1));
        out.add(new Case("threads-p150", 150, 3.0, 739, Map.of(), false, 2));
        return out;
    }

    /** Tiers of five variables each, every tenth pair forbidden within a tier, two required edges. */
    private static Knowledge knowledgeFor(List<String> names) {
        Knowledge.Builder b = Knowledge.builder();
        int p = names.size();
        for (int start = 0; start < p; start += p / 5) {
            b.tier(names.subList(start, Math.min(p, start + p / 5)));
        }
        for (int i = 0; i + 3 < p; i += 10) {
            b.forbid(names.get(i + 3), names.get(i));
        }
        b.require(names.get(0), names.get(p - 1));
        b.require(names.get(1), names.get(p / 2 + 1));
        return b.build();
    }

    /** The estimate on one case as text: edges "a>b" or "a-b" sorted, then the class's BIC as hex. */
    private static String run(Case c) {
        DataSet data = ScoreData.linearGaussian(c.p, c.degree, 1000, c.seed);
        Knowledge k = c.knowledge ? knowledgeFor(data.names()) : Knowledge.none();
        ParameterValues values = ParameterValues.resolve("test", GES.description().parameters(), c.raw);
        Graph g = GES.learn(LearnerInput.of(data), k, values, RunContext.of(7, null, c.threads)).graph();
        List<String> edges = new ArrayList<>();
        for (Edge e : g.edges()) {
            if (e.isUndirected()) {
                edges.add(Math.min(e.a(), e.b()) + "-" + Math.max(e.a(), e.b()));
            } else {
                int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
                edges.add(from + ">" + e.other(from));
            }
        }
        edges.sort(null);
        double penalty = ((Number) c.raw.getOrDefault("penalty", 1.0)).doubleValue();
        LocalScore bic = BicScore.of(data.covariance(), penalty);
        LocalScore local = "ebic".equals(c.raw.get("score")) ? EbicScore.of((BicScore) bic, 0.5) : bic;
        double s = ScoreTesting.dagScore(local, DagExtension.of(g));
        return String.join(" ", edges) + " | " + Double.toHexString(s);
    }

    @Test
    @DisplayName("on 19 seeded cases (BIC p = 20 to 400, EBIC, penalty 2, knowledge, variants, threads) GES returns"
            + " the CPDAG and score recorded by running the search before its sparse rewrite")
    void sameResultsAsTheRecordedSearch() throws IOException {
        Map<String, String> got = new LinkedHashMap<>();
        for (Case c : cases()) {
            got.put(c.name, run(c));
        }
        if (Boolean.getBoolean("touchstone.recordGes")) {
            StringBuilder sb = new StringBuilder();
            got.forEach((name, line) -> sb.append(name).append(" :: ").append(line).append('\n'));
            Files.writeString(Path.of("src/test/resources/dev/touchstone/learners/score", RESOURCE), sb.toString());
            return;
        }
        Map<String, String> recorded = new LinkedHashMap<>();
        try (InputStream in = GesRecordedResultsTest.class.getResourceAsStream(RESOURCE)) {
            assertNotNull(in, "missing " + RESOURCE);
            for (String line : new String(in.readAllBytes(), StandardCharsets.UTF_8).split("\n")) {
                int at = line.indexOf(" :: ");
                recorded.put(line.substring(0, at), line.substring(at + 4));
            }
        }
        assertEquals(recorded.keySet(), got.keySet());
        for (String name : recorded.keySet()) {
            assertEquals(recorded.get(name), got.get(name), name);
        }
    }
}
