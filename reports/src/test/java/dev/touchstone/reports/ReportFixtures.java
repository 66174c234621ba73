package dev.touchstone.reports;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RankingResult;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.metrics.results.Timings;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Synthetic, fully deterministic study results for report tests (values invented for the test). */
final class ReportFixtures {

    static final List<String> METRICS = List.of("shd", "adjacency_f1", "seconds");

    private ReportFixtures() {
    }

    /** Mean-only summary: keeps the fixtures independent of the bootstrap. */
    static Summary meanOnly(List<Double> values) {
        if (values.isEmpty()) {
            return Summary.EMPTY;
        }
        double m = values.stream().mapToDouble(Double::doubleValue).average().getAsDouble();
        return new Summary(values.size(), m, null, Summary.Interval.UNDEFINED, Summary.Quartiles.UNDEFINED);
    }

    /**
     * Two graph sizes × two sample sizes × two replicates × three configurations; the
     * configuration {@code broken} fails everywhere when {@code brokenFails}.
     */
    static ReportData.Builder study(boolean brokenFails, boolean undefinedF1) {
        List<RunResult> runs = new ArrayList<>();
        List<AggregateRow> rows = new ArrayList<>();
        String[] configs = {"alpha", "beta", "broken"};
        int k = 0;
        for (String nodes : List.of("10", "20")) {
            for (String samples : List.of("100", "1000")) {
                Setting s = Setting.of("nodes", nodes, "samples", samples);
                for (String c : configs) {
                    List<Double> shd = new ArrayList<>();
                    for (int rep = 0; rep < 2; rep++) {
                        boolean fail = brokenFails && c.equals("broken");
                        Map<String, Double> m = new LinkedHashMap<>();
                        double base = (c.equals("alpha") ? 2 : 4) + rep + Integer.parseInt(nodes) / 10.0;
                        if (!fail) {
                            m.put("shd", base);
                            m.put("adjacency_f1", undefinedF1 && c.equals("beta") ? null : 1.0 / base);
                            m.put("adjacency_precision", 0.9 - 0.1 * base / 10);
                            m.put("adjacency_recall", 0.8 - 0.05 * base / 10);
                            shd.add(base);
                        }
                        runs.add(RunResult.builder().key("k" + (k++)).setting(s).replicate(rep).configurationId(c)
                                .learnerId(c.equals("broken") ? "empty" : "learner-" + c)
                                .parameters(Map.of("alpha", "0.05")).seed(7)
                                .status(fail ? RunStatus.FAILED : RunStatus.OK)
                                .message(fail ? "boom: singular matrix" : null)
                                .estimateClass(fail ? null : GraphClass.CPDAG)
                                .scoredAgainst(fail ? null : GraphClass.CPDAG).metrics(m)
                                .timings(new Timings(fail ? null : 0.01 * Integer.parseInt(nodes), null, null, 10L, 0L))
                                .build());
                    }
                    int ok = shd.size();
                    rows.add(AggregateRow.builder().setting(s).configurationId(c)
                            .learnerId(c.equals("broken") ? "empty" : "learner-" + c).metric("shd").okRuns(ok)
                            .failedRuns(2 - ok).skippedRuns(0).summary(meanOnly(shd)).build());
                    rows.add(AggregateRow.builder().setting(s).configurationId(c)
                            .learnerId(c.equals("broken") ? "empty" : "learner-" + c).metric("seconds").okRuns(ok)
                            .failedRuns(2 - ok).skippedRuns(0)
                            .summary(meanOnly(ok == 0 ? List.of() : List.of(0.01 * Integer.parseInt(nodes))))
                            .build());
                }
            }
        }
        Setting s = Setting.of("nodes", "10", "samples", "100");
        List<ComparisonRow> comparisons = List.of(
                ComparisonRow.builder().setting(s).metric("shd").configurationId("beta").referenceId("alpha")
                        .pairs(2).meanDifference(2.0).low(1.5).high(2.5).pValue(0.5).pHolm(0.5).wins(0).ties(0)
                        .losses(2).build());
        List<RankingResult> rankings = List.of(RankingResult.builder().metric("shd")
                .configurations(List.of("alpha", "beta")).meanRanks(List.of(1.0, 2.0)).settingsUsed(4)
                .settingsDropped(0).friedmanChiSquare(4.0).degreesOfFreedom(1).friedmanPValue(0.0455).alpha(0.05)
                .criticalDifference(0.98).build());
        List<String> names = List.of("A", "B", "C");
        Graph truth = Graph.builder(names).addDirected(0, 1).addDirected(1, 2).freeze();
        Graph estimate = Graph.builder(names).addUndirected(0, 1).addDirected(0, 2).freeze();
        return ReportData.builder("fixture-study").description("Invented results for testing the report.")
                .metrics(METRICS).direction("shd", false).direction("adjacency_f1", true).direction("seconds", false)
                .reference("alpha").runs(runs).summary(rows).comparisons(comparisons).rankings(rankings)
                .audits(List.of(new ReportData.Audit(s, 0.97, 0.71)))
                .examples(List.of(new ReportData.Example("replicate 0, alpha", truth, estimate)))
                .provenance(Map.of("tool", "touchstone test")).summarizer(ReportFixtures::meanOnly)
                .scaleBaselines(java.util.Set.of("empty"));
    }
}
