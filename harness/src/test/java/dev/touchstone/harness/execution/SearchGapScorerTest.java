package dev.touchstone.harness.execution;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagEnumeration;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import dev.touchstone.generators.SimulatedTruth;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.learners.constraint.PcLearner;
import dev.touchstone.learners.score.BicScore;
import dev.touchstone.learners.score.ExactScoreLearner;
import dev.touchstone.learners.score.GesLearner;
import dev.touchstone.learners.score.HillClimbLearner;
import dev.touchstone.learners.score.LocalScore;
import dev.touchstone.metrics.scoring.SearchGapMeasure;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SearchGapScorerTest {

    private static ParameterValues defaults(Learner l) {
        return ParameterValues.resolve("test", l.description().parameters(), Map.of());
    }

    private static Map<String, Double> gap(Learner l, LearnerInput input, Graph truth) {
        ParameterValues v = defaults(l);
        Estimate e = l.learn(input, Knowledge.none(), v, RunContext.unlimited(1));
        return SearchGapScorer.score(l, input, v, Knowledge.none(), truth, e, Duration.ofMinutes(1));
    }

    private static double bic(LocalScore s, Graph dag) {
        double t = 0;
        for (int v = 0; v < dag.size(); v++) {
            t += s.localScore(v, dag.parents(v));
        }
        return t;
    }

    /** The number of edges on which two CPDAGs differ, by hand: one per pair with a different edge or mark. */
    private static int shdByHand(Graph a, Graph b) {
        int d = 0;
        for (int i = 0; i < a.size(); i++) {
            for (int j = i + 1; j < a.size(); j++) {
                boolean same = a.adjacent(i, j) == b.adjacent(i, j)
                        && (!a.adjacent(i, j) || a.edge(i, j).equals(b.edge(i, j)));
                d += same ? 0 : 1;
            }
        }
        return d;
    }

    @Test
    @DisplayName("on 6 seeded 5-node data sets: GES's and hill climbing's three scores equal the BIC summed by hand,"
            + " the optimum equals the maximum over all 29,281 DAGs (OEIS A003024), gap = optimum − estimate ≥ 0,"
            + " and the SHDs are those of the CPDAGs counted pair by pair")
    void scoresAgainstEnumeration() {
        List<Learner> learners = List.of(new GesLearner(), new HillClimbLearner());
        int positiveGaps = 0;
        for (long seed = 1; seed <= 6; seed++) {
            Graph truth = RandomDags.erdosRenyi(5, 3.0, seed + 40);
            DataSet data = SmallData.linearGaussian(truth, 300, seed);
            LocalScore bic = BicScore.of(data.covariance(), 1.0);
            Graph[] best = {null};
            double[] max = {Double.NEGATIVE_INFINITY};
            DagEnumeration.forEach(truth.names(), g -> {
                double s = bic(bic, g);
                if (s > max[0]) {
                    max[0] = s;
                    best[0] = g;
                }
            });
            for (Learner l : learners) {
                ParameterValues v = defaults(l);
                Estimate e = l.learn(LearnerInput.of(data), Knowledge.none(), v, RunContext.unlimited(1));
                Map<String, Double> m = SearchGapScorer.score(l, LearnerInput.of(data), v, Knowledge.none(), truth, e,
                        Duration.ofMinutes(1));
                Graph member = e.graphClass() == GraphClass.DAG ? e.graph() : DagExtension.of(e.graph());
                double est = bic(bic, member);
                String what = l.description().id() + ", seed " + seed;
                assertEquals(est, m.get("score_of_estimate"), 1e-9 * Math.abs(est), what);
                assertEquals(bic(bic, truth), m.get("score_of_truth"), 1e-9 * Math.abs(est), what);
                assertEquals(max[0], m.get("score_of_optimum"), 1e-9 * Math.abs(max[0]), what);
                assertEquals(max[0] - est, m.get("search_score_gap"), 1e-9 * Math.abs(max[0]), what);
                assertTrue(m.get("search_score_gap") >= 0, what);
                assertEquals(shdByHand(Cpdags.of(best[0]), Cpdags.of(truth)), m.get("score_shd"), what);
                assertEquals(shdByHand(Cpdags.of(member), Cpdags.of(best[0])), m.get("search_shd"), what);
                positiveGaps += m.get("search_score_gap") > 1e-6 ? 1 : 0;
            }
        }
        assertTrue(positiveGaps < 12, "every search fell short: " + positiveGaps);
    }

    @Test
    @DisplayName("the exact learner has no search gap; with the oracle the score's own error is zero on 10 faithful"
            + " random truths (BIC at 10⁹ rows: Chickering 2002, consistency)")
    void exactAndOracle() {
        List<String> misses = new ArrayList<>();
        for (long seed = 1; seed <= 10; seed++) {
            SimulatedTruth simulated = Simulation.builder()
                    .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 6, "mean_degree", 2.0))
                    .model(ModelKinds.byId("linear-gaussian"), Map.of())
                    .build().drawTruth(seed);
            Graph truth = simulated.dag();
            DataSet data = simulated.sample(500).data();
            Map<String, Double> exact = gap(new ExactScoreLearner(), LearnerInput.of(data), truth);
            assertEquals(0.0, exact.get("search_score_gap"), "seed " + seed);
            assertEquals(0.0, exact.get("search_shd"), "seed " + seed);
            CovarianceMatrix sigma = simulated.populationCovariance().orElseThrow();
            Map<String, Double> oracle = gap(new GesLearner(), LearnerInput.of(new Oracle(truth, sigma)), truth);
            if (oracle.get("score_shd") != 0.0) {
                misses.add("seed " + seed + ": " + oracle);
            }
        }
        assertTrue(misses.isEmpty(), misses.toString());
    }

    @Test
    @DisplayName("undefined (null) for a learner whose score is not known (PC), and the optimum beyond the exact"
            + " search's reach (17 variables, no parent limit)")
    void undefinedWhereNotKnown() {
        Graph truth = RandomDags.erdosRenyi(5, 2.0, 3);
        DataSet data = SmallData.linearGaussian(truth, 200, 3);
        Map<String, Double> pc = gap(new PcLearner(), LearnerInput.of(data), truth);
        for (SearchGapMeasure m : SearchGapMeasure.ALL) {
            assertNull(pc.get(m.name()), m.name());
        }
        Graph big = RandomDags.erdosRenyi(17, 1.0, 4);
        Map<String, Double> ges = gap(new GesLearner(), LearnerInput.of(SmallData.linearGaussian(big, 200, 4)), big);
        assertTrue(ges.get("score_of_estimate") != null && ges.get("score_of_truth") != null, ges.toString());
        assertNull(ges.get("score_of_optimum"));
        assertNull(ges.get("search_score_gap"));
        assertNull(ges.get("score_shd"));
    }
}
