package dev.touchstone.harness.execution;

import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;

import java.util.List;

/**
 * Turns run results into the summary and comparison rows. Implemented over the metrics
 * module's aggregation and paired statistics; the harness only arranges and writes them.
 */
public interface Aggregator {

    /** One row per setting × configuration × metric; {@code seed} drives the bootstrap. */
    List<AggregateRow> summarise(List<RunResult> runs, List<String> metrics, long seed);

    /** Paired comparisons of every configuration with {@code referenceConfiguration}, per setting and metric. */
    List<ComparisonRow> compare(List<RunResult> runs, List<String> metrics, String referenceConfiguration, long seed);
}
