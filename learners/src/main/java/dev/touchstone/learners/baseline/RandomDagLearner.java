package dev.touchstone.learners.baseline;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.random.Shuffles;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * A random DAG that ignores the data: each pair is joined with probability
 * mean_degree / (p − 1) along a random order (an Erdős–Rényi DAG; common practice as the
 * chance level of a comparison). Set {@code mean_degree} to the truth's so the baseline
 * matches its density. Seeded from the run, so it is reproducible. Cost: O(p²).
 */
public final class RandomDagLearner extends DeclaredLearner {

    static final Parameter<Double> MEAN_DEGREE = Parameter.real("mean_degree", 2.0, 0.0, 1000.0,
            "expected number of edges at each variable; set it to the truth's to match its density");

    private static final LearnerDescription DESCRIPTION = DataFreeBaseline.describe("random-dag",
                    "returns a random DAG of a given expected density: the chance level of a comparison",
                    "common practice (Erdős and Rényi 1959 random graphs, oriented along a random order)",
                    GraphClass.DAG)
            .parameter(MEAN_DEGREE)
            .build();

    public RandomDagLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        int p = run.names().size();
        double prob = p > 1 ? Math.min(1.0, run.get(MEAN_DEGREE) / (p - 1)) : 0;
        UniformRandomProvider rng = run.context().random("random-dag");
        int[] order = Shuffles.permutation(rng, p);
        MutableGraph g = Graph.builder(run.names());
        for (int i = 0; i < p; i++) {
            for (int j = i + 1; j < p; j++) {
                if (rng.nextDouble() < prob) {
                    g.addDirected(order[i], order[j]);
                }
            }
        }
        return Estimate.of(g.freeze(), GraphClass.DAG);
    }
}
