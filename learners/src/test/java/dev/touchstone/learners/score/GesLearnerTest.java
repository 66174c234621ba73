package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GesLearnerTest {

    private static final GesLearner GES = new GesLearner();

    private static Estimate run(LearnerInput input, Knowledge k, Map<String, Object> raw, int threads) {
        ParameterValues values = ParameterValues.resolve("test", GES.description().parameters(), raw);
        return GES.learn(input, k, values, RunContext.of(1, Duration.ofMinutes(2), threads));
    }

    private static Graph cpdagOfTruth(Graph dag) {
        return Cpdags.of(dag);
    }

    @Test
    @DisplayName("with the exact population covariance GES returns the true CPDAG on 120 seeded random sparse DAGs"
            + " of 2 to 20 nodes (Chickering 2002, theorem 4 with a consistent score)")
    void oracleReturnsTheTrueCpdag() {
        List<String> failures = new ArrayList<>();
        int checked = 0;
        for (long seed = 1; seed <= 120; seed++) {
            int p = 2 + (int) (seed % 19);
            double degree = 1.0 + (seed % 4) * 0.5;
            Graph dag = RandomDags.erdosRenyi(p, degree, seed);
            CovarianceMatrix sigma = PopulationCovariance.of(dag, 0.5, 2.0, seed + 7);
            Estimate e = run(LearnerInput.of(new Oracle(dag, sigma)), Knowledge.none(), Map.of(), 1);
            assertEquals(GraphClass.CPDAG, e.graphClass());
            Graph got = e.graph();
            Graph extension = DagExtension.of(got);
            boolean equivalent = extension != null && Equivalence.markovEquivalent(dag, extension);
            boolean exact = got.equals(cpdagOfTruth(dag));
            if (!equivalent || !exact) {
                failures.add("seed " + seed + " (p=" + p + "): truth " + dag + " | got " + got);
            }
            checked++;
        }
        assertEquals(120, checked);
        assertTrue(failures.isEmpty(), failures.size() + " failures:\n" + String.join("\n", failures));
    }

    @Test
    @DisplayName("results do not depend on the thread count")
    void threadCountDoesNotMatter() {
        Graph dag = RandomDags.erdosRenyi(40, 2.0, 5);
        DataSet data = ScoreData.linearGaussian(dag, 500, 3);
        Graph one = run(LearnerInput.of(data), Knowledge.none(), Map.of(), 1).graph();
        Graph two = run(LearnerInput.of(data), Knowledge.none(), Map.of(), 2).graph();
        assertEquals(one, two);
    }

    @Test
    @DisplayName("from 5,000 rows of the sprinkler network GES finds its CPDAG (Chickering 2002, large-sample behaviour)")
    void sprinklerFromData() {
        Graph truth = HillClimbLearnerTest.sprinkler();
        DataSet data = ScoreData.linearGaussian(truth, 5000, 17);
        assertEquals(cpdagOfTruth(truth), run(LearnerInput.of(data), Knowledge.none(), Map.of(), 1).graph());
    }

    @Test
    @DisplayName("discrete data with BDeu: finds the equivalence class of a small binary chain-and-collider model")
    void discreteWithBdeu() {
        Graph truth = HillClimbLearnerTest.sprinkler();
        DataSet data = ScoreData.binary(truth, 20000, 4);
        Graph got = run(LearnerInput.of(data), Knowledge.none(), Map.of("score", "bdeu", "equivalent_sample_size", 10.0), 1).graph();
        assertEquals(cpdagOfTruth(truth), got);
    }

    @Test
    @DisplayName("honours tiers, required and forbidden edges (oracle input)")
    void honoursKnowledge() {
        Graph truth = HillClimbLearnerTest.sprinkler();
        CovarianceMatrix sigma = PopulationCovariance.of(truth, 0.5, 2.0, 3);
        Knowledge k = Knowledge.builder()
                .tier(List.of("slippery", "wet"))
                .tier(List.of("season", "sprinkler", "rain"))
                .require("slippery", "season")
                .forbid("rain", "wet")
                .build();
        Graph got = run(LearnerInput.of(new Oracle(truth, sigma)), k, Map.of(), 1).graph();
        assertTrue(got.hasDirected(got.index("slippery"), got.index("season")), "required edge missing: " + got);
        assertFalse(got.hasDirected(got.index("rain"), got.index("wet")), "forbidden edge present: " + got);
        for (var e : got.edges()) {
            if (e.isDirected()) {
                int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
                assertFalse(k.isForbidden(got.name(from), got.name(e.other(from))), "edge against knowledge: " + got);
            } else {
                assertFalse(k.isForbidden(got.name(e.a()), got.name(e.b())) || k.isForbidden(got.name(e.b()), got.name(e.a())),
                        "undirected edge that knowledge orients: " + got);
            }
        }
    }
}
