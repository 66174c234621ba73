package dev.touchstone.harness.execution;

import dev.touchstone.core.learner.Estimate;
import dev.touchstone.metrics.results.RunResult;

import java.util.Objects;

/**
 * What performing one run gave: its result (status, metrics, timings) and the estimate the
 * learner returned, kept beside the journal; the estimate is null when the run returned none
 * (skipped, failed, timed out). Executors hand these to the runner as one value, so a result
 * never reaches the journal without its estimate.
 *
 * @param result   the run's result
 * @param estimate the learner's estimate, or null
 */
public record PerformedRun(RunResult result, Estimate estimate) {

    public PerformedRun {
        Objects.requireNonNull(result, "result");
    }

    /** A run that returned no estimate. */
    public static PerformedRun without(RunResult result) {
        return new PerformedRun(result, null);
    }
}
