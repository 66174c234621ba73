package dev.touchstone.metrics.compare;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.inference.AlternativeHypothesis;
import org.apache.commons.statistics.inference.PValueMethod;
import org.apache.commons.statistics.inference.WilcoxonSignedRankTest;
import org.apache.commons.statistics.ranking.NaturalRanking;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SignedRankTestTest {

    @Test
    @DisplayName("without ties or zeros the exact p-value equals Commons Statistics' exact Wilcoxon (1945) p-value, 200 seeded samples")
    void exactAgainstCommonsStatistics() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261203L);
        WilcoxonSignedRankTest reference = WilcoxonSignedRankTest.withDefaults().with(PValueMethod.EXACT)
                .with(AlternativeHypothesis.TWO_SIDED);
        for (int trial = 0; trial < 200; trial++) {
            int n = 1 + rng.nextInt(25);
            double[] d = new double[n];
            for (int i = 0; i < n; i++) {
                // distinct magnitudes, random signs and a shift so that small p-values occur too
                d[i] = (i + 1 + rng.nextDouble() * 0.5) * (rng.nextDouble() < 0.3 + 0.02 * (trial % 20) ? 1 : -1);
            }
            SignedRankTest.Result r = SignedRankTest.test(d);
            assertTrue(r.exact());
            assertEquals(reference.test(d).getPValue(), r.pValue(), 1e-12, "trial " + trial);
        }
    }

    @Test
    @DisplayName("with ties (no zeros) the normal approximation equals Commons Statistics' asymptotic p-value with tie and continuity corrections")
    void approximationAgainstCommonsStatistics() {
        WilcoxonSignedRankTest reference = WilcoxonSignedRankTest.withDefaults().with(PValueMethod.ASYMPTOTIC);
        double[][] samples = {
            {2, -1, 3, 1, 1, 4, -2, 6, 7, 2, 3, -1},
            {1, 1, 1, 1, -1, 2, 2, 2, -3, 3, 3, 3, 4, 5, 5, -5, 6, 7, 8, 8},
            {-0.5, 0.25, 0.25, 0.25, -0.25, 1.5, 1.5, -1.5, 2, 3}};
        for (double[] d : samples) {
            assertEquals(reference.test(d).getPValue(), SignedRankTest.test(d, false).pValue(), 1e-12);
        }
    }

    @Test
    @DisplayName("zeros and ties: the exact p-value equals the enumeration of all 2^m sign patterns of the nonzero Pratt (1959) ranks")
    void exactAgainstEnumeration() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(7L);
        for (int trial = 0; trial < 100; trial++) {
            int n = 1 + rng.nextInt(14);
            double[] d = new double[n];
            for (int i = 0; i < n; i++) {
                d[i] = rng.nextInt(7) - 3;    // many zeros and ties
            }
            assertEquals(enumerated(d), SignedRankTest.test(d).pValue(), "trial " + trial);
        }
    }

    /** The definition: Pratt ranks of |d| (midranks, zeros included), zeros dropped, all sign flips equally likely. */
    private static Double enumerated(double[] d) {
        int n = d.length;
        double[] abs = new double[n];
        for (int i = 0; i < n; i++) {
            abs[i] = Math.abs(d[i]);
        }
        double[] rank = new NaturalRanking().apply(abs);
        double[] nonzero = new double[n];
        int m = 0;
        double observed = 0;
        double total = 0;
        for (int i = 0; i < n; i++) {
            if (d[i] != 0) {
                nonzero[m++] = rank[i];
                total += rank[i];
                observed += d[i] > 0 ? rank[i] : 0;
            }
        }
        if (m == 0) {
            return null;
        }
        double distance = Math.abs(observed - total / 2);
        int atLeast = 0;
        for (int signs = 0; signs < (1 << m); signs++) {
            double w = 0;
            for (int i = 0; i < m; i++) {
                w += (signs >> i & 1) == 1 ? nonzero[i] : 0;
            }
            atLeast += Math.abs(w - total / 2) >= distance - 1e-9 ? 1 : 0;
        }
        return (double) atLeast / (1 << m);
    }

    @Test
    @DisplayName("mostly zero differences, worked by hand (Pratt 1959): one nonzero among 15 gives p = 1, two equal give 1/2, three 1/4")
    void mostlyZeros() {
        double[] one = new double[15];
        one[14] = 0.1;
        // its rank is 15, W⁺ is 0 or 15 with probability ½ each: both as far from 7.5 as the observed 15
        SignedRankTest.Result r = SignedRankTest.test(one);
        assertEquals(1.0, r.pValue());
        assertEquals(14, r.zeros());
        assertEquals(15.0, r.statistic());
        double[] two = new double[15];
        two[13] = 0.1;
        two[14] = 0.1;
        // ranks 14.5 and 14.5; W⁺ ∈ {0, 14.5, 29} with probabilities ¼, ½, ¼; observed 29
        assertEquals(0.5, SignedRankTest.test(two).pValue(), 1e-15);
        double[] three = new double[15];
        three[12] = -0.1;
        three[13] = -0.1;
        three[14] = -0.1;
        // ranks 14 each; W⁺ = 0 (observed) or 42 have probability ⅛ each
        assertEquals(0.25, SignedRankTest.test(three).pValue(), 1e-15);
        assertNull(SignedRankTest.test(new double[15]).pValue());
        assertNull(SignedRankTest.test(new double[0]).pValue());
    }

    @Test
    @DisplayName("Commons Statistics 1.1 gives NaN on one nonzero difference among fifteen (why the test is our own); ours gives a p-value in [0, 1]")
    void commonsNaNCase() {
        double[] d = new double[15];
        d[14] = 0.1;
        assertTrue(Double.isNaN(WilcoxonSignedRankTest.withDefaults().test(d).getPValue()),
                "if Commons Statistics no longer returns NaN here, its handling of zeros may be used again");
        Double p = SignedRankTest.test(d).pValue();
        assertFalse(p.isNaN());
    }

    @Test
    @DisplayName("above the exact limit the normal approximation is used and agrees with the exact distribution to 0.01 at n = 200")
    void largeSamples() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(11L);
        double[] d = new double[SignedRankTest.EXACT_LIMIT];
        for (int i = 0; i < d.length; i++) {
            d[i] = rng.nextInt(21) - 9;
        }
        SignedRankTest.Result exact = SignedRankTest.test(d);
        SignedRankTest.Result approx = SignedRankTest.test(d, false);
        assertTrue(exact.exact());
        assertEquals(exact.pValue(), approx.pValue(), 0.01);
        double[] more = new double[SignedRankTest.EXACT_LIMIT + 1];
        assertFalse(SignedRankTest.test(more).exact());
        assertThrows(IllegalArgumentException.class, () -> SignedRankTest.test(new double[] {1, Double.NaN}));
    }
}
