package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.List;
import java.util.function.LongFunction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

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
     * Checks score equivalence on Markov-equivalent pairs: for seeds 1 to 60, a random 7-node
     * DAG and the same DAG with a covered edge reversed (Chickering 1995) get equal scores, the
     * score of each seed given by the function; at least 30 seeds must have a covered edge.
     */
    static void assertCoveredReversalsScoreEqual(LongFunction<LocalScore> scoreForSeed) {
        int checked = 0;
        for (long seed = 1; seed <= 60; seed++) {
            Graph dag = RandomDags.erdosRenyi(7, 2.5, seed);
            Graph twin = reverseACoveredEdge(dag);
            if (twin == null) {
                continue;
            }
            LocalScore score = scoreForSeed.apply(seed);
            double a = dagScore(score, dag);
            double b = dagScore(score, twin);
            assertEquals(a, b, 1e-9 * Math.abs(a), "seed " + seed + ": " + dag + " vs " + twin);
            checked++;
        }
        assertTrue(checked >= 30, "too few DAGs with a covered edge: " + checked);
    }

    /** The number of pairs i &lt; j of the first p variables for which the single edge i → j raises j's score. */
    static int singleEdgeImprovements(LocalScore score, int p) {
        int improving = 0;
        for (int i = 0; i < p; i++) {
            for (int j = i + 1; j < p; j++) {
                if (score.localScore(j, new int[] {i}) > score.localScore(j, new int[0])) {
                    improving++;
                }
            }
        }
        return improving;
    }

    /** k distinct parents for node y among p variables, drawn without replacement. */
    static int[] randomParents(UniformRandomProvider rng, int p, int y, int k) {
        List<Integer> pool = new ArrayList<>();
        for (int v = 0; v < p; v++) {
            if (v != y) {
                pool.add(v);
            }
        }
        int[] parents = new int[k];
        for (int i = 0; i < k; i++) {
            parents[i] = pool.remove(rng.nextInt(pool.size()));
        }
        return parents;
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
