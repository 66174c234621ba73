package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.learner.RunContext;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ScoreCacheTest {

    private static final DataSet DATA = ScoreData.linearGaussian(8, 2.0, 200, 3);

    @Test
    @DisplayName("returns exactly the underlying score of the sorted parent set, whatever the order given"
            + " (a memo must be transparent; common practice)")
    void transparent() {
        BicScore bic = BicScore.of(DATA.covariance(), 1.0);
        ScoreCache cache = ScoreCache.of(bic, RunContext.unlimited(1));
        int[][] sets = {{}, {3}, {5, 1}, {7, 2, 4}, {6, 0, 3, 1}};
        for (int[] set : sets) {
            int[] sorted = set.clone();
            Arrays.sort(sorted);
            double direct = bic.localScore(2, sorted);
            int[] reversed = new int[set.length];
            for (int i = 0; i < set.length; i++) {
                reversed[i] = set[set.length - 1 - i];
            }
            assertEquals(direct, cache.localScore(2, set));
            assertEquals(direct, cache.localScore(2, reversed));
        }
    }

    @Test
    @DisplayName("counts every evaluation of the score: cached sets once, sets too small to cache each time")
    void countsEvaluations() {
        BicScore bic = BicScore.of(DATA.covariance(), 1.0);
        RunContext context = RunContext.unlimited(1);
        ScoreCache cache = ScoreCache.of(bic, context);
        int small = 0;
        while (!bic.worthCaching(small + 1)) {
            small++;
        }
        int[] cheap = new int[small];
        for (int i = 0; i < small; i++) {
            cheap[i] = i + 1;
        }
        int[] dear = new int[small + 1];
        for (int i = 0; i <= small; i++) {
            dear[i] = i + 1;
        }
        assertTrue(bic.worthCaching(dear.length) && !bic.worthCaching(cheap.length));
        for (int k = 0; k < 3; k++) {
            cache.localScore(0, cheap);
            cache.localScore(0, dear);
        }
        assertEquals(3 + 1, context.scores());
    }

    @Test
    @DisplayName("a full memo is emptied and refilled, values unchanged; a non-positive capacity is refused")
    void capacity() {
        BicScore bic = BicScore.of(DATA.covariance(), 1.0);
        RunContext context = RunContext.unlimited(1);
        ScoreCache cache = ScoreCache.of(bic, context, 2);
        int[][] sets = {{1, 2, 3}, {1, 2, 4}, {1, 2, 5}, {1, 2, 3}};
        for (int[] set : sets) {
            assertEquals(bic.localScore(0, set), cache.localScore(0, set));
        }
        assertEquals(4, context.scores()); // the first set was dropped when the memo was emptied
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ScoreCache.of(bic, context, 0));
        assertTrue(e.getMessage().contains("positive capacity"), e.getMessage());
    }
}
