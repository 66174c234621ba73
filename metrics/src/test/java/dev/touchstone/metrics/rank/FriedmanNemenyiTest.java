package dev.touchstone.metrics.rank;

import dev.touchstone.metrics.results.RankingResult;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class FriedmanNemenyiTest {

    /** Rounding first base, 22 players × 3 methods (round out, narrow angle, wide angle): Hollander and Wolfe (1973). */
    static final double[][] ROUNDING_FIRST_BASE = {
        {5.40, 5.50, 5.55}, {5.85, 5.70, 5.75}, {5.20, 5.60, 5.50}, {5.55, 5.50, 5.40}, {5.90, 5.85, 5.70},
        {5.45, 5.55, 5.60}, {5.40, 5.40, 5.35}, {5.45, 5.50, 5.35}, {5.25, 5.15, 5.00}, {5.85, 5.80, 5.70},
        {5.25, 5.20, 5.10}, {5.65, 5.55, 5.45}, {5.60, 5.35, 5.45}, {5.05, 5.00, 4.95}, {5.50, 5.50, 5.40},
        {5.45, 5.55, 5.50}, {5.55, 5.55, 5.35}, {5.45, 5.50, 5.55}, {5.50, 5.45, 5.25}, {5.65, 5.60, 5.40},
        {5.70, 5.65, 5.55}, {6.30, 6.30, 6.25}};

    @Test
    @DisplayName("Friedman on the rounding-first-base data of Hollander and Wolfe (1973): χ² = 11.143, p = 0.003805 with the tie correction (as R's friedman.test)")
    void hollanderWolfe() {
        FriedmanTest.Result r = FriedmanTest.test(ROUNDING_FIRST_BASE);
        assertEquals(11.143, r.chiSquare(), 5e-4);
        assertEquals(0.003805, r.pValue(), 5e-7);
        assertEquals(2, r.df());
        // the rank sums must add up to N k (k + 1) / 2 = 22 · 6 = 132
        assertEquals(132, (r.meanRanks()[0] + r.meanRanks()[1] + r.meanRanks()[2]) * 22, 1e-9);
    }

    @Test
    @DisplayName("Friedman without ties reduces to 12/(Nk(k+1)) Σ R_j² − 3N(k+1) (Friedman 1937), checked on a hand-made table")
    void noTies() {
        double[][] blocks = {{1, 2, 3}, {1, 3, 2}, {2, 1, 3}, {1, 2, 3}};
        // rank sums: 5, 8, 11 → 12/(4·3·4)·(25 + 64 + 121) − 3·4·4 = 0.25·210 − 48 = 4.5
        FriedmanTest.Result r = FriedmanTest.test(blocks);
        assertEquals(4.5, r.chiSquare(), 1e-12);
        assertArrayEquals(new double[] {1.25, 2.0, 2.75}, r.meanRanks(), 1e-12);
    }

    @Test
    @DisplayName("Nemenyi: k = 4 over N = 14 at α = 0.05 gives CD = 2.569·√(20/84) ≈ 1.25 (Demšar 2006 — from memory)")
    void criticalDifference() {
        assertEquals(2.569, Nemenyi.q(4, 0.05));
        assertEquals(1.25, Nemenyi.criticalDifference(4, 14, 0.05), 0.005);
        assertNull(Nemenyi.q(11, 0.05));
        assertNull(Nemenyi.q(4, 0.01));
    }

    @Test
    @DisplayName("the q table equals the studentized range quantile at infinite df divided by √2, by numerical integration (Demšar 2006, §3.2.2)")
    void qTableByIntegration() {
        for (double alpha : new double[] {0.05, 0.10}) {
            for (int k = 2; k <= 10; k++) {
                double w = rangeQuantile(k, 1 - alpha);
                assertEquals(Nemenyi.q(k, alpha), w / Math.sqrt(2), 0.0015, "k = " + k + ", α = " + alpha);
            }
        }
    }

    /** The quantile of the range of k standard normals: P(R ≤ w) = k ∫ φ(x) [Φ(x + w) − Φ(x)]^(k−1) dx. */
    private static double rangeQuantile(int k, double prob) {
        double lo = 0;
        double hi = 10;
        for (int it = 0; it < 40; it++) {
            double mid = (lo + hi) / 2;
            if (rangeCdf(k, mid) < prob) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return (lo + hi) / 2;
    }

    private static double rangeCdf(int k, double w) {
        NormalDistribution n = NormalDistribution.of(0, 1);
        double h = 0.01;
        double sum = 0;
        for (int i = 0; i <= 1600; i++) {
            double x = -8 + i * h;
            double f = n.density(x) * Math.pow(n.cumulativeProbability(x + w) - n.cumulativeProbability(x), k - 1);
            double weight = i == 0 || i == 1600 ? 1 : i % 2 == 1 ? 4 : 2;
            sum += weight * f;
        }
        return k * sum * h / 3;
    }

    @Test
    @DisplayName("ranking over settings follows the metric's direction, shares ranks on ties and drops incomplete settings")
    void rankingOverSettings() {
        List<RunResult> runs = new ArrayList<>();
        // six settings; on adjacency_f1 (higher is better) "good" beats "mid" beats "poor" everywhere
        for (int s = 0; s < 6; s++) {
            Setting setting = Setting.of("nodes", String.valueOf(10 * (s + 1)));
            runs.add(run(setting, "good", 0.9));
            runs.add(run(setting, "mid", s == 5 ? 0.9 : 0.6));   // ties with "good" in the sixth setting
            runs.add(run(setting, "poor", 0.1));
        }
        Setting partial = Setting.of("nodes", "70");
        runs.add(run(partial, "good", 0.9));
        runs.add(RunResult.builder().key("k-x").setting(partial).replicate(0).configurationId("poor")
                .learnerId("poor").seed(1).status(RunStatus.FAILED).message("boom").build());
        RankingResult r = Ranking.over(runs, "adjacency_f1", 0.05);
        assertEquals(List.of("good", "mid", "poor"), r.configurations());
        // ranks per setting: (1, 2, 3) five times, then (1.5, 1.5, 3)
        assertEquals((5 + 1.5) / 6, r.meanRanks().get(0), 1e-12);
        assertEquals((10 + 1.5) / 6, r.meanRanks().get(1), 1e-12);
        assertEquals(3.0, r.meanRanks().get(2), 1e-12);
        assertEquals(6, r.settingsUsed());
        assertEquals(1, r.settingsDropped());
        // CD = 2.343 √(3·4 / (6·6)) ≈ 1.353: good–poor differ by 1.92, good–mid by 0.83
        assertEquals(2.343 * Math.sqrt(3 * 4 / (6.0 * 6)), r.criticalDifference(), 1e-12);
        assertTrue(r.differ("good", "poor"));
        assertFalse(r.differ("good", "mid"));
        assertThrows(IllegalArgumentException.class, () -> Ranking.over(runs, "edges", 0.05));
    }

    @Test
    @DisplayName("ties within a setting share midranks; settings that are all ties leave the statistic undefined, not NaN (Friedman 1937 with the tie correction of Hollander and Wolfe 1973)")
    void allTies() {
        List<RunResult> runs = new ArrayList<>();
        for (int s = 0; s < 4; s++) {
            Setting setting = Setting.of("nodes", String.valueOf(10 * (s + 1)));
            runs.add(run(setting, "a", 1.0));
            runs.add(run(setting, "b", 1.0));
        }
        RankingResult r = Ranking.over(runs, "adjacency_f1", 0.05);
        assertEquals(List.of(1.5, 1.5), r.meanRanks());
        assertNull(r.friedmanChiSquare());
        assertNull(r.friedmanPValue());
        // one setting with a difference: ranks (1, 2) there and (1.5, 1.5) elsewhere; the tie term of the
        // three tied blocks is 3 (2³ − 2) = 18, so χ² = 12 [(5.5 − 6)² + (6.5 − 6)²] / (4·2·3 − 18) = 1
        runs.set(0, run(Setting.of("nodes", "10"), "a", 0.5));
        RankingResult one = Ranking.over(runs, "adjacency_f1", 0.05);
        assertEquals(List.of(1.625, 1.375), one.meanRanks());
        assertEquals(1.0, one.friedmanChiSquare(), 1e-12);
    }

    private static RunResult run(Setting s, String config, double f1) {
        return RunResult.builder().key("k-" + s.label() + config).setting(s).replicate(0).configurationId(config)
                .learnerId(config).seed(1).status(RunStatus.OK).metrics(Map.of("adjacency_f1", f1)).build();
    }
}
