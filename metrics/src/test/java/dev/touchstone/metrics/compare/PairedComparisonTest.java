package dev.touchstone.metrics.compare;

import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.apache.commons.statistics.inference.WilcoxonSignedRankTest;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

class PairedComparisonTest {

    private static RunResult ok(Setting s, String config, int rep, String metric, double v) {
        return new RunResult(config + rep + s.label(), s, rep, config, config, Map.of(), rep, RunStatus.OK, null, null,
                null, Map.of(metric, v), null);
    }

    @Test
    @DisplayName("Holm (1979) on a hand-worked example: p = (0.01, 0.04, 0.03, 0.005) → (0.03, 0.06, 0.06, 0.02)")
    void holm() {
        // sorted: 0.005·4 = 0.02, 0.01·3 = 0.03, 0.03·2 = 0.06, 0.04·1 = 0.04 → running max 0.06
        Double[] adjusted = Holm.adjust(new Double[] {0.01, 0.04, 0.03, 0.005});
        assertArrayEquals(new Double[] {0.03, 0.06, 0.06, 0.02}, adjusted);
        assertArrayEquals(new Double[] {null, 0.5}, Holm.adjust(new Double[] {null, 0.5}));
        assertArrayEquals(new Double[] {1.0, 1.0}, Holm.adjust(new Double[] {0.7, 0.9}));
    }

    @Test
    @DisplayName("exact Wilcoxon p-value without ties equals the enumeration of all 2^n sign patterns (Wilcoxon 1945)")
    void exactAgainstEnumeration() {
        double[] d = {1.5, -0.5, 2.5, 3.5, -4.5, 5.5, 6.5, 7.5, -8.5, 9.5};
        int n = d.length;
        // ranks of |d| are 2, 1, 3, …: |d| = k + 0.5 for distinct k, so rank = position in sorted |d|
        double[] abs = new double[n];
        for (int i = 0; i < n; i++) {
            abs[i] = Math.abs(d[i]);
        }
        double[] sorted = abs.clone();
        java.util.Arrays.sort(sorted);
        int observed = 0;
        int[] rank = new int[n];
        for (int i = 0; i < n; i++) {
            rank[i] = java.util.Arrays.binarySearch(sorted, abs[i]) + 1;
            observed += d[i] > 0 ? rank[i] : 0;
        }
        int atMost = 0;
        int atLeast = 0;
        for (int signs = 0; signs < (1 << n); signs++) {
            int w = 0;
            for (int i = 0; i < n; i++) {
                w += (signs >> i & 1) == 1 ? rank[i] : 0;
            }
            atMost += w <= observed ? 1 : 0;
            atLeast += w >= observed ? 1 : 0;
        }
        double exact = Math.min(1, 2.0 * Math.min(atMost, atLeast) / (1 << n));
        assertEquals(exact, PairedComparison.wilcoxon(d), 1e-12);
    }

    @Test
    @DisplayName("with ties and zeros the p-value is the normal approximation with tie and continuity corrections, zeros ranked then dropped (Pratt 1959, as Commons Statistics does)")
    void tiesNormalApproximation() {
        double[] d = {2, -1, 3, 1, 1, 4, -2, 6, 7, 2, 0, 3, 0, -1};
        // n = 14 ranked by |d| with midranks: the two zeros 1.5, four ones (3…6) 4.5, three twos (7…9) 8,
        // two threes 10.5, then 4 → 12, 6 → 13, 7 → 14.
        // W+ over positive differences: 8 + 10.5 + 4.5 + 4.5 + 12 + 13 + 14 + 8 + 10.5 = 85.
        double wPlus = 8 + 10.5 + 4.5 + 4.5 + 12 + 13 + 14 + 8 + 10.5;
        int n = 14;
        int zeros = 2;
        // Pratt: the zeros' ranks leave the statistic, so its mean and variance drop their share
        double mean = (n * (n + 1) - zeros * (zeros + 1)) / 4.0;
        double ties = (8 - 2) + (64 - 4) + (27 - 3) + (8 - 2);
        double var = (n * (n + 1) * (2 * n + 1) - zeros * (zeros + 1) * (2 * zeros + 1)) / 24.0 - ties / 48.0;
        double z = (wPlus - mean - 0.5) / Math.sqrt(var);
        double p = 2 * NormalDistribution.of(0, 1).survivalProbability(z);
        assertEquals(p, PairedComparison.wilcoxon(d), 1e-12);
        assertNull(PairedComparison.wilcoxon(new double[] {0, 0, 0}));
    }

    @Test
    @DisplayName("pairs runs by replicate on identical data sets; p-values equal Commons Statistics' WilcoxonSignedRankTest on the differences (ties included); wins respect the direction")
    void pairing() {
        Setting s = Setting.of("nodes", "20", "samples", "100");
        List<RunResult> runs = new ArrayList<>();
        double[] ref = {5, 7, 3, 8, 6, 4, 9, 5, 6, 7, 2, 8};
        double[] mine = {3, 7, 2, 5, 6, 1, 9, 4, 2, 3, 3, 6};   // lower SHD is better: several wins, ties
        double[] other = {6, 9, 3, 9, 8, 4, 12, 7, 6, 9, 4, 9};
        for (int r = 0; r < ref.length; r++) {
            runs.add(ok(s, "ges", r, "shd", ref[r]));
            runs.add(ok(s, "pc", r, "shd", mine[r]));
            if (r != 3) {
                runs.add(ok(s, "empty", r, "shd", other[r]));
            } else {
                runs.add(new RunResult("e3", s, r, "empty", "empty", Map.of(), r, RunStatus.FAILED, "boom", null, null,
                        Map.of(), null));
            }
        }
        List<ComparisonRow> rows = PairedComparison.compare(runs, "ges", List.of("shd"), 9);
        assertEquals(2, rows.size());
        ComparisonRow pc = rows.get(0);
        assertEquals("pc", pc.configurationId());
        assertEquals(12, pc.pairs());
        double[] d = new double[12];
        double sum = 0;
        for (int r = 0; r < 12; r++) {
            d[r] = mine[r] - ref[r];
            sum += d[r];
        }
        assertEquals(sum / 12, pc.meanDifference(), 1e-12);
        assertEquals(WilcoxonSignedRankTest.withDefaults().test(d).getPValue(), pc.pValue(), 1e-15);
        assertEquals(8, pc.wins());    // mine < ref in 8 replicates
        assertEquals(3, pc.ties());
        assertEquals(1, pc.losses());
        ComparisonRow empty = rows.get(1);
        assertEquals(11, empty.pairs()); // the failed replicate is left out
        assertEquals(0, empty.wins());
        double[] de = new double[11];
        int k = 0;
        for (int r = 0; r < 12; r++) {
            if (r != 3) {
                de[k++] = other[r] - ref[r];
            }
        }
        assertEquals(WilcoxonSignedRankTest.withDefaults().test(de).getPValue(), empty.pValue(), 1e-15);
        Double[] holm = Holm.adjust(new Double[] {pc.pValue(), empty.pValue()});
        assertEquals(holm[0], pc.pHolm());
        assertEquals(holm[1], empty.pHolm());
        assertThrows(IllegalArgumentException.class, () -> PairedComparison.compare(runs, "lingam", List.of("shd"), 9));
    }
}
