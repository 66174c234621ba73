package dev.touchstone.learners.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.learners.independence.MissingnessCauses;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * MVPC against the situation its paper was written for (Tu, Zhang, Ackermann, Mohan,
 * Kjellström and Zhang 2019, AISTATS; the motivating case of their introduction, from
 * memory): X and Y independent causes of a collider Z, and X's values missing more often
 * when Z is large. The rows where X is observed are selected on Z, so X and Y are dependent
 * in them; test-wise deletion keeps a spurious edge X — Y, which the correction removes.
 */
class MvpcLearnerTest {

    private static final int X = 0;
    private static final int Y = 1;
    private static final int Z = 2;

    /** X, Y ~ N(0, 1); Z = X + Y + N(0, 0.5²); X missing with probability 1 / (1 + exp(−3Z)). */
    private static DataSet colliderDrivenMissingness(int n, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] x = new double[n];
        double[] y = new double[n];
        double[] z = new double[n];
        for (int r = 0; r < n; r++) {
            x[r] = g.sample();
            y[r] = g.sample();
            z[r] = x[r] + y[r] + 0.5 * g.sample();
            if (rng.nextDouble() < 1 / (1 + Math.exp(-3 * z[r]))) {
                x[r] = Double.NaN;
            }
        }
        return DataSet.builder(n).continuous("X", x).continuous("Y", y).continuous("Z", z).build();
    }

    private static Graph learn(String id, DataSet data, Map<String, Object> raw, long seed) {
        var learner = id.equals("mvpc") ? new MvpcLearner() : new PcLearner();
        ParameterValues values = ParameterValues.resolve(id, learner.description().parameters(), raw);
        return learner.learn(LearnerInput.of(data), Knowledge.none(), values, RunContext.unlimited(seed)).graph();
    }

    @Test
    @DisplayName("the cause of X's missingness indicator is found: Z, not Y (Y is separated from it by Z)")
    void findsTheCauseOfTheIndicator() {
        int right = 0;
        for (int rep = 0; rep < 10; rep++) {
            int[][] causes = MissingnessCauses.find(colliderDrivenMissingness(4000, 100 + rep), 0.01, 2,
                    RunContext.unlimited(1));
            right += Arrays.equals(causes[X], new int[] {Z}) ? 1 : 0;
            assertArrayEquals(new int[0], causes[Y], "Y has no missing cells");
        }
        // Threshold chosen here: a level-0.01 search may keep Y by chance now and then.
        assertTrue(right >= 9, "indicator causes exactly {Z} in " + right + " of 10");
    }

    @Test
    @DisplayName("test-wise deletion keeps the spurious edge X — Y in most replicates; MVPC's correction removes it")
    void correctionRemovesTheSpuriousEdge() {
        int deletionKeeps = 0;
        int correctedKeeps = 0;
        int correctedRight = 0;
        for (int rep = 0; rep < 10; rep++) {
            DataSet data = colliderDrivenMissingness(4000, 200 + rep);
            Graph deletion = learn("pc", data, Map.of("alpha", 0.01, "missing", "test-wise"), rep);
            Graph corrected = learn("mvpc", data, Map.of("alpha", 0.01), rep);
            deletionKeeps += deletion.adjacent(X, Y) ? 1 : 0;
            correctedKeeps += corrected.adjacent(X, Y) ? 1 : 0;
            correctedRight += !corrected.adjacent(X, Y) && corrected.adjacent(X, Z) && corrected.adjacent(Y, Z) ? 1 : 0;
        }
        // Thresholds chosen here; the bias is strong at this selection, so deletion keeps the edge almost always.
        assertTrue(deletionKeeps >= 8, "test-wise deletion kept X — Y in " + deletionKeeps + " of 10");
        assertTrue(correctedKeeps <= 2, "MVPC kept X — Y in " + correctedKeeps + " of 10");
        assertTrue(correctedRight >= 8, "MVPC found exactly the skeleton X — Z — Y in " + correctedRight + " of 10");
    }

    @Test
    @DisplayName("without missing cells MVPC is PC with Fisher z: the same estimate")
    void withoutMissingCellsItIsPc() {
        UniformRandomProvider rng = Seeds.random(5);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        int n = 500;
        double[][] c = new double[4][n];
        for (int r = 0; r < n; r++) {
            c[0][r] = g.sample();
            c[1][r] = 0.8 * c[0][r] + g.sample();
            c[2][r] = g.sample();
            c[3][r] = 0.7 * c[1][r] - 0.6 * c[2][r] + g.sample();
        }
        DataSet data = DataSet.builder(n).continuous("A", c[0]).continuous("B", c[1]).continuous("C", c[2])
                .continuous("D", c[3]).build();
        assertEquals(learn("pc", data, Map.of("alpha", 0.01, "test", "fisher-z"), 1),
                learn("mvpc", data, Map.of("alpha", 0.01), 1));
    }
}
