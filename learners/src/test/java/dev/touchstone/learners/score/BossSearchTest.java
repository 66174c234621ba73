package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class BossSearchTest {

    /** The score of an order from scratch: each variable's grow-shrink score among its predecessors, no tree. */
    static double bruteForceOrderScore(LocalScore s, int[] order) {
        double total = 0;
        boolean[] prefix = new boolean[order.length];
        for (int v : order) {
            total += s.localScore(v, GrowShrinkTreeTest.bruteForceParents(s, v, prefix));
            prefix[v] = true;
        }
        return total;
    }

    /** The order with v taken out and put back at index i of the rest. */
    static int[] moved(int[] order, int v, int i) {
        int[] rest = Arrays.stream(order).filter(x -> x != v).toArray();
        int[] out = new int[order.length];
        for (int j = 0, k = 0; j < order.length; j++) {
            out[j] = j == i ? v : rest[k++];
        }
        return out;
    }

    @Test
    @DisplayName("a better mutation moves v to the best of all insertion indices, scored from scratch (Andrews et al."
            + " 2023, its better-mutation move, from memory), or leaves the order when none beats the current one")
    void betterMutationTakesTheBestIndex() {
        UniformRandomProvider rng = Seeds.random(5);
        int moves = 0;
        for (long seed = 1; seed <= 6; seed++) {
            Graph dag = RandomDags.erdosRenyi(9, 3.0, seed);
            DataSet data = ScoreData.linearGaussian(dag, 300, seed);
            LocalScore s = BicScore.of(data.covariance(), 1.0);
            OrderScorer scorer = new OrderScorer(s, KnowledgeIndex.of(Knowledge.none(), dag.names()), -1);
            BossSearch search = new BossSearch(scorer, 1, RunContext.unlimited(1));
            int[] order = scorer.randomOrder(rng);
            for (int step = 0; step < 20; step++) {
                int v = rng.nextInt(9);
                int[] before = order.clone();
                double current = bruteForceOrderScore(s, before);
                double best = current;
                for (int i = 0; i < 9; i++) {
                    best = Math.max(best, bruteForceOrderScore(s, moved(before, v, i)));
                }
                boolean changed = search.betterMutation(order, v);
                double after = bruteForceOrderScore(s, order);
                assertEquals(best, after, 1e-6, "seed " + seed + " v=" + v + " " + Arrays.toString(before));
                assertEquals(scorer.score(order), after, 1e-6);
                if (changed) {
                    moves++;
                    assertTrue(after > current, "moved without gain");
                } else {
                    assertArrayEquals(before, order);
                }
            }
        }
        assertTrue(moves > 10, "too few moves to test anything: " + moves);
    }

    @Test
    @DisplayName("a finished climb is a local optimum: no variable has an insertion index that scores higher")
    void climbEndsAtALocalOptimum() {
        for (long seed = 1; seed <= 4; seed++) {
            Graph dag = RandomDags.erdosRenyi(9, 4.0, seed + 10);
            DataSet data = ScoreData.linearGaussian(dag, 300, seed);
            LocalScore s = BicScore.of(data.covariance(), 1.0);
            OrderScorer scorer = new OrderScorer(s, KnowledgeIndex.of(Knowledge.none(), dag.names()), -1);
            BossSearch search = new BossSearch(scorer, 1, RunContext.unlimited(1));
            int[] order = scorer.randomOrder(Seeds.random(seed));
            search.climb(order);
            double score = bruteForceOrderScore(s, order);
            for (int v = 0; v < 9; v++) {
                for (int i = 0; i < 9; i++) {
                    assertFalse(bruteForceOrderScore(s, moved(order, v, i)) > score + 1e-6,
                            "seed " + seed + ": moving " + v + " to " + i + " improves " + Arrays.toString(order));
                }
            }
        }
    }
}
