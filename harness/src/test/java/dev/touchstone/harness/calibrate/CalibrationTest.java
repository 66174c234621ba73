package dev.touchstone.harness.calibrate;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.SimulatedTruth;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.execution.Progress;
import dev.touchstone.metrics.scoring.Scorer;
import dev.touchstone.metrics.truth.TruthSelection;
import dev.touchstone.reports.calibration.CalibrationView;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CalibrationTest {

    static CalibrationSettings.Choice choice(String id) {
        Learner l = LearnerCatalog.builtIn().find(id).learner();
        return new CalibrationSettings.Choice(l, ParameterValues.resolve(id, l.description().parameters(), Map.of()));
    }

    static SimulatedTruth truth(long seed, int nodes) {
        return Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", nodes, "mean_degree", 2.0))
                .model(ModelKinds.byId("linear-gaussian"), Map.of())
                .build().drawTruth(seed);
    }

    static double actual(Learner learner, DataSet data, Graph dag, String metric) {
        Estimate e = learner.learn(LearnerInput.of(data), Knowledge.none(),
                ParameterValues.resolve("x", learner.description().parameters(), Map.of()), RunContext.unlimited(1));
        return Scorer.score(TruthSelection.forEstimate(dag, e.graphClass()), e.graph(), e.graphClass(),
                List.of(metric)).get(metric);
    }

    /**
     * The check of the issue: data simulated from a known truth; the calibration (truth graph
     * learned from those data by GES, as an analyst without a graph would do) must bracket the
     * learner's actual score on the data. Tolerance: the 10th–90th percentile range of the
     * calibrated replicates widened by 0.1, in at least 4 of 5 truths (each range covers about
     * 80% of replicates by construction; the widening allows for the fitted truth not being
     * the real one). Seeded; common practice for checking a simulation-based prediction.
     */
    @Test
    @DisplayName("calibrated expectations bracket the learner's actual adjacency and orientation F1 on data from a"
            + " known truth")
    void bracketsActualPerformance() {
        CalibrationSettings.Choice pc = choice("pc");
        List<String> metrics = List.of("adjacency_f1", "orientation_f1");
        int[] bracketed = new int[metrics.size()];
        List<String> report = new ArrayList<>();
        for (long seed = 1; seed <= 5; seed++) {
            SimulatedTruth t = truth(seed, 10);
            DataSet data = t.sample(300).data();
            Graph learned = TruthGraphs.learned(choice("ges"), data, seed, null);
            CalibrationSettings s = CalibrationSettings.builder(List.of(pc), List.of(300)).replicates(20).variants(3)
                    .seed(seed).threads(2).limit(Duration.ofSeconds(60)).build();
            CalibrationOutcome o = Calibration.run(data, learned, s, Progress.quiet());
            for (int m = 0; m < metrics.size(); m++) {
                double actual = actual(pc.learner(), data, t.dag(), metrics.get(m));
                double[] v = CalibrationSummary.values(o, "pc", metrics.get(m), 300, false);
                double low = v[(int) Math.floor(0.1 * (v.length - 1))];
                double high = v[(int) Math.ceil(0.9 * (v.length - 1))];
                bracketed[m] += actual >= low - 0.1 && actual <= high + 0.1 ? 1 : 0;
                report.add(String.format("seed %d %s: actual %.3f, calibrated [%.3f, %.3f]", seed, metrics.get(m),
                        actual, low, high));
            }
        }
        for (int m = 0; m < metrics.size(); m++) {
            assertTrue(bracketed[m] >= 4, String.join("; ", report));
        }
    }

    @Test
    @DisplayName("results, estimates and bootstrap frequencies are the same for a seed with 1 or 2 threads;"
            + " bootstrap frequencies of another seed agree within 0.35 (stable in expectation)")
    void reproducible() {
        SimulatedTruth t = truth(9, 7);
        DataSet data = t.sample(250).data();
        List<CalibrationSettings.Choice> learners = List.of(choice("pc"), choice("ges"));
        CalibrationOutcome one = Calibration.run(data, t.dag(), CalibrationSettings.builder(learners, List.of(125, 250))
                .replicates(4).variants(1).bootstrap(30).seed(5).threads(1).build(), Progress.quiet());
        CalibrationOutcome two = Calibration.run(data, t.dag(), CalibrationSettings.builder(learners, List.of(125, 250))
                .replicates(4).variants(1).bootstrap(30).seed(5).threads(2).build(), Progress.quiet());
        assertEquals(one.runs().size(), two.runs().size());
        for (int i = 0; i < one.runs().size(); i++) {
            assertEquals(one.runs().get(i).result().metrics(), two.runs().get(i).result().metrics());
            assertEquals(one.runs().get(i).estimate(), two.runs().get(i).estimate());
        }
        CalibrationView a = CalibrationSummary.view(one, "t", List.of(), List.of(), null);
        CalibrationView b = CalibrationSummary.view(two, "t", List.of(), List.of(), null);
        assertEquals(a.edges(), b.edges());
        CalibrationOutcome other = Calibration.run(data, t.dag(), CalibrationSettings.builder(learners, List.of(125, 250))
                .replicates(4).variants(1).bootstrap(30).seed(6).threads(2).build(), Progress.quiet());
        CalibrationView c = CalibrationSummary.view(other, "t", List.of(), List.of(), null);
        int compared = 0;
        for (CalibrationView.EdgeRow e : a.edges()) {
            if (!e.inTruth()) {
                continue;
            }
            for (CalibrationView.EdgeRow f : c.edges()) {
                if (f.inTruth() && f.learner().equals(e.learner()) && f.from().equals(e.from())
                        && f.to().equals(e.to())) {
                    assertEquals(e.bootstrapAdjacent(), f.bootstrapAdjacent(), 0.35, e.toString());
                    compared++;
                }
            }
        }
        assertEquals(2 * t.dag().edgeCount(), compared);
    }

    @Test
    @DisplayName("a bootstrap resample draws n rows with replacement, deterministic in its seed")
    void resample() {
        DataSet data = truth(2, 4).sample(100).data();
        DataSet r1 = Calibration.resample(data, 3);
        DataSet r2 = Calibration.resample(data, 3);
        assertEquals(100, r1.rows());
        for (int r = 0; r < 100; r++) {
            assertEquals(r1.value(r, 0), r2.value(r, 0));
        }
        // With replacement: the expected share of distinct rows is 1 − (1 − 1/n)^n ≈ 0.634 (Efron and
        // Tibshirani 1993, ch. 6).
        java.util.Set<Double> distinct = new java.util.HashSet<>();
        for (int r = 0; r < 100; r++) {
            distinct.add(r1.value(r, 0));
        }
        assertTrue(distinct.size() > 50 && distinct.size() < 78, "distinct " + distinct.size());
    }
}
