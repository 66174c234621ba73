package dev.touchstone.learners.baseline;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Shuffles;
import org.apache.commons.rng.UniformRandomProvider;

/**
 * A random DAG that ignores the data: each pair is joined with probability
 * mean_degree / (p − 1) along a random order (an Erdős–Rényi DAG; common practice as the
 * chance level of a comparison). Set {@code mean_degree} to the truth's so the baseline
 * matches its density. Seeded from the run, so it is reproducible. Cost: O(p²).
 */
public final class RandomDagLearner implements Learner {

    private static final LearnerDescription DESCRIPTION = DataFreeBaseline.describe("random-dag",
                    "returns a random DAG of a given expected density: the chance level of a comparison",
                    "common practice (Erdős and Rényi 1959 random graphs, oriented along a random order)",
                    GraphClass.DAG)
            .parameter(ParameterSpec.real("mean_degree", 2.0, 0.0, 1000.0,
                    "expected number of edges at each variable; set it to the truth's to match its density"))
            .build();

    @Override
    public LearnerDescription description() {
        return DESCRIPTION;
    }

    @Override
    public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
        DESCRIPTION.checkAccepts(input);
        context.checkDeadline();
        int p = input.variableNames().size();
        double prob = p > 1 ? Math.min(1.0, parameters.getDouble("mean_degree") / (p - 1)) : 0;
        UniformRandomProvider rng = context.random("random-dag");
        int[] order = Shuffles.permutation(rng, p);
        MutableGraph g = Graph.builder(input.variableNames());
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
