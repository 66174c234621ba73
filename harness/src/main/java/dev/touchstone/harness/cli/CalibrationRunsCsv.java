package dev.touchstone.harness.cli;

import dev.touchstone.harness.calibrate.Calibration;
import dev.touchstone.harness.calibrate.CalibrationOutcome;
import dev.touchstone.harness.calibrate.CalibrationSettings;
import dev.touchstone.harness.execution.Cells;
import dev.touchstone.metrics.results.RunResult;

import java.util.ArrayList;
import java.util.List;

/**
 * {@code calibration-runs.csv}: one row per run (truth, replicate, rows, learner, status,
 * message, then every metric; bootstrap runs have truth {@code bootstrap} and no metrics),
 * tidy for R and pandas, written as the study's CSV files are ({@link Cells}).
 */
final class CalibrationRunsCsv {

    private CalibrationRunsCsv() {
    }

    static String render(CalibrationOutcome o) {
        List<String> header = new ArrayList<>(List.of("truth", "replicate", "rows", "learner", "status", "message"));
        header.addAll(CalibrationSettings.METRICS);
        List<List<String>> rows = new ArrayList<>();
        for (CalibrationOutcome.Run r : o.runs()) {
            RunResult result = r.result();
            List<String> row = new ArrayList<>(List.of(r.isBootstrap() ? Calibration.BOOTSTRAP : r.truth().name(),
                    Integer.toString(r.replicate()), Integer.toString(r.rows()), r.learner(),
                    result == null ? "" : result.status().word(), Cells.text(result == null ? null : result.message())));
            for (String m : CalibrationSettings.METRICS) {
                row.add(Cells.number(result == null ? null : result.metrics().get(m)));
            }
            rows.add(row);
        }
        return Cells.csv(header, rows);
    }
}
