package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The speed-ups of the kernel tests leave their results unchanged: KCI (conditioning system
 * factorised once per test instead of once per residual kernel), HSIC (each sample's centred
 * Gram matrix prepared once), the shared kernel widths and standardised columns (kept by the
 * data set instead of by each test), and RCIT (conditioning-set Cholesky factors cached, x's
 * and y's features regressed together, the blocked cross product). The expected values were
 * recorded from the implementation before these changes (commit 0050f0e) on the seeded data
 * below, printed with 17 significant digits.
 *
 * <p>KCI and HSIC do the same arithmetic as before and must agree to the last bits (relative
 * 10⁻¹², which leaves room only for a platform's last-ulp differences in {@code Math.exp}).
 * RCIT's blocked sums round differently for n &gt; 1,024, and its ridge regression of the
 * features on the conditioning features (ridge 10⁻¹⁰ n on nearly collinear cosine features)
 * magnifies that round-off: the measured relative differences were ≤ 3.3·10⁻⁷ for the
 * statistic and ≤ 2.8·10⁻⁶ for the p-value (far in the tail, where p changes fastest with the
 * statistic), so it must agree to relative 10⁻⁵. RCIT's conditional results are thus only
 * reproducible to about 10⁻⁷ under any change of summation order, old or new.
 */
class KernelEquivalenceTest {

    /** Chain X0 → … → X4, each sin(2·) or (·)² of the previous plus Gaussian noise; X3 missing in every 7th row if asked. */
    static DataSet chain(int n, int p, long seed, boolean missing) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        DataSet.Builder b = DataSet.builder(n);
        double[] previous = null;
        for (int j = 0; j < p; j++) {
            double[] x = new double[n];
            for (int i = 0; i < n; i++) {
                double parent = previous == null ? 0 : (j % 2 == 0 ? Math.sin(2 * previous[i]) : previous[i] * previous[i]);
                x[i] = parent + g.sample();
            }
            previous = x.clone();
            if (missing && j == 3) {
                for (int i = 0; i < n; i += 7) {
                    x[i] = Double.NaN;
                }
            }
            b.continuous("X" + j, x);
        }
        return b.build();
    }

    /**
     * Per row: missing cells or not, the test (x, y, S…), then statistic and p-value of KCI
     * (defaults, n = 600, every row), of KCI on a row subset (rank 50, 400 of 600 rows) and of
     * RCIT (defaults, n = 3,000), as recorded before the changes.
     */
    private static final Object[][] RECORDED = {
            {false, new int[] {0, 1}, 7.1924265522513880, 2.1751519376182723E-50, 5.0147687867109845, 1.3680903721038998E-33, 1899.6137293045779, 2.6466477078629590E-262},
            {false, new int[] {0, 1, 2}, 2.0735793624320410, 1.0389873881795963E-20, 1.4169292455363773, 2.7157109154546007E-13, 365.24136470301704, 3.2293564437035580E-61},
            {false, new int[] {0, 1, 2, 3}, 1.0966284231186160, 1.3298793582184722E-14, 0.75535227100244910, 1.2202978188251806E-09, 673.74598026381900, 6.9972007613566170E-160},
            {false, new int[] {1, 3, 2}, 0.032313328285655260, 0.66293166609334090, 0.032671408128199284, 0.66805942603290600, 0.16219613244570572, 0.67370385853795290},
            {false, new int[] {0, 4, 1, 2}, 0.074107873982191510, 0.26012860713122327, 0.072539639601301720, 0.25794337229021840, 0.48621895840013600, 0.85501138124448200},
            {false, new int[] {4, 2, 3}, 0.14703183958092860, 0.096268609778730360, 0.035912562535842430, 0.82995730968772090, 0.96230090615683230, 0.80851208097966350},
            {true, new int[] {0, 1}, 7.1924265522513880, 2.1751519376182723E-50, 5.0147687867109845, 1.3680903721038998E-33, 1899.6137293045779, 2.6466477078629590E-262},
            {true, new int[] {0, 1, 2}, 2.0735793624320410, 1.0389873881795963E-20, 1.4169292455363773, 2.7157109154546007E-13, 365.24136470301704, 3.2293564437035580E-61},
            {true, new int[] {0, 1, 2, 3}, 1.0019778747250290, 2.9056450537150720E-13, 0.78419409295049000, 2.4828876332400830E-10, 543.55691421402810, 1.4755840168450693E-131},
            {true, new int[] {1, 3, 2}, 0.028514400470775737, 0.70595011052001870, 0.038773239528460830, 0.52075704960567970, 0.093692618089519550, 0.81544380382019410},
            {true, new int[] {0, 4, 1, 2}, 0.074107873982191510, 0.26012860713122327, 0.072539639601301720, 0.25794337229021840, 0.48621895840013600, 0.85501138124448200},
            {true, new int[] {4, 2, 3}, 0.11805447508192955, 0.19827921460225084, 0.10381425349737412, 0.26265349333674715, 1.0463859098967416, 0.78498674515011220},
    };

    private static void close(double expected, double actual, double relative, String what) {
        assertEquals(expected, actual, relative * Math.abs(expected), what);
    }

    @Test
    @DisplayName("KCI (all rows and a row subset) and RCIT give the recorded statistics and p-values on seeded chains, with and without missing cells")
    void kciAndRcitUnchanged() {
        for (boolean missing : new boolean[] {false, true}) {
            DataSet d600 = chain(600, 5, 7, missing);
            KciTest kci = KciTest.of(d600, 0.05, KciTest.Settings.defaults(3));
            KciTest subset = KciTest.of(d600, 0.05, new KciTest.Settings(50, 1e-3, 400, 5));
            RcitTest rcit = RcitTest.of(chain(3000, 5, 8, missing), 0.05, RcitTest.Settings.defaults(4));
            for (Object[] row : RECORDED) {
                if ((boolean) row[0] != missing) {
                    continue;
                }
                int[] t = (int[]) row[1];
                int[] z = Arrays.copyOfRange(t, 2, t.length);
                String what = (missing ? "missing cells, " : "") + Arrays.toString(t);
                // Twice each: the second call finds the widths, columns and RCIT's factor cached.
                for (int repeat = 0; repeat < 2; repeat++) {
                    KciTest.Result k = kci.compute(t[0], t[1], z);
                    close((double) row[2], k.statistic(), 1e-12, "KCI statistic " + what);
                    close((double) row[3], k.pValue(), 1e-12, "KCI p " + what);
                    KciTest.Result s = subset.compute(t[0], t[1], z);
                    close((double) row[4], s.statistic(), 1e-12, "KCI subset statistic " + what);
                    close((double) row[5], s.pValue(), 1e-12, "KCI subset p " + what);
                    KciTest.Result r = rcit.compute(t[0], t[1], z);
                    close((double) row[6], r.statistic(), 1e-5, "RCIT statistic " + what);
                    close((double) row[7], r.pValue(), 1e-5, "RCIT p " + what);
                }
            }
        }
    }

    @Test
    @DisplayName("HSIC gives the recorded statistic and p-value, from columns and from prepared samples")
    void hsicUnchanged() {
        DataSet d = chain(300, 3, 9, false);
        double[][] u = {d.continuous(0)};
        double[][] v = {d.continuous(1), d.continuous(2)};
        for (Hsic.Result r : new Hsic.Result[] {Hsic.test(u, v), Hsic.test(Hsic.sample(u), Hsic.sample(v))}) {
            close(2.3077579271248556, r.statistic(), 1e-12, "HSIC statistic");
            close(1.3711612423220223E-17, r.pValue(), 1e-12, "HSIC p");
        }
    }
}
