package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.SimulatedReplicate;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GivenGraphFamily;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.models.ModelKinds;

import java.util.Map;

/**
 * Seeded data for the score tests, drawn with the generators module's models (its own
 * checks cover them): linear Gaussian equations with its default weights ±[0.5, 2] and
 * unit noise, and discrete networks with two categories. Public for the baseline tests.
 */
public final class ScoreData {

    private ScoreData() {
    }

    /** n rows of the linear Gaussian model on a given DAG. */
    public static DataSet linearGaussian(Graph dag, int rows, long seed) {
        return Simulation.builder()
                .graph(GivenGraphFamily.of(dag), Map.of())
                .model(ModelKinds.byId("linear-gaussian"), Map.of())
                .build().drawTruth(seed).sample(rows).data();
    }

    /** n rows of the linear Gaussian model on an Erdős–Rényi DAG of p nodes with this mean degree. */
    static DataSet linearGaussian(int p, double meanDegree, int rows, long seed) {
        return linearGaussianReplicate(p, meanDegree, rows, seed).data();
    }

    /** Truth and n rows of the linear Gaussian model on an Erdős–Rényi DAG of p nodes with this mean degree. */
    static SimulatedReplicate linearGaussianReplicate(int p, double meanDegree, int rows, long seed) {
        return Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", p, "mean_degree", meanDegree))
                .model(ModelKinds.byId("linear-gaussian"), Map.of())
                .build().drawTruth(seed).sample(rows);
    }

    /** n rows of a discrete network with two categories per variable on a given DAG. */
    static DataSet binary(Graph dag, int rows, long seed) {
        return Simulation.builder()
                .graph(GivenGraphFamily.of(dag), Map.of())
                .model(ModelKinds.byId("discrete"), Map.of("categories_low", 2, "categories_high", 2))
                .build().drawTruth(seed).sample(rows).data();
    }
}
