package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.statistics.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Calibration and power of the kernel tests KCI (Zhang, Peters, Janzing and Schölkopf 2011,
 * UAI) and RCIT (Strobl, Zhang and Visweswaran 2019, Journal of Causal Inference 7) over 300
 * seeded cases per setting at n = 500, the heavier part of their checks (a few seconds each
 * on the shared machine), kept apart from the formula checks of {@link KciTestTest} and
 * {@link RcitTestTest}.
 *
 * <p><b>Null.</b> A valid test's p-values are uniform on [0, 1] under its null hypothesis;
 * checking that with the Kolmogorov–Smirnov test against the uniform (Commons Statistics'
 * {@code KolmogorovSmirnovTest}) at level 0.01 is common practice. Two nulls: x, y, z
 * mutually independent (tested given ∅), and x = sin z + e, y = z²/2 + e' (tested given z,
 * the nonlinear common cause). <b>Power</b> at α = 0.05 against y = sin(2x) + e and
 * y = x² + e: rejected in at least 90% of the cases (threshold chosen here, common practice
 * for a power check), where Fisher z, whose statistic is the correlation, rejects y = x² in at
 * most 20% (x uniform on [−1, 1] makes x and x² uncorrelated; see {@link KernelNullData}).
 * Each check prints its figures so that the documentation can quote them.
 */
class KernelCalibrationTest {

    private static final int CASES = 300;
    private static final int N = 500;

    private static final IndependenceTestFactory KCI = d -> KciTest.of(d, 0.05, KciTest.Settings.defaults(3));
    private static final IndependenceTestFactory RCIT = d -> RcitTest.of(d, 0.05, RcitTest.Settings.defaults(4));

    /** p-values of x ⟂ y | z (or given ∅) over seeded samples. */
    private static double[] pValues(IndependenceTestFactory factory, KernelNullData.Case c, int[] z, int cases, int n, long seed) {
        double[] p = new double[cases];
        for (int k = 0; k < cases; k++) {
            DataSet data = KernelNullData.sample(c, n, Seeds.derive(seed, c, k));
            p[k] = factory.of(data).pValue(0, 1, z);
        }
        return p;
    }

    /** Builds a test on a data set. */
    interface IndependenceTestFactory {
        IndependenceTest of(DataSet data);
    }

    /** The KS p-value of the sample against the uniform on [0, 1] (Commons Statistics). */
    private static double uniformity(double[] p) {
        return KolmogorovSmirnovTest.withDefaults().test(p, v -> Math.min(1, Math.max(0, v))).getPValue();
    }

    /** How many p-values fall below alpha. */
    private static int rejections(double[] p, double alpha) {
        return (int) Arrays.stream(p).filter(v -> v < alpha).count();
    }

    private static void assertUniform(String what, double[] p) {
        double ks = uniformity(p);
        System.out.printf("%s: KS p = %.4f over %d cases; p < 0.05 in %d, p < 0.01 in %d%n", what, ks, p.length,
                rejections(p, 0.05), rejections(p, 0.01));
        assertTrue(ks > 0.01, what + ": KS p = " + ks + ", p-values " + Arrays.toString(p));
    }

    private static void assertPower(String what, double[] p, double atLeast) {
        int rejected = rejections(p, 0.05);
        System.out.printf("%s: rejected %d of %d at α = 0.05%n", what, rejected, p.length);
        assertTrue(rejected >= atLeast * p.length, what + ": " + rejected + " of " + p.length + " " + Arrays.toString(p));
    }

    @Test
    @DisplayName("KCI null, n = 500: p-values uniform by KS (p > 0.01) over 300 independent and 300 conditionally independent (nonlinear common cause) cases")
    void kciNull() {
        assertUniform("KCI, independent, S = ∅",
                pValues(KCI, KernelNullData.Case.INDEPENDENT, new int[0], CASES, N, 111));
        assertUniform("KCI, common cause, S = {z}",
                pValues(KCI, KernelNullData.Case.COMMON_CAUSE, new int[] {2}, CASES, N, 112));
    }

    @Test
    @DisplayName("RCIT null, n = 500: p-values uniform by KS (p > 0.01) over 300 independent and 300 conditionally independent (nonlinear common cause) cases")
    void rcitNull() {
        assertUniform("RCIT, independent, S = ∅",
                pValues(RCIT, KernelNullData.Case.INDEPENDENT, new int[0], CASES, N, 131));
        assertUniform("RCIT, common cause, S = {z}",
                pValues(RCIT, KernelNullData.Case.COMMON_CAUSE, new int[] {2}, CASES, N, 132));
    }

    @Test
    @DisplayName("KCI power, n = 500: sin(2x) + e and x² + e rejected in ≥ 90% of 300 cases each, the common cause's marginal dependence too; Fisher z rejects x² + e in ≤ 20%")
    void kciPower() {
        assertPower("KCI, y = sin(2x) + e", pValues(KCI, KernelNullData.Case.SINE, new int[0], CASES, N, 121), 0.9);
        assertPower("KCI, y = x² + e", pValues(KCI, KernelNullData.Case.SQUARE, new int[0], CASES, N, 122), 0.9);
        assertPower("KCI, common cause, S = ∅",
                pValues(KCI, KernelNullData.Case.COMMON_CAUSE, new int[0], CASES, N, 123), 0.9);
        double[] fisher = pValues(d -> FisherZTest.of(d, 0.05), KernelNullData.Case.SQUARE, new int[0], CASES, N, 122);
        int rejected = rejections(fisher, 0.05);
        System.out.printf("Fisher z, y = x² + e: rejected %d of %d at α = 0.05%n", rejected, CASES);
        assertTrue(rejected <= 0.2 * CASES, "Fisher z rejected " + rejected + " of " + CASES);
    }

    @Test
    @DisplayName("RCIT power, n = 500: sin(2x) + e and x² + e rejected in ≥ 90% of 300 cases each, the common cause's marginal dependence too")
    void rcitPower() {
        assertPower("RCIT, y = sin(2x) + e", pValues(RCIT, KernelNullData.Case.SINE, new int[0], CASES, N, 141), 0.9);
        assertPower("RCIT, y = x² + e", pValues(RCIT, KernelNullData.Case.SQUARE, new int[0], CASES, N, 142), 0.9);
        assertPower("RCIT, common cause, S = ∅",
                pValues(RCIT, KernelNullData.Case.COMMON_CAUSE, new int[0], CASES, N, 143), 0.9);
    }
}
