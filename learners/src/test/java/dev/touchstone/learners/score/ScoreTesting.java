package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.RunContext;

import java.util.List;

/** Helpers shared by the score tests. */
final class ScoreTesting {

    private ScoreTesting() {
    }

    /** A GES search over this score with no knowledge and no parent bound, for enumerating operators. */
    static GesSearch gesSearch(LocalScore score, List<String> names) {
        return new GesSearch(score, KnowledgeIndex.of(Knowledge.none(), names),
                new CpdagCompletion(names, Knowledge.none()), -1, RunContext.unlimited(1));
    }

    /** The decomposable score of a DAG: the sum of the local scores of its nodes given their parents. */
    static double dagScore(LocalScore score, Graph dag) {
        double s = 0;
        for (int v = 0; v < dag.size(); v++) {
            s += score.localScore(v, dag.parents(v));
        }
        return s;
    }

    /**
     * The DAG with one covered edge reversed, or null when it has none. An edge x → y is covered
     * when Pa(y) = Pa(x) ∪ {x}; reversing it gives a Markov-equivalent DAG (Chickering 1995,
     * "A transformational characterization of equivalent Bayesian network structures", lemma 1).
     */
    static Graph reverseACoveredEdge(Graph dag) {
        for (var e : dag.edges()) {
            int x = e.isDirectedFrom(e.a()) ? e.a() : e.b();
            int y = e.other(x);
            if (isCovered(dag, x, y)) {
                MutableGraph g = dag.toMutable();
                g.removeEdge(x, y);
                g.addDirected(y, x);
                return g.freeze();
            }
        }
        return null;
    }

    private static boolean isCovered(Graph dag, int x, int y) {
        int[] py = dag.parents(y);
        int[] px = dag.parents(x);
        if (py.length != px.length + 1) {
            return false;
        }
        for (int v : py) {
            if (v != x && !dag.hasDirected(v, x)) {
                return false;
            }
        }
        return true;
    }
}
