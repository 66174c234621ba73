package dev.touchstone.harness.execution;

import dev.touchstone.metrics.aggregate.Aggregator;
import dev.touchstone.metrics.compare.PairedComparison;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.harness.study.ExtraMetric;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Summaries and paired comparisons from the metrics module (seeded bootstrap, Wilcoxon, Holm).
 * The metrics module knows its own metrics only; an extra metric of a study's
 * {@code score_against} ({@code shd_vs_cpdag}) is summarised as its base metric on runs whose
 * values are those against that class, and the rows are renamed back. Cost: one pass of the
 * metrics module per extra class.
 */
public final class MetricsAggregator implements dev.touchstone.harness.execution.Aggregator {

    @Override
    public List<AggregateRow> summarise(List<RunResult> runs, List<String> metrics, long seed) {
        List<AggregateRow> out = new ArrayList<>(Aggregator.aggregate(runs, plain(metrics), seed));
        extras(metrics).forEach((against, bases) -> {
            for (AggregateRow a : Aggregator.aggregate(asBase(runs, against), bases, seed)) {
                out.add(new AggregateRow(a.setting(), a.configurationId(), a.learnerId(),
                        new ExtraMetric(a.metric(), against).name(), a.okRuns(), a.failedRuns(), a.skippedRuns(),
                        a.summary()));
            }
        });
        return out;
    }

    @Override
    public List<ComparisonRow> compare(List<RunResult> runs, List<String> metrics, String reference, long seed) {
        List<ComparisonRow> out = new ArrayList<>(PairedComparison.compare(runs, reference, plain(metrics), seed));
        extras(metrics).forEach((against, bases) -> {
            for (ComparisonRow c : PairedComparison.compare(asBase(runs, against), reference, bases, seed)) {
                out.add(new ComparisonRow(c.setting(), new ExtraMetric(c.metric(), against).name(),
                        c.configurationId(), c.referenceId(), c.pairs(), c.meanDifference(), c.low(), c.high(),
                        c.pValue(), c.pHolm(), c.wins(), c.ties(), c.losses()));
            }
        });
        return out;
    }

    private static List<String> plain(List<String> metrics) {
        return metrics.stream().filter(m -> ExtraMetric.parse(m) == null).toList();
    }

    /** The base metrics wanted per extra class, in order. */
    private static Map<GraphClass, List<String>> extras(List<String> metrics) {
        Map<GraphClass, List<String>> out = new LinkedHashMap<>();
        for (String m : metrics) {
            ExtraMetric x = ExtraMetric.parse(m);
            if (x != null) {
                out.computeIfAbsent(x.against(), c -> new ArrayList<>()).add(x.base());
            }
        }
        return out;
    }

    /** The runs with each {@code METRIC_vs_CLASS} value under its base name (nothing else). */
    private static List<RunResult> asBase(List<RunResult> runs, GraphClass against) {
        List<RunResult> out = new ArrayList<>(runs.size());
        for (RunResult r : runs) {
            Map<String, Double> m = new LinkedHashMap<>();
            r.metrics().forEach((name, v) -> {
                ExtraMetric x = ExtraMetric.parse(name);
                if (x != null && x.against() == against) {
                    m.put(x.base(), v);
                }
            });
            out.add(new RunResult(r.key(), r.setting(), r.replicate(), r.configurationId(), r.learnerId(),
                    r.parameters(), r.seed(), r.status(), r.message(), r.estimateClass(), r.scoredAgainst(), m,
                    r.timings()));
        }
        return out;
    }
}
