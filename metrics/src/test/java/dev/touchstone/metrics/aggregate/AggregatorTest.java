package dev.touchstone.metrics.aggregate;

import dev.touchstone.core.random.Seeds;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.metrics.results.Timings;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.math3.stat.descriptive.rank.Percentile;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class AggregatorTest {

    @Test
    @DisplayName("mean, sd and quartiles equal Commons Math's DescriptiveStatistics and Percentile (R_7 = Hyndman–Fan type 7)")
    void matchesCommonsMath() {
        UniformRandomProvider rng = Seeds.random(11);
        for (int n = 1; n < 40; n += 3) {
            double[] x = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = Math.floor(rng.nextDouble() * 10) / 2; // ties on purpose
            }
            Summary s = Summaries.of(x, Seeds.random(n));
            DescriptiveStatistics d = new DescriptiveStatistics(x);
            Percentile p = new Percentile().withEstimationType(Percentile.EstimationType.R_7);
            p.setData(x);
            assertEquals(n, s.count());
            assertEquals(d.getMean(), s.mean(), 1e-12);
            assertEquals(p.evaluate(50), s.median(), 1e-12);
            assertEquals(p.evaluate(25), s.q1(), 1e-12);
            assertEquals(p.evaluate(75), s.q3(), 1e-12);
            if (n >= 2) {
                assertEquals(d.getStandardDeviation(), s.sd(), 1e-12);
                assertTrue(s.low() <= s.mean() + 1e-12 && s.mean() <= s.high() + 1e-12);
            } else {
                assertNull(s.sd());
                assertNull(s.low());
            }
        }
        assertEquals(Summary.EMPTY, Summaries.of(new double[0], Seeds.random(1)));
    }

    @Test
    @DisplayName("percentile bootstrap 95% intervals cover the true mean about 95% of the time (seeded simulation; Efron and Tibshirani 1993)")
    void coverage() {
        UniformRandomProvider rng = Seeds.random(2024);
        ZigguratSampler.NormalizedGaussian normal = ZigguratSampler.NormalizedGaussian.of(rng);
        int reps = 1000;
        int covered = 0;
        for (int r = 0; r < reps; r++) {
            double[] x = new double[40];
            for (int i = 0; i < x.length; i++) {
                x[i] = 3 + 2 * normal.sample();
            }
            double[] ci = Bootstrap.meanInterval(x, 0.95, 1000, Seeds.random(Seeds.derive(7, r)));
            if (ci[0] <= 3 && 3 <= ci[1]) {
                covered++;
            }
        }
        double rate = covered / (double) reps;
        // the percentile interval slightly under-covers at n = 40 (≈ 0.94); binomial s.e. at 1000 reps ≈ 0.007
        assertTrue(rate > 0.92 && rate < 0.975, "coverage " + rate);
    }

    @Test
    @DisplayName("groups by setting × configuration, counts ok/failed/skipped, ignores undefined values, reads timings, and does not depend on run order")
    void aggregate() {
        List<RunResult> runs = new ArrayList<>();
        Setting a = Setting.of("nodes", "10");
        Setting b = Setting.of("nodes", "20");
        for (int rep = 0; rep < 6; rep++) {
            Map<String, Double> m = new HashMap<>();
            m.put("shd", (double) rep);
            m.put("adjacency_precision", rep == 0 ? null : 0.5);
            runs.add(RunResult.builder().key("a" + rep).setting(a).replicate(rep).configurationId("pc-fz")
                    .learnerId("pc").parameters(Map.of("alpha", "0.05")).seed(rep).status(RunStatus.OK).metrics(m)
                    .timings(new Timings(0.5 * rep, null, null, 10L * rep, null)).build());
        }
        runs.add(RunResult.builder().key("a6").setting(a).replicate(6).configurationId("pc-fz").learnerId("pc")
                .seed(6).status(RunStatus.TIMEOUT).message("over 120 s").build());
        runs.add(RunResult.builder().key("a7").setting(a).replicate(7).configurationId("pc-fz").learnerId("pc")
                .seed(7).status(RunStatus.SKIPPED).message("discrete data").build());
        runs.add(RunResult.builder().key("b0").setting(b).replicate(0).configurationId("pc-fz").learnerId("pc")
                .seed(0).status(RunStatus.FAILED).message("singular matrix").build());
        List<String> metrics = List.of("shd", "adjacency_precision", "seconds", "tests");
        List<AggregateRow> rows = Aggregator.aggregate(runs, metrics, 42);
        assertEquals(8, rows.size());
        AggregateRow shd = rows.get(0);
        assertEquals("shd", shd.metric());
        assertEquals(6, shd.okRuns());
        assertEquals(1, shd.failedRuns());
        assertEquals(1, shd.skippedRuns());
        assertEquals(2.5, shd.summary().mean(), 1e-12);       // mean of 0 … 5
        assertEquals(5, rows.get(1).summary().count());         // one precision undefined
        assertEquals(1.25, rows.get(2).summary().mean(), 1e-12); // seconds: 0.5 · 2.5
        assertEquals(25.0, rows.get(3).summary().mean(), 1e-12); // tests
        AggregateRow failedOnly = rows.get(4);
        assertEquals(0, failedOnly.okRuns());
        assertEquals(1, failedOnly.failedRuns());
        assertNull(failedOnly.summary().mean());

        List<RunResult> shuffled = new ArrayList<>(runs);
        Collections.shuffle(shuffled, new java.util.Random(3));
        List<AggregateRow> again = Aggregator.aggregate(shuffled, metrics, 42);
        assertTrue(again.containsAll(rows) && rows.containsAll(again), "independent of run order");
        assertThrows(IllegalArgumentException.class, () -> Aggregator.aggregate(runs, List.of("accuracy"), 1));
    }
}
