package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GraspLearnerTest {

    private static final GraspLearner GRASP = new GraspLearner();

    @Test
    @DisplayName("oracle: GRaSP returns the true CPDAG on at least 199 of 200 seeded random DAGs of mean degree 2 to 6;"
            + " the miss scores above the truth (Lam, Andrews and Ramsey 2022 report GRaSP exact with the oracle"
            + " also on dense graphs where greedy search struggles, from memory)")
    void oracleRecoversTheTrueCpdag() {
        BossLearnerTest.OracleOutcome out = BossLearnerTest.oracleCheck(GRASP, Map.of(), 1, 200);
        // Measured with the default depth 4: 199 of 200 exact. The miss is seed 62, whose truth is
        // not the oracle BIC's optimum (a true edge's partial correlation is below what 10^9 rows
        // resolve; BOSS and GES return the same graph, 9.5 above the truth). Depth 3 also missed
        // seeds 19 and 169 by one extra edge each.
        assertTrue(out.inexact().size() <= 1, out.inexact().size() + " not exact:\n" + String.join("\n", out.inexact()));
        assertTrue(out.belowTruth().isEmpty(), "below the truth's score: " + out.belowTruth());
    }

    @Test
    @DisplayName("oracle, 60 truths: the tiers nest as the paper orders them, GRaSP0 ≥ GRaSP1 ≥ GRaSP2 in misses at depth 4"
            + " (Lam, Andrews and Ramsey 2022, from memory)")
    void tiersNest() {
        int covered = BossLearnerTest.oracleCheck(GRASP, Map.of("tucks", "covered"), 1, 60).inexact().size();
        int singular = BossLearnerTest.oracleCheck(GRASP, Map.of("tucks", "singular"), 1, 60).inexact().size();
        int all = BossLearnerTest.oracleCheck(GRASP, Map.of("tucks", "all"), 1, 60).inexact().size();
        // measured: 12, 12 and 1 misses; covered tucks alone (the moves of Solus, Wang and Uhler's
        // relaxations) get stuck more often, as the paper reports for its lowest tier
        assertTrue(covered >= singular && singular >= all && covered > all,
                "misses: covered " + covered + ", singular " + singular + ", all " + all);
    }

    @Test
    @DisplayName("a tuck moves y before x with y's ancestors in between and keeps the rest in order"
            + " (the definition of Lam, Andrews and Ramsey 2022, worked by hand, from memory)")
    void tuckByHand() {
        // truth a → b, b → c, a → c with the oracle; order (a, b, c) induces exactly that DAG
        MutableGraph g = Graph.builder(List.of("a", "b", "c", "d"));
        g.addDirected(0, 1);
        g.addDirected(1, 2);
        g.addDirected(0, 2);
        g.addDirected(2, 3);
        Graph truth = g.freeze();
        CovarianceMatrix sigma = PopulationCovariance.of(truth, 0.5, 2.0, 5);
        LocalScore score = BicScore.of(sigma, 1.0);
        OrderScorer scorer = new OrderScorer(score, KnowledgeIndex.of(Knowledge.none(), truth.names()), -1);
        GraspSearch.State s = GraspSearch.State.of(scorer, new int[] {0, 1, 2, 3});
        assertArrayEquals(new int[] {0, 1}, s.parents[2]);
        // tuck of a → c: b is an ancestor of c between them, so it comes along: (b, c, a, d)
        GraspSearch.State t = s.tuck(scorer, 0, 2, s.ancestorsBetween(0, 2));
        assertArrayEquals(new int[] {1, 2, 0, 3}, t.order);
        // tuck of b → c: nothing between them, a single variable moves: (a, c, b, d); a → b and b → c are
        // covered (c's parents are b's and b), a → c and c → d are not
        GraspSearch.State u = s.tuck(scorer, 1, 2, s.ancestorsBetween(1, 2));
        assertArrayEquals(new int[] {0, 2, 1, 3}, u.order);
        assertTrue(s.covered(0, 1));
        assertTrue(s.covered(1, 2));
        assertFalse(s.covered(0, 2));
        assertFalse(s.covered(2, 3));
        // the complete DAG on {a, b, c} keeps its score under every order of them (Chickering 1995)
        assertEquals(0.0, t.delta, GrowShrinkTree.tolerance(t.scale));
        assertEquals(s.total, t.total, 1e-6 * Math.abs(s.total));
    }

    @Test
    @DisplayName("from 5,000 rows of the sprinkler network GRaSP finds its CPDAG, with BIC and with EBIC")
    void sprinklerFromData() {
        Graph truth = HillClimbLearnerTest.sprinkler();
        DataSet data = ScoreData.linearGaussian(truth, 5000, 17);
        assertEquals(Cpdags.of(truth), BossLearnerTest.run(GRASP, LearnerInput.of(data), Knowledge.none(), Map.of(), 1).graph());
        assertEquals(Cpdags.of(truth), BossLearnerTest.run(GRASP, LearnerInput.of(data), Knowledge.none(),
                Map.of("score", "ebic"), 1).graph());
    }

    @Test
    @DisplayName("discrete data with BDeu: finds the equivalence class of the binary sprinkler network")
    void discreteWithBdeu() {
        Graph truth = HillClimbLearnerTest.sprinkler();
        DataSet data = ScoreData.binary(truth, 20000, 4);
        Graph got = BossLearnerTest.run(GRASP, LearnerInput.of(data), Knowledge.none(),
                Map.of("score", "bdeu", "equivalent_sample_size", 10.0), 1).graph();
        assertEquals(Cpdags.of(truth), got);
    }

    @Test
    @DisplayName("the same seed gives the same graph; starts are seeded from the run context")
    void seeded() {
        DataSet data = ScoreData.linearGaussian(30, 3.0, 500, 9);
        Graph a = BossLearnerTest.run(GRASP, LearnerInput.of(data), Knowledge.none(), Map.of("starts", 2), 1).graph();
        Graph b = BossLearnerTest.run(GRASP, LearnerInput.of(data), Knowledge.none(), Map.of("starts", 2), 1).graph();
        assertEquals(a, b);
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
        for (int starts : new int[] {1, 4}) {
            Graph got = BossLearnerTest.run(GRASP, LearnerInput.of(new Oracle(truth, sigma)), k, Map.of("starts", starts), 1).graph();
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

    @Test
    @DisplayName("a run context's deadline stops the search")
    void deadline() {
        DataSet data = ScoreData.linearGaussian(40, 4.0, 500, 3);
        var values = dev.touchstone.core.param.ParameterValues.resolve("test", GRASP.description().parameters(), Map.of());
        RunContext ctx = RunContext.of(1, java.time.Duration.ZERO, 1);
        org.junit.jupiter.api.Assertions.assertThrows(dev.touchstone.core.learner.DeadlineExceededException.class,
                () -> GRASP.learn(LearnerInput.of(data), Knowledge.none(), values, ctx));
    }
}
