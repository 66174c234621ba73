package dev.touchstone.harness.execution;

import dev.touchstone.metrics.aggregate.Aggregator;
import dev.touchstone.metrics.compare.PairedComparison;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;

import java.util.List;

/**
 * Summaries and paired comparisons from the metrics module (seeded bootstrap, Wilcoxon, Holm),
 * which also knows the metrics of a study's {@code score_against} ({@code shd_vs_cpdag}, via
 * {@code MetricAgainst}). Cost: that of the metrics module.
 */
public final class MetricsAggregator implements dev.touchstone.harness.execution.Aggregator {

    @Override
    public List<AggregateRow> summarise(List<RunResult> runs, List<String> metrics, long seed) {
        return Aggregator.aggregate(runs, metrics, seed);
    }

    @Override
    public List<ComparisonRow> compare(List<RunResult> runs, List<String> metrics, String reference, long seed) {
        return PairedComparison.compare(runs, reference, metrics, seed);
    }
}
