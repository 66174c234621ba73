package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DSeparation;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * GES with the oracle on dense truths. Chickering (2002, theorem 4) proves that GES with a
 * score consistent for the model returns the true CPDAG when the distribution is faithful. The
 * oracle's BIC stands for {@value BicScore#ORACLE_SAMPLE_SIZE} rows, so it sees a dependence only
 * when its partial correlation ρ satisfies n/2·ln(1/(1−ρ²)) > ln(n)/2, that is ρ² above about
 * 2·10⁻⁸ (|ρ| ≳ 1.4·10⁻⁴); a truth with a d-connected pair whose partial correlation is smaller
 * is faithful in principle but not at that n (near-unfaithful; Uhler, Raskutti, Bühlmann and Yu
 * 2013, Annals of Statistics 41, show how common such truths become as graphs grow denser).
 * This test classifies every truth by its smallest partial correlation over all d-connected
 * (i, j | S), and demands exact recovery of every truth that is clearly faithful at the
 * oracle's n; near-unfaithful truths are counted and reported, not hidden.
 */
class GesOracleDenseTest {

    /**
     * Truths whose smallest d-connected |ρ| lies below this are near-unfaithful: √(ln n / n) at
     * the oracle's n, the |ρ| at which one more parameter's BIC penalty equals its gain.
     */
    static final double NEAR_UNFAITHFUL = Math.sqrt(Math.log(BicScore.ORACLE_SAMPLE_SIZE)
            / BicScore.ORACLE_SAMPLE_SIZE);

    private static final GesLearner GES = new GesLearner();

    @Test
    @DisplayName("oracle GES recovers the true CPDAG of 300 seeded Erdős–Rényi truths, 6 to 10 variables, mean"
            + " degree 2 to 4, except near-unfaithful ones (smallest d-connected |ρ| < 1e-3), which are counted")
    void denseTruths() {
        List<String> misses = new ArrayList<>();
        int nearUnfaithful = 0;
        int nearUnfaithfulMissed = 0;
        int checked = 0;
        for (long seed = 1; seed <= 300; seed++) {
            int p = 6 + (int) (seed % 5);
            double degree = 2.0 + (seed % 5) * 0.5;
            Graph dag = RandomDags.erdosRenyi(p, degree, 9000 + seed);
            CovarianceMatrix sigma = PopulationCovariance.of(dag, 0.5, 2.0, seed + 31);
            ParameterValues values = ParameterValues.resolve("test", GES.description().parameters(), Map.of());
            Estimate e = GES.learn(LearnerInput.of(new Oracle(dag, sigma)), Knowledge.none(), values,
                    RunContext.of(1, Duration.ofMinutes(2), 1));
            assertEquals(GraphClass.CPDAG, e.graphClass());
            double weakest = weakestDependence(dag, sigma);
            boolean near = weakest < NEAR_UNFAITHFUL;
            nearUnfaithful += near ? 1 : 0;
            if (!e.graph().equals(Cpdags.of(dag))) {
                if (near) {
                    nearUnfaithfulMissed++;
                    System.out.printf(Locale.ROOT, "near-unfaithful miss: seed %d, weakest |rho| %.2e%n", seed,
                            weakest);
                } else {
                    misses.add(String.format(Locale.ROOT, "seed %d (p=%d, %d edges, weakest |rho| %.2e): truth %s"
                            + " | got %s", seed, p, dag.edgeCount(), weakest, Cpdags.of(dag), e.graph()));
                }
            }
            checked++;
        }
        assertEquals(300, checked);
        System.out.printf(Locale.ROOT, "oracle GES on 300 dense truths: %d near-unfaithful (|rho| < %.2e), %d of"
                + " them missed; %d faithful truths missed%n", nearUnfaithful, NEAR_UNFAITHFUL, nearUnfaithfulMissed,
                misses.size());
        assertTrue(misses.isEmpty(), misses.size() + " faithful truths missed:\n" + String.join("\n", misses));
        // the bar must not be met by declaring everything near-unfaithful
        // (measured: 71 of 300, of which GES still recovers 70; the one miss has |rho| 2e-5)
        assertTrue(nearUnfaithful <= 100, nearUnfaithful + " of 300 truths near-unfaithful");
    }

