package dev.touchstone.harness.cli;

import dev.touchstone.harness.calibrate.CalibrationOutcome;
import dev.touchstone.harness.calibrate.CalibrationSettings;
import dev.touchstone.harness.study.Canonical;

/**
 * {@code calibration-runs.csv}: one row per run (truth, replicate, rows, learner, status,
 * message, then every metric; bootstrap runs have truth {@code bootstrap} and no metrics),
 * tidy for R and pandas.
 */
final class CalibrationRunsCsv {

    private CalibrationRunsCsv() {
    }

    static String render(CalibrationOutcome o) {
        StringBuilder sb = new StringBuilder("truth,replicate,rows,learner,status,message");
        for (String m : CalibrationSettings.METRICS) {
            sb.append(',').append(m);
        }
        sb.append('\n');
        for (CalibrationOutcome.Run r : o.runs()) {
            sb.append(r.isBootstrap() ? "bootstrap" : r.truth().name()).append(',').append(r.replicate()).append(',')
                    .append(r.rows()).append(',').append(r.learner()).append(',')
                    .append(r.result() == null ? "" : r.result().status().word()).append(',')
                    .append(quote(r.result() == null || r.result().message() == null ? "" : r.result().message()));
            for (String m : CalibrationSettings.METRICS) {
                Double v = r.result() == null ? null : r.result().metrics().get(m);
                sb.append(',').append(v == null ? "" : Canonical.value(v));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static String quote(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
