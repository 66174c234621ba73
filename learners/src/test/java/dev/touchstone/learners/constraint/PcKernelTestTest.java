package dev.touchstone.learners.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The kernel tests as PC's {@code test}: a collider x → w ← y with w = x² + y² + noise (x, y
 * uniform on [−1, 1]) has no linear correlation between w and its parents, so Fisher z
 * finds no edge, while a consistent nonlinear test gives PC the skeleton and, x and y being
 * independent, the collider (Spirtes, Glymour and Scheines 2000: the v-structure is
 * identified from the separating set ∅ of x and y). Data invented for this check.
 */
class PcKernelTestTest {

    private static DataSet collider(int n, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] x = new double[n];
        double[] y = new double[n];
        double[] w = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 2 * rng.nextDouble() - 1;
            y[i] = 2 * rng.nextDouble() - 1;
            w[i] = x[i] * x[i] + y[i] * y[i] + 0.1 * g.sample();
        }
        return DataSet.builder(n).continuous("x", x).continuous("y", y).continuous("w", w).build();
    }

    private static Graph run(DataSet data, String test) {
        PcLearner pc = new PcLearner();
        return pc.learn(LearnerInput.of(data), Knowledge.none(), ParameterValues.resolve("pc",
                pc.description().parameters(), Map.of("test", test, "alpha", 0.01)), RunContext.of(7, null, 1)).graph();
    }

    @ParameterizedTest(name = "test = {0}, n = {1}")
    @CsvSource({"kci, 400", "rcit, 1000"})
    @DisplayName("PC with a kernel test orients x → w ← y where w = x² + y² + e; with Fisher z it finds no edge")
    void findsNonlinearCollider(String test, int n) {
        // RCIT, with 5 random features per variable, needs more rows than KCI for the same power.
        DataSet data = collider(n, 3);
        Graph g = run(data, test);
        assertTrue(g.hasDirected(0, 2) && g.hasDirected(1, 2), g.edges().toString());
        assertFalse(g.adjacent(0, 1), g.edges().toString());
        Graph linear = run(data, "fisher-z");
        assertTrue(linear.edgeCount() == 0, linear.edges().toString());
    }
}
