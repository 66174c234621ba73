package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;

/** The score of a whole DAG as the sum of its local terms (decomposability, Chickering 2002, §2). */
final class ScoreTotals {

    private ScoreTotals() {
    }

    static double of(LocalScore score, Graph dag) {
        double total = 0;
        for (int v = 0; v < dag.size(); v++) {
            total += score.localScore(v, dag.parents(v));
        }
        return total;
    }
}
