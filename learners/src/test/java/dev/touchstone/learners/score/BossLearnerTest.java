package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.generators.SimulatedReplicate;
import org.apache.commons.statistics.inference.AlternativeHypothesis;
import org.apache.commons.statistics.inference.WilcoxonSignedRankTest;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class BossLearnerTest {

    private static final BossLearner BOSS = new BossLearner();

    static Estimate run(Learner learner, LearnerInput input, Knowledge k, Map<String, Object> raw, int threads) {
        ParameterValues values = ParameterValues.resolve("test", learner.description().parameters(), raw);
        return learner.learn(input, k, values, RunContext.of(1, Duration.ofMinutes(2), threads));
    }

    /** Outcome of the oracle check: cases not exact, and those among them where the search scored below the truth. */
    record OracleOutcome(List<String> inexact, List<String> belowTruth, List<Long> seeds) {
    }

    /**
     * Seeded Erdős–Rényi DAGs (seeds 1 to 200 make 200) of 8 to 20 nodes with mean degree 2, 3, 4, 5 and 6 (40 each in 1 to 200), given
     * as the exact covariance of a linear SEM (weights ±[0.5, 2]). A case that is not exact is also
     * scored: the oracle BIC of a DAG in the returned class against that of the true DAG.
     */
    static OracleOutcome oracleCheck(Learner learner, Map<String, Object> raw, long firstSeed, long lastSeed) {
        List<String> inexact = new ArrayList<>();
        List<String> below = new ArrayList<>();
        List<Long> seeds = new ArrayList<>();
        for (long seed = firstSeed; seed <= lastSeed; seed++) {
            int p = 8 + (int) (seed % 13);
            double degree = 2 + (seed % 5);
            Graph dag = RandomDags.erdosRenyi(p, degree, seed);
            CovarianceMatrix sigma = PopulationCovariance.of(dag, 0.5, 2.0, seed + 11);
            Estimate e = run(learner, LearnerInput.of(new Oracle(dag, sigma)), Knowledge.none(), raw, 1);
            assertEquals(GraphClass.CPDAG, e.graphClass());
            if (!e.graph().equals(Cpdags.of(dag))) {
                BicScore bic = BicScore.of(sigma, 1.0);
                double truth = ScoreTotals.of(bic, dag);
                double got = ScoreTotals.of(bic, DagExtension.of(e.graph()));
                String line = "seed " + seed + " (p=" + p + ", degree " + degree + "): " + e.graph().edgeCount()
                        + " edges over " + dag.edgeCount() + ", BIC estimate - truth = " + (got - truth);
                inexact.add(line);
                seeds.add(seed);
                if (got < truth - BossSearch.tolerance(truth)) {
                    below.add(line);
                }
            }
        }
        return new OracleOutcome(inexact, below, seeds);
    }

    @Test
    @DisplayName("oracle: BOSS returns the true CPDAG on at least 198 of 200 seeded random DAGs of mean degree 2 to 6;"
            + " with 3 starts every miss is a graph scoring at least the truth's (Andrews et al. 2023, correctness"
            + " under faithfulness, from memory; Chickering 2002 for the backward phase)")
    void oracleRecoversTheTrueCpdag() {
        OracleOutcome one = oracleCheck(BOSS, Map.of(), 1, 200);
        // Measured: 198 of 200 exact. Seed 69 (p = 12, mean degree 6) ends in a local optimum of the
        // order search (55 edges over 47) that 3 starts escape. Seed 62 returns 34 edges over 35 and
        // scores 9.5 ABOVE the truth: one true edge's partial correlation is below what the oracle's
        // 10^9 rows can see (BicScore), so the truth is not the score's optimum; GES returns the same graph.
        assertTrue(one.inexact().size() <= 2, one.inexact().size() + " not exact:\n" + String.join("\n", one.inexact()));
        for (long seed : one.seeds()) {
            OracleOutcome three = oracleCheck(BOSS, Map.of("starts", 3), seed, seed);
            assertTrue(three.belowTruth().isEmpty(), "with 3 starts still below the truth's score: " + three.belowTruth());
        }
    }

    @Test
    @DisplayName("linear Gaussian, p = 20, mean degree 2, n = 1,000, 30 paired replicates: BOSS no worse than GES in"
            + " adjacency F1 by a one-sided Wilcoxon signed-rank test at 5% (Andrews et al. 2023 report BOSS ahead,"
            + " qualitative, from memory; the test from Commons Statistics)")
    void noWorseThanGesOnSparseData() {
        int replicates = 30;
        double[] boss = new double[replicates];
        double[] ges = new double[replicates];
        for (int r = 0; r < replicates; r++) {
            SimulatedReplicate rep = ScoreData.linearGaussianReplicate(20, 2.0, 1000, 501 + r);
            Graph truth = rep.dag();
            boss[r] = adjacencyF1(truth, run(BOSS, LearnerInput.of(rep.data()), Knowledge.none(), Map.of(), 1).graph());
            ges[r] = adjacencyF1(truth, run(new GesLearner(), LearnerInput.of(rep.data()), Knowledge.none(), Map.of(), 1).graph());
        }
        // Paired because both learners see the same replicate. Signed-rank rather than a paired t test: the
        // differences of F1 are bounded, skewed and often exactly 0 (both learners right on a replicate), so
        // the t test's normal differences are not plausible, while the signed-rank test needs only symmetric
        // differences under the null (common practice). H1 of the one-sided test is "GES ahead", i.e. the
        // differences GES - BOSS have a positive location; rejecting it at 5% would contradict the paper.
        WilcoxonSignedRankTest wilcoxon = WilcoxonSignedRankTest.withDefaults();
        double gesAhead = wilcoxon.with(AlternativeHypothesis.GREATER_THAN).test(ges, boss).getPValue();
        double bossAhead = wilcoxon.with(AlternativeHypothesis.GREATER_THAN).test(boss, ges).getPValue();
        long ties = java.util.stream.IntStream.range(0, replicates).filter(r -> boss[r] == ges[r]).count();
        String figures = String.format(Locale.ROOT, "mean adjacency F1: BOSS %.3f, GES %.3f; %d of %d replicates tied;"
                + " one-sided p, GES ahead: %.2g, BOSS ahead: %.2g", mean(boss), mean(ges), ties, replicates,
                gesAhead, bossAhead);
        // measured: BOSS 0.939, GES 0.887, 10 of 30 replicates tied (zero differences, which the library's
        // default keeps in its ranking: its p-value differs from the one with them dropped); p (GES ahead) =
        // 1.0, p (BOSS ahead) = 0.00011 -- so at this size the test does reject in one direction, and the
        // check can fail
        assertTrue(gesAhead >= 0.05, "GES significantly ahead of BOSS: " + figures);
    }

    private static double mean(double[] xs) {
        double s = 0;
        for (double x : xs) {
            s += x;
        }
        return s / xs.length;
    }

    /** Adjacency F1 = 2·TP / (2·TP + FP + FN) over unordered pairs (common practice). */
    static double adjacencyF1(Graph truth, Graph estimate) {
        int tp = 0;
        int fp = 0;
        int fn = 0;
        for (int a = 0; a < truth.size(); a++) {
            for (int b = a + 1; b < truth.size(); b++) {
                boolean t = truth.adjacent(a, b);
                boolean e = estimate.adjacent(a, b);
                tp += t && e ? 1 : 0;
                fp += !t && e ? 1 : 0;
                fn += t && !e ? 1 : 0;
            }
        }
        return tp + fp + fn == 0 ? 1.0 : 2.0 * tp / (2.0 * tp + fp + fn);
    }

    @Test
    @DisplayName("results do not depend on the thread count (determinism)")
    void threadCountDoesNotMatter() {
        DataSet data = ScoreData.linearGaussian(80, 3.0, 500, 9);
        Graph one = run(BOSS, LearnerInput.of(data), Knowledge.none(), Map.of(), 1).graph();
        Graph two = run(BOSS, LearnerInput.of(data), Knowledge.none(), Map.of(), 2).graph();
        assertEquals(one, two);
    }

    @Test
    @DisplayName("from 5,000 rows of the sprinkler network BOSS finds its CPDAG, with BIC and with EBIC")
    void sprinklerFromData() {
        Graph truth = HillClimbLearnerTest.sprinkler();
        DataSet data = ScoreData.linearGaussian(truth, 5000, 17);
        assertEquals(Cpdags.of(truth), run(BOSS, LearnerInput.of(data), Knowledge.none(), Map.of(), 1).graph());
        assertEquals(Cpdags.of(truth), run(BOSS, LearnerInput.of(data), Knowledge.none(), Map.of("score", "ebic"), 1).graph());
    }

    @Test
    @DisplayName("discrete data with BDeu: finds the equivalence class of the binary sprinkler network")
    void discreteWithBdeu() {
        Graph truth = HillClimbLearnerTest.sprinkler();
        DataSet data = ScoreData.binary(truth, 20000, 4);
        Graph got = run(BOSS, LearnerInput.of(data), Knowledge.none(),
                Map.of("score", "bdeu", "equivalent_sample_size", 10.0), 1).graph();
        assertEquals(Cpdags.of(truth), got);
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
            Graph got = run(BOSS, LearnerInput.of(new Oracle(truth, sigma)), k, Map.of("starts", starts), 1).graph();
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
}
