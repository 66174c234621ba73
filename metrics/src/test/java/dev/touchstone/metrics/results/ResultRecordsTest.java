package dev.touchstone.metrics.results;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The records' own rules (common practice for tidy data: one plain value per cell, undefined as empty). */
class ResultRecordsTest {

    @Test
    @DisplayName("a run keeps the order of its coordinates and metrics, allows undefined (null) values and refuses NaN")
    void runResult() {
        Map<String, Double> metrics = new LinkedHashMap<>();
        metrics.put("shd", 3.0);
        metrics.put("adjacency_precision", null);
        RunResult r = RunResult.builder().key("k1").setting(Setting.of("nodes", "20", "samples", "oracle"))
                .replicate(0).configurationId("pc-fz").learnerId("pc").parameters(Map.of("alpha", "0.01")).seed(42)
                .status(RunStatus.OK).metrics(metrics).timings(new Timings(1.5, 1.2, 30.0, 100L, null)).build();
        assertEquals(List.of("nodes", "samples"), List.copyOf(r.setting().coordinates().keySet()));
        assertEquals("nodes=20, samples=oracle", r.setting().label());
        assertEquals(List.of("shd", "adjacency_precision"), List.copyOf(r.metrics().keySet()));
        assertNull(r.value("adjacency_precision"));
        assertEquals(1.5, r.value("seconds"));
        assertEquals(100.0, r.value("tests"));
        assertNull(r.value("scores"));
        metrics.put("shd", Double.NaN);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> RunResult.builder()
                .key("k1").setting(Setting.of("nodes", "20")).replicate(0).configurationId("pc-fz").learnerId("pc")
                .seed(1).status(RunStatus.OK).metrics(metrics).build());
        assertTrue(e.getMessage().contains("metric 'shd'"), e.getMessage());
    }

    @Test
    @DisplayName("a failed run needs a message and carries no metric values; its values read as undefined")
    void failedRun() {
        assertThrows(IllegalArgumentException.class, () -> RunResult.builder().key("k").setting(Setting.of())
                .replicate(0).configurationId("c").learnerId("l").seed(1).status(RunStatus.FAILED).message(" ")
                .build());
        assertThrows(IllegalArgumentException.class, () -> RunResult.builder().key("k").setting(Setting.of())
                .replicate(0).configurationId("c").learnerId("l").seed(1).status(RunStatus.TIMEOUT)
                .message("limit").metrics(Map.of("shd", 1.0)).build());
        RunResult f = RunResult.builder().key("k").setting(Setting.of()).replicate(0).configurationId("c")
                .learnerId("l").seed(1).status(RunStatus.TIMEOUT).message("over 60 s")
                .timings(new Timings(60.0, null, null, null, null)).build();
        assertNull(f.value("seconds"));
        assertTrue(f.status().isFailure());
    }

    @Test
    @DisplayName("status words parse back and unknown words are refused with the allowed list")
    void statusWords() {
        for (RunStatus s : RunStatus.values()) {
            assertEquals(s, RunStatus.parse(s.word()));
        }
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> RunStatus.parse("done"));
        assertEquals("unknown run status 'done' (allowed: ok, failed, timeout, skipped)", e.getMessage());
    }

    @Test
    @DisplayName("comparison rows check wins + ties + losses = pairs")
    void comparisonRow() {
        assertThrows(IllegalArgumentException.class, () -> ComparisonRow.builder().setting(Setting.of())
                .metric("shd").configurationId("a").referenceId("b").pairs(5).meanDifference(0.0).wins(1).ties(1)
                .losses(1).build());
        ComparisonRow ok = ComparisonRow.builder().setting(Setting.of()).metric("edges").configurationId("a")
                .referenceId("b").pairs(5).meanDifference(0.0).build();
        assertEquals(0.5, ok.withHolm(0.5).pHolm());
    }
}
