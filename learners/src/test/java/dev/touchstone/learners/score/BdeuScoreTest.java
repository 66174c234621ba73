package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.math3.special.Gamma;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.HashMap;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class BdeuScoreTest {

    /**
     * Six rows of binary X and Y: (X, Y) = (0,0) three times, (0,1) once, (1,1) twice.
     */
    private static DataSet smallTable() {
        int[] x = {0, 0, 0, 0, 1, 1};
        int[] y = {0, 0, 0, 1, 1, 1};
        return DataSet.builder(6).discrete(Variable.discrete("X", 2), x).discrete(Variable.discrete("Y", 2), y).build();
    }

    @Test
    @DisplayName("closed form on a 2 × 2 table, ess = 2, by hand (Heckerman, Geiger and Chickering 1995, eq. 28)")
    void closedFormByHand() {
        BdeuScore bdeu = BdeuScore.of(smallTable(), 2.0);
        // Y | X: q = 2, r = 2, α/q = 1, α/(qr) = 1/2.
        // X = 0 (N = 4; 3, 1): Γ(1)/Γ(5) · Γ(3.5)/Γ(.5) · Γ(1.5)/Γ(.5) = (1/24) · 1.875 · 0.5
        // X = 1 (N = 2; 0, 2): Γ(1)/Γ(3) · 1 · Γ(2.5)/Γ(.5) = (1/2) · 0.75
        double expected = Math.log((1.0 / 24) * 1.875 * 0.5 * 0.5 * 0.75);
        assertEquals(expected, bdeu.localScore(1, new int[] {0}), 1e-12);
        // Y alone: q = 1, α = 2, α/r = 1, counts 3, 3: Γ(2)/Γ(8) · Γ(4)/Γ(1) · Γ(4)/Γ(1) = 36 / 5040 = 1/140
        assertEquals(Math.log(1.0 / 140), bdeu.localScore(1, new int[0]), 1e-12);
    }

    @Test
    @DisplayName("Markov-equivalent DAGs (a covered edge reversed) get equal BDeu (Heckerman et al. 1995, theorem 6)")
    void scoreEquivalence() {
        ScoreTesting.assertCoveredReversalsScoreEqual(seed -> BdeuScore.of(ScoreData.binary(
                RandomDags.erdosRenyi(7, 3.0, seed + 500), 200, seed), 1.0 + seed % 5));
    }

    @Test
    @DisplayName("many parents (sorted counting) agree with a direct count of the same formula (eq. 28)")
    void sortedCountingAgrees() {
        int rows = 400;
        int p = 12;
        UniformRandomProvider rng = Seeds.random(5);
        DataSet.Builder b = DataSet.builder(rows);
        for (int j = 0; j < p; j++) {
            int[] c = new int[rows];
            for (int r = 0; r < rows; r++) {
                c[r] = rng.nextInt(3);
            }
            b.discrete(Variable.discrete("V" + j, 3), c);
        }
        DataSet data = b.build();
        int[] parents = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10};
        double ess = 3.0;
        double q = Math.pow(3, parents.length);
        Map<String, int[]> counts = new HashMap<>();
        for (int r = 0; r < rows; r++) {
            StringBuilder key = new StringBuilder();
            for (int pa : parents) {
                key.append(data.discrete(pa)[r]).append(',');
            }
            counts.computeIfAbsent(key.toString(), k -> new int[3])[data.discrete(0)[r]]++;
        }
        double expected = 0;
        for (int[] c : counts.values()) {
            int nj = c[0] + c[1] + c[2];
            expected += Gamma.logGamma(ess / q) - Gamma.logGamma(ess / q + nj);
            for (int njk : c) {
                expected += Gamma.logGamma(ess / (3 * q) + njk) - Gamma.logGamma(ess / (3 * q));
            }
        }
        assertEquals(expected, BdeuScore.of(data, ess).localScore(0, parents), 1e-8 * Math.abs(expected));
    }

    @Test
    @DisplayName("rows with a missing cell are left out (list-wise deletion)")
    void listWise() {
        int[] x = {0, 0, 0, 0, 1, 1, DataSet.MISSING_CODE};
        int[] y = {0, 0, 0, 1, 1, 1, 0};
        DataSet holed = DataSet.builder(7).discrete(Variable.discrete("X", 2), x)
                .discrete(Variable.discrete("Y", 2), y).build();
        assertEquals(BdeuScore.of(smallTable(), 2.0).localScore(1, new int[] {0}),
                BdeuScore.of(holed, 2.0).localScore(1, new int[] {0}), 1e-12);
    }

    @Test
    @DisplayName("bad input gets one clear message")
    void rejectsBadInput() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> BdeuScore.of(smallTable(), -1));
        assertTrue(e.getMessage().contains("equivalent sample size"), e.getMessage());
        DataSet continuous = DataSet.builder(2).continuous("Z", new double[] {1, 2}).build();
        e = assertThrows(IllegalArgumentException.class, () -> BdeuScore.of(continuous, 1));
        assertTrue(e.getMessage().contains("'Z'"), e.getMessage());
    }
}
