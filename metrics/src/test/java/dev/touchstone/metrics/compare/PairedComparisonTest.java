package dev.touchstone.metrics.compare;

import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
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
        return RunResult.builder().key(config + rep + s.label()).setting(s).replicate(rep).configurationId(config)
                .learnerId(config).seed(rep).status(RunStatus.OK).metrics(Map.of(metric, v)).build();
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
    @DisplayName("a row whose differences are all zero has no p-value; mostly zero differences give one (Pratt 1959 ranks, exact)")
    void zeroDifferences() {
        assertNull(PairedComparison.wilcoxon(new double[] {0, 0, 0}));
        double[] d = new double[15];
        d[3] = -1.0 / 3;
        assertEquals(1.0, PairedComparison.wilcoxon(d));
    }

    @Test
    @DisplayName("pairs runs by replicate on identical data sets; p-values are the signed-rank test of the differences (ties and zeros included); wins respect the direction")
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
                runs.add(RunResult.builder().key("e3").setting(s).replicate(r).configurationId("empty")
                        .learnerId("empty").seed(r).status(RunStatus.FAILED).message("boom").build());
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
        assertEquals(SignedRankTest.test(d).pValue(), pc.pValue(), 1e-15);
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
        assertEquals(SignedRankTest.test(de).pValue(), empty.pValue(), 1e-15);
        Double[] holm = Holm.adjust(new Double[] {pc.pValue(), empty.pValue()});
        assertEquals(holm[0], pc.pHolm());
        assertEquals(holm[1], empty.pHolm());
        assertThrows(IllegalArgumentException.class, () -> PairedComparison.compare(runs, "lingam", List.of("shd"), 9));
    }
}
