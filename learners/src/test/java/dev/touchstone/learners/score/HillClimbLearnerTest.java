package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class HillClimbLearnerTest {

    private static final HillClimbLearner LEARNER = new HillClimbLearner();

    /** Pearl's sprinkler network (Pearl, Causality, 2000, ch. 1), here with linear Gaussian mechanisms. */
    static Graph sprinkler() {
        MutableGraph g = Graph.builder(List.of("season", "sprinkler", "rain", "wet", "slippery"));
        g.addDirected(0, 1);
        g.addDirected(0, 2);
        g.addDirected(1, 3);
        g.addDirected(2, 3);
        g.addDirected(3, 4);
        return g.freeze();
    }

    private static Estimate learn(DataSet data, Knowledge k, Map<String, Object> raw, long seed) {
        ParameterValues values = ParameterValues.resolve("test", LEARNER.description().parameters(), raw);
        return LEARNER.learn(LearnerInput.of(data), k, values, RunContext.unlimited(seed));
    }

    @Test
    @DisplayName("recovers the sprinkler DAG's equivalence class from 5,000 rows (Verma and Pearl 1990 criterion)")
    void recoversSprinkler() {
        Graph truth = sprinkler();
        DataSet data = ScoreData.linearGaussian(truth, 5000, 17);
        Graph got = learn(data, Knowledge.none(), Map.of(), 1).graph();
        assertTrue(Equivalence.markovEquivalent(truth, got), "got " + got);
    }

    @Test
    @DisplayName("recovers the equivalence class of seeded random 7-node DAGs from 5,000 rows in most cases (common practice)")
    void recoversRandomDags() {
        int ok = 0;
        for (long seed = 1; seed <= 10; seed++) {
            Graph truth = RandomDags.erdosRenyi(7, 2.0, seed);
            DataSet data = ScoreData.linearGaussian(truth, 5000, seed + 100);
            Graph got = learn(data, Knowledge.none(), Map.of("perturbed_starts", 5), seed).graph();
            if (Equivalence.markovEquivalent(truth, got)) {
                ok++;
            }
        }
        assertTrue(ok >= 8, "recovered " + ok + " of 10");
    }

    @Test
    @DisplayName("honours tiers, required and forbidden edges")
    void honoursKnowledge() {
        Graph truth = sprinkler();
        DataSet data = ScoreData.linearGaussian(truth, 3000, 5);
        Knowledge k = Knowledge.builder()
                .tier(List.of("slippery", "wet"))
                .tier(List.of("season", "sprinkler", "rain"))
                .require("slippery", "season")
                .forbid("rain", "wet")
                .build();
        Graph got = learn(data, k, Map.of(), 3).graph();
        assertTrue(got.hasDirected(got.index("slippery"), got.index("season")), "required edge missing: " + got);
        assertFalse(got.hasDirected(got.index("rain"), got.index("wet")), "forbidden edge present: " + got);
        for (var e : got.edges()) {
            int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
            int to = e.other(from);
            assertFalse(k.isForbidden(got.name(from), got.name(to)), "edge against the knowledge: " + got);
        }
        assertTrue(Ancestry.isAcyclic(got));
    }

    @Test
    @DisplayName("the same seed gives the same DAG; the result is acyclic")
    void deterministic() {
        DataSet data = ScoreData.linearGaussian(RandomDags.erdosRenyi(9, 3.0, 4), 300, 8);
        Graph a = learn(data, Knowledge.none(), Map.of("perturbed_starts", 4), 11).graph();
        Graph b = learn(data, Knowledge.none(), Map.of("perturbed_starts", 4), 11).graph();
        assertTrue(a.equals(b));
        assertTrue(Ancestry.isAcyclic(a));
    }
}
