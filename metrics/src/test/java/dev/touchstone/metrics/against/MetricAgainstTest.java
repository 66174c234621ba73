package dev.touchstone.metrics.against;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.aggregate.Aggregator;
import dev.touchstone.metrics.compare.PairedComparison;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.scoring.Direction;
import dev.touchstone.metrics.scoring.StructuralHammingDistance;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Names of metrics against a requested truth class, and their use by summaries and comparisons. */
class MetricAgainstTest {

    @Test
    @DisplayName("METRIC_vs_CLASS names: parsed into base and class; plain names and unknown classes are not such names")
    void names() {
        assertEquals(new MetricAgainst("adjacency_f1", GraphClass.PAG), MetricAgainst.parse("adjacency_f1_vs_pag"));
        assertEquals("shd_vs_cpdag", new MetricAgainst("shd", GraphClass.CPDAG).name());
        assertNull(MetricAgainst.parse("shd"));
        assertNull(MetricAgainst.parse("shd_vs_tree"));
    }

    @Test
    @DisplayName("a METRIC_vs_CLASS name resolves to its base metric (direction of the SHD: lower is better); unknown bases are refused by name")
    void resolvesToTheBase() {
        assertSame(StructuralHammingDistance.INSTANCE, MetricAgainst.resolve("shd_vs_cpdag"));
        assertEquals(Direction.LOWER_IS_BETTER, MetricAgainst.find("shd_vs_dag").orElseThrow().direction());
        assertTrue(MetricAgainst.find("nonsense_vs_dag").isEmpty());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> MetricAgainst.resolve("nonsense_vs_dag"));
        assertTrue(e.getMessage().contains("'nonsense'") && e.getMessage().contains("nonsense_vs_dag"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> MetricAgainst.resolve("nonsense"));
    }

    private static RunResult ok(Setting s, String config, int rep, String metric, double v) {
        return RunResult.builder().key(config + rep).setting(s).replicate(rep).configurationId(config)
                .learnerId(config).seed(rep).status(RunStatus.OK).metrics(Map.of(metric, v)).build();
    }

    @Test
    @DisplayName("summaries and paired comparisons of shd_vs_cpdag equal those of shd on the same values (Wilcoxon p, wins by the SHD's direction) (hand-worked: a loses every pair)")
    void summarisedAndComparedAsTheBase() {
        Setting s = Setting.of("samples", "100");
        List<RunResult> plain = new ArrayList<>();
        List<RunResult> against = new ArrayList<>();
        for (int rep = 0; rep < 6; rep++) {
            // a is worse (larger SHD) than the reference b in every replicate: six losses by the SHD's direction
            plain.add(ok(s, "a", rep, "shd", 3 + rep));
            plain.add(ok(s, "b", rep, "shd", rep));
            against.add(ok(s, "a", rep, "shd_vs_cpdag", 3 + rep));
            against.add(ok(s, "b", rep, "shd_vs_cpdag", rep));
        }
        List<AggregateRow> x = Aggregator.aggregate(plain, List.of("shd"), 7);
        List<AggregateRow> y = Aggregator.aggregate(against, List.of("shd_vs_cpdag"), 7);
        assertEquals(x.size(), y.size());
        for (int i = 0; i < x.size(); i++) {
            assertEquals("shd_vs_cpdag", y.get(i).metric());
            // the same values; bootstrap intervals differ, as each row's seed is derived from its own metric name
            assertEquals(x.get(i).summary().count(), y.get(i).summary().count());
            assertEquals(x.get(i).summary().mean(), y.get(i).summary().mean());
            assertEquals(x.get(i).summary().median(), y.get(i).summary().median());
        }
        ComparisonRow c = PairedComparison.compare(against, "b", List.of("shd_vs_cpdag"), 7).get(0);
        assertEquals("shd_vs_cpdag", c.metric());
        assertEquals(0, (int) c.wins());
        assertEquals(6, (int) c.losses());
        assertEquals(3.0, c.meanDifference(), 1e-12);
        ComparisonRow d = PairedComparison.compare(plain, "b", List.of("shd"), 7).get(0);
        assertEquals(d.pValue(), c.pValue());
    }
}
