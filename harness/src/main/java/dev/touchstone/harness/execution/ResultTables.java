package dev.touchstone.harness.execution;

import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.metrics.results.Timings;

import dev.touchstone.metrics.aggregate.Summaries;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The study's tidy CSV tables — {@code runs.csv}, {@code summary.csv},
 * {@code comparisons.csv} — rendered from the metrics module's result records. One header
 * row, one value per cell, plain column names, an empty cell for an undefined value, and
 * every column of one type (integer, real, boolean or text) so that R, pandas and
 * spreadsheets read it without coercion. Truth coordinates are {@code truth.NAME} columns
 * and learner parameters {@code learner.NAME} columns; counts are {@code n_*}; interval
 * columns name their level ({@code ci95_low}). Column layouts are locked by golden tests,
 * and the layout's version is {@link #SCHEMA} (written to provenance.json).
 */
public final class ResultTables {

    /**
     * The version of the tables' column layout, written to provenance.json as
     * {@code tables_schema}. 1: the first layout (packed parameters, {@code samples} holding
     * the word {@code oracle}); 2: the tidy layout described in docs/formats.md.
     */
    public static final int SCHEMA = 2;

    /** The columns of runs.csv that measure time or memory and so differ between two runs of the same study. */
    public static final List<String> TIMING_COLUMNS = List.of("seconds", "cpu_seconds", "allocated_mb");

    /** The prefix of learner parameter columns in runs.csv. */
    public static final String LEARNER_PREFIX = "learner.";

    /** The lower end of a bootstrap interval, named with its level. */
    public static final String CI_LOW = "ci" + Math.round(Summaries.LEVEL * 100) + "_low";
    /** The upper end of a bootstrap interval, named with its level. */
    public static final String CI_HIGH = "ci" + Math.round(Summaries.LEVEL * 100) + "_high";

    private ResultTables() {
    }

    /**
     * One row per run, in plan order: position, key, setting cells ({@link SettingCells}),
     * replicate, configuration, learner, one {@code learner.NAME} column per parameter any
     * configuration sets (empty where a configuration has no such parameter), seed (also as
     * {@link SeedCells#HIGH} and {@link SeedCells#LOW}), status, message, graph classes, structural
     * metrics, then the measurements.
     *
     * @param setting the setting layout
     * @param metrics the structural metrics, in study order
     * @param runs    (run position, result) in plan order
     */
    public static String runs(SettingCells setting, List<String> metrics, List<Map.Entry<Integer, RunResult>> runs) {
        Set<String> parameters = new LinkedHashSet<>();
        for (Map.Entry<Integer, RunResult> e : runs) {
            parameters.addAll(e.getValue().parameters().keySet());
        }
        List<String> header = new ArrayList<>(List.of("run", "key"));
        header.addAll(setting.header());
        header.addAll(List.of("replicate", "configuration", "learner"));
        for (String p : parameters) {
            header.add(LEARNER_PREFIX + p);
        }
        header.addAll(List.of("seed", SeedCells.HIGH, SeedCells.LOW, "status", "message", "estimate_class", "scored_against"));
        header.addAll(metrics);
        header.addAll(List.of("seconds", "cpu_seconds", "allocated_mb", "n_tests", "n_scores"));
        List<List<String>> rows = new ArrayList<>();
        for (Map.Entry<Integer, RunResult> e : runs) {
            RunResult r = e.getValue();
            List<String> row = new ArrayList<>(header.size());
            row.add(Integer.toString(e.getKey()));
            row.add(r.key());
            row.addAll(setting.cells(r.setting()));
            row.add(Integer.toString(r.replicate()));
            row.add(r.configurationId());
            row.add(r.learnerId());
            for (String p : parameters) {
                row.add(Cells.text(r.parameters().get(p)));
            }
            row.addAll(SeedCells.cells(r.seed()));
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
    public static String summary(SettingCells setting, List<AggregateRow> aggregates) {
        List<String> header = new ArrayList<>(setting.header());
        header.addAll(List.of("configuration", "learner", "metric", "n_ok", "n_failed", "n_skipped",
                "n_values", "mean", "sd", CI_LOW, CI_HIGH, "median", "q1", "q3"));
        List<List<String>> rows = new ArrayList<>();
        for (AggregateRow a : aggregates) {
            List<String> row = new ArrayList<>(header.size());
            row.addAll(setting.cells(a.setting()));
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
    public static String comparisons(SettingCells setting, List<ComparisonRow> comparisons) {
        List<String> header = new ArrayList<>(setting.header());
        header.addAll(List.of("metric", "configuration", "reference", "n_pairs", "mean_difference", CI_LOW,
                CI_HIGH, "p_value", "p_holm", "n_wins", "n_ties", "n_losses"));
        List<List<String>> rows = new ArrayList<>();
        for (ComparisonRow c : comparisons) {
            List<String> row = new ArrayList<>(header.size());
            row.addAll(setting.cells(c.setting()));
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
