package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ConditionalGaussianTestTest {

    @Test
    @DisplayName("all continuous: statistic is −n ln(1 − r²) with r from OLS residuals (Commons Math), 1 df")
    void continuousReducesToGaussianLrt() {
        double[][] cols = TestData.correlated(5, 250, 31);
        ConditionalGaussianTest cg = new ConditionalGaussianTest(TestData.continuous(cols), 0.05);
        int[][] zs = {{}, {2}, {2, 3}, {2, 3, 4}};
        for (int[] z : zs) {
            double r = FisherZTestTest.residualCorrelation(cols, 0, 1, z);
            ConditionalGaussianTest.Result res = cg.evaluate(0, 1, z);
            assertEquals(-250 * Math.log(1 - r * r), res.statistic(), 1e-6);
            assertEquals(1, res.degreesOfFreedom());
        }
    }

    @Test
    @DisplayName("all discrete: statistic and df equal G² (itself checked against Commons Math GTest)")
    void discreteReducesToGSquare() {
        int[] cards = {3, 2, 3};
        int[][] codes = TestData.discrete(cards, 600, 0.4, 32);
        DataSet data = TestData.discreteData(codes, cards);
        ConditionalGaussianTest cg = new ConditionalGaussianTest(data, 0.05);
        ContingencyTest g2 = new ContingencyTest(data, ContingencyTest.Statistic.G_SQUARE, 0.05);
        for (int[] xyz : new int[][] {{0, 1}, {0, 2}, {1, 2, 0}, {0, 2, 1}}) {
            int[] z = java.util.Arrays.copyOfRange(xyz, 2, xyz.length);
            ConditionalGaussianTest.Result a = cg.evaluate(xyz[0], xyz[1], z);
            ContingencyTest.Result b = g2.evaluate(xyz[0], xyz[1], z);
            assertEquals(b.statistic(), a.statistic(), 1e-7);
            assertEquals(b.degreesOfFreedom(), a.degreesOfFreedom());
            assertEquals(b.pValue(), a.pValue(), 1e-9);
        }
    }

    /** D (3 categories) → C1 → C2 and D → C2 when {@code linked}; C3 independent noise. */
    private static DataSet mixed(int n, boolean linked, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        int[] d = new int[n];
        double[] c1 = new double[n];
        double[] c2 = new double[n];
        for (int r = 0; r < n; r++) {
            d[r] = rng.nextInt(3);
            c1[r] = (d[r] - 1) * 0.8 + g.sample();
            c2[r] = 0.7 * c1[r] + (linked ? 0.6 * (d[r] == 2 ? 1 : 0) : 0) + g.sample();
        }
        return DataSet.builder(n).discrete(Variable.discrete("D", 3), d).continuous("C1", c1)
                .continuous("C2", c2).build();
    }

    @Test
    @DisplayName("mixed: type I error near alpha under independence, power under dependence (common practice)")
    void mixedCalibrationAndPower() {
        int rejections = 0;
        int reps = 300;
        for (int rep = 0; rep < reps; rep++) {
            ConditionalGaussianTest cg = new ConditionalGaussianTest(mixed(200, false, 100 + rep), 0.05);
            if (!cg.independent(0, 2, new int[] {1})) {
                rejections++;
            }
        }
        double rate = rejections / (double) reps;
        assertTrue(rate > 0.015 && rate < 0.10, "rejection rate under independence " + rate);
        int detected = 0;
        for (int rep = 0; rep < 50; rep++) {
            ConditionalGaussianTest cg = new ConditionalGaussianTest(mixed(500, true, 1000 + rep), 0.05);
            if (!cg.independent(0, 2, new int[] {1})) {
                detected++;
            }
            // D and C1 are dependent, unconditionally.
            assertTrue(!cg.independent(0, 1, new int[0]));
        }
        assertTrue(detected >= 40, "power " + detected + "/50");
        ConditionalGaussianTest cg = new ConditionalGaussianTest(mixed(300, true, 5), 0.05);
        assertEquals(cg.evaluate(0, 2, new int[] {1}).statistic(), cg.evaluate(2, 0, new int[] {1}).statistic(), 1e-9,
                "the statistic is symmetric in x and y");
        assertEquals(6, cg.evaluate(0, 2, new int[] {1}).degreesOfFreedom(),
                "C2 | D, C1 has intercept, slope and variance in each of 3 cells against one set under the null: "
                        + "(3 − 1) × 3");
    }
}
