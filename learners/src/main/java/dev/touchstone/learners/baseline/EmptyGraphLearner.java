package dev.touchstone.learners.baseline;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;

/**
 * Returns the graph with no edges (common practice as the floor of any comparison). The
 * empty graph is its own equivalence class, so it is declared a CPDAG and scored like PC
 * and GES. Any learner that does not beat it has learned nothing about the structure;
 * note that on sparse truths its SHD can look respectable while its SID is large
 * (Peters and Bühlmann 2015). Cost: O(p).
 */
public final class EmptyGraphLearner extends DeclaredLearner {

    private static final LearnerDescription DESCRIPTION = DataFreeBaseline.describe("empty",
            "returns the graph with no edges: the floor any learner must beat", "common practice", GraphClass.CPDAG)
            .build();

    public EmptyGraphLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        return Estimate.of(Graph.empty(run.names()), GraphClass.CPDAG);
    }
}
