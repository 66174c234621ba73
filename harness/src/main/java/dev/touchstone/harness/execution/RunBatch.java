package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.RunDefinition;

import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The execution step: performs a list of run definitions on an executor and hands each
 * performed run, with its definition, to a recorder. A study session records into its journal;
 * the calibration, which has no study, records in memory. Cost: the runs', plus one map
 * look-up per run.
 */
public final class RunBatch {

    /** Receives each performed run with its definition, possibly from several threads at once. */
    @FunctionalInterface
    public interface Recorder {
        void record(RunDefinition run, PerformedRun performed);
    }

    private RunBatch() {
    }

    /**
     * Performs every run and records each as it finishes; returns when all are done.
     *
     * @param executor where the runs are performed
     * @param runs     the runs, in the order to start them; their keys are distinct
     * @param rows     the number of rows each replicate's draw must have ({@link RunExecutor#execute})
     * @param recorder receives every performed run
     */
    public static void execute(RunExecutor executor, List<RunDefinition> runs, int rows, Recorder recorder) {
        Map<String, RunDefinition> byKey = new HashMap<>();
        for (RunDefinition r : runs) {
            byKey.put(r.key(), r);
        }
        executor.execute(runs, rows, performed -> recorder.record(byKey.get(performed.result().key()), performed));
    }
}
