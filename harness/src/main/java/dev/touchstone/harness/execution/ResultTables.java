package dev.touchstone.harness.execution;

import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.metrics.results.Timings;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * The study's tidy CSV tables — {@code runs.csv}, {@code summary.csv},
 * {@code comparisons.csv} — rendered from the metrics module's result records. One header
 * row, one value per cell, plain column names, an empty cell for an undefined value.
 * Column layouts are locked by golden tests.
 */
public final class ResultTables {

    /** The columns of runs.csv that measure time or memory and so differ between two runs of the same study. */
    public static final List<String> TIMING_COLUMNS = List.of("seconds", "cpu_seconds", "allocated_mb");

    private ResultTables() {
    }

    /**
     * One row per run, in plan order: position, key, setting coordinates, replicate,
     * configuration, learner, parameters ({@code name=value;…}), seed, status, message,
     * graph classes, structural metrics, then the measurements.
     *
     * @param settingColumns the setting coordinate names (from {@link SettingLayout#columns()})
     * @param metrics        the structural metrics, in study order
     * @param runs           (run position, result) in plan order
     */
    public static String runs(List<String> settingColumns, List<String> metrics, List<Map.Entry<Integer, RunResult>> runs) {
        List<String> header = new ArrayList<>(List.of("run", "key"));
        header.addAll(settingColumns);
        header.addAll(List.of("replicate", "configuration", "learner", "parameters", "seed", "status", "message",
                "estimate_class", "scored_against"));
        header.addAll(metrics);
        header.addAll(List.of("seconds", "cpu_seconds", "allocated_mb", "tests", "scores"));
        List<List<String>> rows = new ArrayList<>();
        for (Map.Entry<Integer, RunResult> e : runs) {
            RunResult r = e.getValue();
            List<String> row = new ArrayList<>(header.size());
            row.add(Integer.toString(e.getKey()));
            row.add(r.key());
            for (String c : settingColumns) {
                row.add(Cells.text(r.setting().get(c)));
            }
            row.add(Integer.toString(r.replicate()));
            row.add(r.configurationId());
            row.add(r.learnerId());
            StringBuilder params = new StringBuilder();
            r.parameters().forEach((k, v) -> params.append(params.length() == 0 ? "" : ";").append(k).append('=').append(v));
            row.add(params.toString());
            row.add(Long.toString(r.seed()));
            row.add(r.status().word());
            row.add(Cells.text(r.message()));
            row.add(r.estimateClass() == null ? "" : r.estimateClass().word());
            row.add(r.scoredAgainst() == null ? "" : r.scoredAgainst().word());
            for (String m : metrics) {
                row.add(Cells.number(r.metrics().get(m)));
            }
            Timings t = r.timings();
            row.add(Cells.number(t.seconds()));
            row.add(Cells.number(t.cpuSeconds()));
            row.add(Cells.number(t.allocatedMb()));
            row.add(Cells.number(t.tests()));
            row.add(Cells.number(t.scores()));
            rows.add(row);
        }
        return Cells.csv(header, rows);
    }

    /** One row per setting × configuration × metric. */
    public static String summary(List<String> settingColumns, List<AggregateRow> aggregates) {
        List<String> header = new ArrayList<>(settingColumns);
        header.addAll(List.of("configuration", "learner", "metric", "ok_runs", "failed_runs", "skipped_runs",
                "values", "mean", "sd", "ci_low", "ci_high", "median", "q1", "q3"));
        List<List<String>> rows = new ArrayList<>();
        for (AggregateRow a : aggregates) {
            List<String> row = new ArrayList<>(header.size());
            for (String c : settingColumns) {
                row.add(Cells.text(a.setting().get(c)));
            }
            row.add(a.configurationId());
            row.add(a.learnerId());
            row.add(a.metric());
            row.add(Integer.toString(a.okRuns()));
            row.add(Integer.toString(a.failedRuns()));
            row.add(Integer.toString(a.skippedRuns()));
            Summary s = a.summary();
            row.add(Integer.toString(s.count()));
            row.add(Cells.number(s.mean()));
            row.add(Cells.number(s.sd()));
            row.add(Cells.number(s.low()));
            row.add(Cells.number(s.high()));
            row.add(Cells.number(s.median()));
            row.add(Cells.number(s.q1()));
            row.add(Cells.number(s.q3()));
            rows.add(row);
        }
        return Cells.csv(header, rows);
    }

    /** One row per setting × metric × configuration compared with the reference. */
    public static String comparisons(List<String> settingColumns, List<ComparisonRow> comparisons) {
        List<String> header = new ArrayList<>(settingColumns);
        header.addAll(List.of("metric", "configuration", "reference", "pairs", "mean_difference", "ci_low",
                "ci_high", "p_value", "p_holm", "wins", "ties", "losses"));
        List<List<String>> rows = new ArrayList<>();
        for (ComparisonRow c : comparisons) {
            List<String> row = new ArrayList<>(header.size());
            for (String col : settingColumns) {
                row.add(Cells.text(c.setting().get(col)));
            }
            row.add(c.metric());
            row.add(c.configurationId());
            row.add(c.referenceId());
            row.add(Integer.toString(c.pairs()));
            row.add(Cells.number(c.meanDifference()));
            row.add(Cells.number(c.low()));
            row.add(Cells.number(c.high()));
            row.add(Cells.number(c.pValue()));
            row.add(Cells.number(c.pHolm()));
            row.add(Cells.number(c.wins()));
            row.add(Cells.number(c.ties()));
            row.add(Cells.number(c.losses()));
            rows.add(row);
        }
        return Cells.csv(header, rows);
    }
}
