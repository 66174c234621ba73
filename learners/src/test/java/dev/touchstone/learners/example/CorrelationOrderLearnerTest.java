package dev.touchstone.learners.example;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.junit.jupiter.api.Test;

import java.util.Map;
import java.util.ServiceLoader;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The example learner does what its comment says, checked against Commons Math's Pearson correlation. */
class CorrelationOrderLearnerTest {

    @Test
    void joinsExactlyThePairsAboveTheThresholdAlongTheOrder() {
        DataSet data = SmallData.linearGaussian(RandomDags.erdosRenyi(8, 2.0, 4), 300, 9);
        double threshold = 0.2;
        Learner learner = new CorrelationOrderLearner();
        ParameterValues values = ParameterValues.resolve("learner example-correlation-order",
                learner.description().parameters(), Map.of("threshold", threshold));
        Graph g = learner.learn(LearnerInput.of(data), Knowledge.none(), values, RunContext.unlimited(1)).graph();
        double[][] columns = new double[data.rows()][data.columns()];
        for (int j = 0; j < data.columns(); j++) {
            double[] x = data.continuous(j);
            for (int i = 0; i < data.rows(); i++) {
                columns[i][j] = x[i];
            }
        }
        double[][] r = new PearsonsCorrelation(columns).getCorrelationMatrix().getData();
        int expected = 0;
        for (int i = 0; i < data.columns(); i++) {
            for (int j = i + 1; j < data.columns(); j++) {
                boolean above = Math.abs(r[i][j]) > threshold;
                expected += above ? 1 : 0;
                assertEquals(above, g.hasDirected(i, j), "pair " + i + ", " + j + " with r = " + r[i][j]);
            }
        }
        assertEquals(expected, g.edgeCount(), "no other edges");
        assertTrue(expected > 0 && expected < 28, "the data must leave pairs on both sides: " + expected);
    }

    @Test
    void isFoundThroughItsRegistration() {
        boolean found = false;
        for (Learner l : ServiceLoader.load(Learner.class)) {
            found |= l instanceof CorrelationOrderLearner;
        }
        assertTrue(found, "the test tree's META-INF/services file registers the example learner");
    }
}
