package dev.touchstone.learners.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Finite-sample sanity (common practice, not from a source): linear Gaussian data over 20
 * variables with mean degree 2 and n = 10,000 let PC with Fisher z find the adjacencies with
 * precision and recall of at least 0.9. Data from core's minimal linear-Gaussian sampler
 * (weights ±[0.5, 1.5], unit noise).
 */
class PcFiniteSampleTest {

    @Test
    @DisplayName("PC, Fisher z, p = 20, mean degree 2, n = 10,000: adjacency precision and recall ≥ 0.9, 5 seeds")
    void adjacencyPrecisionAndRecall() {
        PcLearner pc = new PcLearner();
        for (long seed = 1; seed <= 5; seed++) {
            Graph dag = RandomDags.erdosRenyi(20, 2.0, 900 + seed);
            DataSet data = SmallData.linearGaussian(dag, 10_000, 950 + seed);
            for (String skeleton : new String[] {"sequential", "order-independent"}) {
                Graph g = pc.learn(LearnerInput.of(data), Knowledge.none(), ParameterValues.resolve("pc",
                        pc.description().parameters(), Map.of("alpha", 0.01, "skeleton", skeleton)),
                        RunContext.of(1, null, 2)).graph();
                int tp = 0;
                for (int a = 0; a < 20; a++) {
                    for (int b = a + 1; b < 20; b++) {
                        if (g.adjacent(a, b) && dag.adjacent(a, b)) {
                            tp++;
                        }
                    }
                }
                double precision = g.edgeCount() == 0 ? 0 : tp / (double) g.edgeCount();
                double recall = tp / (double) dag.edgeCount();
                assertTrue(precision >= 0.9 && recall >= 0.9, "seed " + seed + " " + skeleton + ": precision "
                        + precision + ", recall " + recall);
            }
        }
    }
}
