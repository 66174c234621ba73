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
        RunResult ok = RunResult.builder().key("0123456789abcdef").setting(SETTING).replicate(0)
                .configurationId("pc[alpha=0.01]").learnerId("pc").parameters(Map.of("alpha", "0.01")).seed(-42L)
                .status(RunStatus.OK).estimateClass(GraphClass.CPDAG).scoredAgainst(GraphClass.CPDAG).metrics(m)
                .timings(new Timings(0.5, 0.25, 1.5, 120L, 0L)).build();
        Map<String, Double> none = new LinkedHashMap<>();
        none.put("shd", null);
        none.put("adjacency_f1", null);
        none.put("orientation_f1", null);
        // 2^53 + 1: the first integer a double cannot hold, so seed_high and seed_low are needed to keep it.
        RunResult failed = RunResult.builder().key("fedcba9876543210").setting(ORACLE).replicate(1)
                .configurationId("mine").learnerId("my-method").parameters(Map.of("depth", "3"))
                .seed(9_007_199_254_740_993L).status(RunStatus.FAILED)
                .message("exited with status 3; it said: \"bad, very bad\"").metrics(none).timings(Timings.NONE)
                .build();
        String csv = ResultTables.runs(COLUMNS, List.of("shd", "adjacency_f1", "orientation_f1"),
                List.of(new AbstractMap.SimpleEntry<>(0, ok), new AbstractMap.SimpleEntry<>(1, failed)));
        assertEquals(golden("runs.csv"), csv);
    }

    @Test
    @DisplayName("summary.csv and comparisons.csv: columns and cells")
    void summaryAndComparisons() throws IOException {
        AggregateRow a = AggregateRow.builder().setting(SETTING).configurationId("pc[alpha=0.01]").learnerId("pc")
                .metric("shd").okRuns(9).failedRuns(1).skippedRuns(0)
                .summary(new Summary(9, 3.5, 1.25, new Summary.Interval(2.75, 4.25),
                        new Summary.Quartiles(2.0, 3.0, 5.0))).build();
        AggregateRow b = AggregateRow.builder().setting(ORACLE).configurationId("mine").learnerId("my-method")
                .metric("shd").okRuns(0).failedRuns(10).skippedRuns(0).summary(Summary.EMPTY).build();
        assertEquals(golden("summary.csv"), ResultTables.summary(COLUMNS, List.of(a, b)));
        ComparisonRow c = ComparisonRow.builder().setting(SETTING).metric("shd").configurationId("pc[alpha=0.01]")
                .referenceId("mine").pairs(8).meanDifference(-1.5).low(-2.5).high(-0.5).pValue(0.0234)
                .pHolm(0.0468).wins(6).ties(1).losses(1).build();
        ComparisonRow d = ComparisonRow.builder().setting(SETTING).metric("edges")
                .configurationId("pc[alpha=0.01]").referenceId("mine").pairs(0).build();
        assertEquals(golden("comparisons.csv"), ResultTables.comparisons(COLUMNS, List.of(c, d)));
    }

    @Test
    @DisplayName("a journal line reads back equal to the result written")
    void journalRoundTrip() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("shd", 3.0);
        m.put("sid", null);
        m.put("f1", 0.1 + 0.2);
        RunResult r = RunResult.builder().key("0123456789abcdef").setting(SETTING).replicate(4)
                .configurationId("pc").learnerId("pc").parameters(Map.of("alpha", "0.05")).seed(Long.MIN_VALUE)
                .status(RunStatus.OK).estimateClass(GraphClass.PAG).scoredAgainst(GraphClass.PAG).metrics(m)
                .timings(new Timings(1e-7, null, 3.0, 5L, null)).build();
        JournalCodec.Line line = new JournalCodec.Line(12, "coordinates", r);
        assertEquals(line, JournalCodec.read(JournalCodec.write(line)));
    }
}
