package dev.touchstone.harness.calibrate;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.fit.FitDiagnostics;
import dev.touchstone.generators.fit.FittedModel;
import dev.touchstone.generators.fit.FittedTruth;
import dev.touchstone.harness.execution.PerformedRun;
import dev.touchstone.metrics.results.RunResult;

import java.util.List;

/**
 * Everything a calibration produced: the data, the fitted model and its checks, the truths
 * simulated from, the settings, and every run in plan order with its result and estimate.
 * Immutable (the data set and graphs are immutable).
 *
 * @param data     the real data
 * @param fit      the model fitted to them, with its checks
 * @param truths   the truths simulated from: the fitted one, then its variants
 * @param settings what was run
 * @param runs     every run, in plan order
 */
public record CalibrationOutcome(DataSet data, Fit fit, List<FittedTruth> truths, CalibrationSettings settings,
                                 List<Run> runs) {

    public CalibrationOutcome {
        truths = List.copyOf(truths);
        runs = List.copyOf(runs);
    }

    /**
     * The fitted model and its checks.
     *
     * @param model       the model fitted to the data over the truth graph
     * @param diagnostics its checks, one per variable
     */
    public record Fit(FittedModel model, List<FitDiagnostics.Check> diagnostics) {
        public Fit {
            diagnostics = List.copyOf(diagnostics);
        }
    }

    /** The model fitted to the data. */
    public FittedModel fitted() {
        return fit.model();
    }

    /** The fitted model's checks. */
    public List<FitDiagnostics.Check> diagnostics() {
        return fit.diagnostics();
    }

    /**
     * One run.
     *
     * @param truth     the truth simulated from, or null for a bootstrap resample of the real data
     * @param replicate the replicate (or resample) number
     * @param rows      the rows learned from
     * @param learner   the learner's id
     * @param performed its result, with the learner's estimate when it returned one
     */
    public record Run(FittedTruth truth, int replicate, int rows, String learner, PerformedRun performed) {

        /** The run's result. */
        public RunResult result() {
            return performed.result();
        }

        /** The graph the learner returned, or null when it did not finish. */
        public Graph estimate() {
            return performed.estimate() == null ? null : performed.estimate().graph();
        }

        /** Whether the run was on a bootstrap resample of the real data (no truth, no metrics). */
        public boolean isBootstrap() {
            return truth == null;
        }
    }
}
