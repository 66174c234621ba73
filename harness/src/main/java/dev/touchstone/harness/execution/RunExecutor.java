package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.RunDefinition;

import java.util.List;
import java.util.function.Consumer;

/**
 * Performs a list of runs somewhere (threads of this JVM, tasks of a cluster) and hands
 * back each result, with the estimate the learner returned, as it finishes. The {@link StudyRunner} journals what it gets and builds
 * the tables, so every executor yields the same outputs. Implementations must not depend on
 * order for results: every seed comes from the run's coordinates.
 */
public interface RunExecutor {

    /**
     * Performs every run and hands each result to {@code sink}; returns when all are done.
     *
     * @param runs the runs, in the order to start them
     * @param rows the number of rows each replicate's draw must have (the study's largest
     *             finite sample size, whatever subset of runs is being done), 0 for oracle-only studies
     * @param sink receives results with their estimates, possibly from other threads, one call at a time or concurrently
     */
    void execute(List<RunDefinition> runs, int rows, Consumer<PerformedRun> sink);
}
