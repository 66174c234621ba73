package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.metrics.results.Timings;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.AbstractMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Locks the column layout and cell formatting of runs.csv, summary.csv and comparisons.csv (golden files). */
class ResultTablesGoldenTest {

    static final Setting SETTING = Setting.of("graph", "erdos-renyi", "model", "linear-gaussian", "nodes", "10",
            "samples", "100");
    static final Setting ORACLE = Setting.of("graph", "erdos-renyi", "model", "linear-gaussian", "nodes", "10",
            "samples", "oracle");
    static final SettingCells COLUMNS = new SettingCells(List.of("graph", "model", "nodes", "samples"),
            Map.of(SETTING, 3, ORACLE, 4));

    static String golden(String name) throws IOException {
        try (var in = ResultTablesGoldenTest.class.getResourceAsStream("/golden/" + name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    @Test
    @DisplayName("runs.csv: columns, empty cells for undefined values, whole numbers without a decimal point, quoting")
    void runs() throws IOException {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("shd", 3.0);
        m.put("adjacency_f1", 0.75);
        m.put("orientation_f1", null);
        RunResult ok = new RunResult("0123456789abcdef", SETTING, 0, "pc[alpha=0.01]", "pc",
                Map.of("alpha", "0.01"), -42L, RunStatus.OK, null, GraphClass.CPDAG, GraphClass.CPDAG, m,
                new Timings(0.5, 0.25, 1.5, 120L, 0L));
        Map<String, Double> none = new LinkedHashMap<>();
        none.put("shd", null);
        none.put("adjacency_f1", null);
        none.put("orientation_f1", null);
        // 2^53 + 1: the first integer a double cannot hold, so seed_high and seed_low are needed to keep it.
        RunResult failed = new RunResult("fedcba9876543210", ORACLE, 1, "mine", "my-method", Map.of("depth", "3"),
                9_007_199_254_740_993L,
                RunStatus.FAILED, "exited with status 3; it said: \"bad, very bad\"", null, null, none, Timings.NONE);
        String csv = ResultTables.runs(COLUMNS, List.of("shd", "adjacency_f1", "orientation_f1"),
                List.of(new AbstractMap.SimpleEntry<>(0, ok), new AbstractMap.SimpleEntry<>(1, failed)));
        assertEquals(golden("runs.csv"), csv);
    }

    @Test
    @DisplayName("summary.csv and comparisons.csv: columns and cells")
    void summaryAndComparisons() throws IOException {
        AggregateRow a = new AggregateRow(SETTING, "pc[alpha=0.01]", "pc", "shd", 9, 1, 0,
                new Summary(9, 3.5, 1.25, 2.75, 4.25, 3.0, 2.0, 5.0));
        AggregateRow b = new AggregateRow(ORACLE, "mine", "my-method", "shd", 0, 10, 0, Summary.EMPTY);
        assertEquals(golden("summary.csv"), ResultTables.summary(COLUMNS, List.of(a, b)));
        ComparisonRow c = new ComparisonRow(SETTING, "shd", "pc[alpha=0.01]", "mine", 8, -1.5, -2.5, -0.5, 0.0234,
                0.0468, 6, 1, 1);
        ComparisonRow d = new ComparisonRow(SETTING, "edges", "pc[alpha=0.01]", "mine", 0, null, null, null, null,
                null, null, null, null);
        assertEquals(golden("comparisons.csv"), ResultTables.comparisons(COLUMNS, List.of(c, d)));
    }

    @Test
    @DisplayName("a journal line reads back equal to the result written")
    void journalRoundTrip() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("shd", 3.0);
        m.put("sid", null);
        m.put("f1", 0.1 + 0.2);
        RunResult r = new RunResult("0123456789abcdef", SETTING, 4, "pc", "pc", Map.of("alpha", "0.05"),
                Long.MIN_VALUE, RunStatus.OK, null, GraphClass.PAG, GraphClass.PAG, m,
                new Timings(1e-7, null, 3.0, 5L, null));
        JournalCodec.Line line = new JournalCodec.Line(12, "coordinates", r);
        assertEquals(line, JournalCodec.read(JournalCodec.write(line)));
    }
}
