package dev.touchstone.harness.calibrate;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.fit.FitDiagnostics;
import dev.touchstone.generators.fit.FittedModel;
import dev.touchstone.generators.fit.FittedTruth;
import dev.touchstone.metrics.results.RunResult;

import java.util.List;

/**
 * Everything a calibration produced: the data, the fitted model and its checks, the truths
 * simulated from, the settings, and every run in plan order with its result and estimate.
 * Immutable (the data set and graphs are immutable).
 */
public record CalibrationOutcome(DataSet data, FittedModel fitted, List<FittedTruth> truths,
                                 List<FitDiagnostics.Check> diagnostics, CalibrationSettings settings,
                                 List<Run> runs) {

    public CalibrationOutcome {
        truths = List.copyOf(truths);
        diagnostics = List.copyOf(diagnostics);
        runs = List.copyOf(runs);
    }

    /**
     * One run.
     *
     * @param truth    the truth simulated from, or null for a bootstrap resample of the real data
     * @param estimate the graph the learner returned, or null when it did not finish
     */
    public record Run(FittedTruth truth, int replicate, int rows, String learner, RunResult result, Graph estimate) {
        /** Whether the run was on a bootstrap resample of the real data (no truth, no metrics). */
        public boolean isBootstrap() {
            return truth == null;
        }
    }
}