    @Test
    @DisplayName("the partial correlation helper: zero exactly where d-separation holds, on a collider and a chain")
    void partialCorrelationMatchesSeparation() {
        Graph dag = RandomDags.erdosRenyi(6, 2.5, 77);
        CovarianceMatrix sigma = PopulationCovariance.of(dag, 0.5, 2.0, 5);
        DSeparation d = new DSeparation(dag);
        int p = dag.size();
        for (int i = 0; i < p; i++) {
            for (int j = i + 1; j < p; j++) {
                for (int mask = 0; mask < 1 << p; mask++) {
                    if ((mask >> i & 1) != 0 || (mask >> j & 1) != 0) {
                        continue;
                    }
                    int[] s = members(mask, p);
                    double r = Math.abs(partialCorrelation(sigma, i, j, s));
                    if (d.separated(i, j, s)) {
                        assertTrue(r < 1e-9, "separated yet |rho| = " + r);
                    }
                }
            }
        }
    }

    /** The smallest |ρ(i, j | S)| over all pairs and all S that d-connect them. */
    static double weakestDependence(Graph dag, CovarianceMatrix sigma) {
        DSeparation d = new DSeparation(dag);
        int p = dag.size();
        double weakest = Double.POSITIVE_INFINITY;
        for (int i = 0; i < p; i++) {
            for (int j = i + 1; j < p; j++) {
                for (int mask = 0; mask < 1 << p; mask++) {
                    if ((mask >> i & 1) != 0 || (mask >> j & 1) != 0) {
                        continue;
                    }
                    int[] s = members(mask, p);
                    if (!d.separated(i, j, s)) {
                        weakest = Math.min(weakest, Math.abs(partialCorrelation(sigma, i, j, s)));
                    }
                }
            }
        }
        return weakest;
    }

    private static int[] members(int mask, int p) {
        int[] s = new int[Integer.bitCount(mask)];
        int k = 0;
        for (int v = 0; v < p; v++) {
            if ((mask >> v & 1) != 0) {
                s[k++] = v;
            }
        }
        return s;
    }

    /**
     * ρ(i, j | S) = −P₁₂ / √(P₁₁ P₂₂) with P the inverse of Σ restricted to {i, j} ∪ S
     * (common practice), the inverse by Gauss–Jordan elimination with partial pivoting.
     */
    static double partialCorrelation(CovarianceMatrix sigma, int i, int j, int[] s) {
        int m = s.length + 2;
        int[] idx = new int[m];
        idx[0] = i;
        idx[1] = j;
        System.arraycopy(s, 0, idx, 2, s.length);
        double[][] a = new double[m][2 * m];
        for (int r = 0; r < m; r++) {
            for (int c = 0; c < m; c++) {
                a[r][c] = sigma.get(idx[r], idx[c]);
            }
            a[r][m + r] = 1;
        }
        for (int c = 0; c < m; c++) {
            int pivot = c;
            for (int r = c + 1; r < m; r++) {
                if (Math.abs(a[r][c]) > Math.abs(a[pivot][c])) {
                    pivot = r;
                }
            }
            double[] t = a[c];
            a[c] = a[pivot];
            a[pivot] = t;
            double d = a[c][c];
            for (int k = 0; k < 2 * m; k++) {
                a[c][k] /= d;
            }
            for (int r = 0; r < m; r++) {
                if (r != c && a[r][c] != 0) {
                    double f = a[r][c];
                    for (int k = 0; k < 2 * m; k++) {
                        a[r][k] -= f * a[c][k];
                    }
                }
            }
        }
        return -a[0][m + 1] / Math.sqrt(a[0][m] * a[1][m + 1]);
    }
}
