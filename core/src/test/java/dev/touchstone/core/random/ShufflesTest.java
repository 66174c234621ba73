package dev.touchstone.core.random;

import org.apache.commons.math3.stat.inference.ChiSquareTest;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Checks of {@link Shuffles}: every outcome equally likely by Pearson's chi-square test of
 * goodness of fit (Commons Math {@code ChiSquareTest}; testing a sampler this way is common
 * practice), seeded so that the verdict is fixed; and the draws the same as the shuffle this
 * class replaced (Commons RNG 1.7 and the hand-written forward partial shuffle).
 */
class ShufflesTest {

    private static final int DRAWS = 24_000;
    /** A seeded run passes or fails the same way every time; 0.001 keeps a fair sampler clear of it. */
    private static final double ALPHA = 0.001;

    @Test
    void allSixPermutationsOfThreeAreEquallyLikely() {
        assertUniform(counts(3, 3, true, 11), 6);
    }

    @Test
    void all24PermutationsOfFourAreEquallyLikely() {
        assertUniform(counts(4, 4, true, 12), 24);
    }

    @Test
    void headShuffleOfFourIsUniformOverAll24Permutations() {
        assertUniform(counts(4, 4, false, 13), 24);
    }

    @Test
    void headShuffleDrawsEveryOrderedPairOfFourEquallyOften() {
        // The first two of four: 4 × 3 = 12 ordered pairs.
        assertUniform(counts(4, 2, false, 14), 12);
    }

    @Test
    void aBiasedShuffleIsCaught() {
        // The classic mistake (swap with any position, not one not yet fixed) gives 27 equally
        // likely paths onto 6 permutations, which cannot be uniform: the test must see it.
        UniformRandomProvider rng = Seeds.random(15);
        Map<String, Long> seen = new HashMap<>();
        for (int d = 0; d < DRAWS; d++) {
            int[] a = Shuffles.identity(3);
            for (int i = 0; i < 3; i++) {
                int j = rng.nextInt(3);
                int t = a[i];
                a[i] = a[j];
                a[j] = t;
            }
            seen.merge(Arrays.toString(a), 1L, Long::sum);
        }
        long[] observed = seen.values().stream().mapToLong(Long::longValue).toArray();
        assertTrue(new ChiSquareTest().chiSquareTest(expected(6), observed) < ALPHA);
    }

    @Test
    void fullShuffleDrawsAsCommonsRngDoes() {
        int[] ours = Shuffles.permutation(Seeds.random(21), 50);
        int[] theirs = org.apache.commons.rng.sampling.PermutationSampler.natural(50);
        org.apache.commons.rng.sampling.PermutationSampler.shuffle(Seeds.random(21), theirs);
        assertArrayEquals(theirs, ours);
    }

    @Test
    void listShuffleDrawsAsTheArrayShuffle() {
        List<Integer> list = new ArrayList<>();
        for (int i = 0; i < 40; i++) {
            list.add(i);
        }
        Shuffles.shuffle(Seeds.random(22), list);
        int[] array = Shuffles.permutation(Seeds.random(22), 40);
        assertArrayEquals(array, list.stream().mapToInt(Integer::intValue).toArray());
    }

    @Test
    void headShuffleDrawsAsTheForwardPartialFisherYates() {
        // The loop this helper replaced at its call sites, written out.
        UniformRandomProvider rng = Seeds.random(23);
        int[] expected = Shuffles.identity(30);
        for (int i = 0; i < 7; i++) {
            int j = i + rng.nextInt(30 - i);
            int t = expected[i];
            expected[i] = expected[j];
            expected[j] = t;
        }
        assertArrayEquals(expected, Shuffles.shuffleHead(Seeds.random(23), Shuffles.identity(30), 7));
        List<Integer> list = new ArrayList<>();
        for (int i = 0; i < 30; i++) {
            list.add(i);
        }
        Shuffles.shuffleHead(Seeds.random(23), list, 7);
        assertArrayEquals(expected, list.stream().mapToInt(Integer::intValue).toArray());
    }

    @Test
    void headShuffleKeepsAPermutation() {
        int[] a = Shuffles.shuffleHead(Seeds.random(24), Shuffles.identity(10), 20);
        int[] sorted = a.clone();
        Arrays.sort(sorted);
        assertArrayEquals(Shuffles.identity(10), sorted);
    }

    private static Map<String, Long> counts(int n, int k, boolean full, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        Map<String, Long> seen = new HashMap<>();
        for (int d = 0; d < DRAWS; d++) {
            int[] a = full ? Shuffles.permutation(rng, n) : Shuffles.shuffleHead(rng, Shuffles.identity(n), k);
            seen.merge(Arrays.toString(Arrays.copyOf(a, k)), 1L, Long::sum);
        }
        return seen;
    }

    private static void assertUniform(Map<String, Long> seen, int outcomes) {
        assertEquals(outcomes, seen.size(), "every outcome drawn");
        long[] observed = seen.values().stream().mapToLong(Long::longValue).toArray();
        double p = new ChiSquareTest().chiSquareTest(expected(outcomes), observed);
        assertTrue(p > ALPHA, "chi-square p = " + p);
    }

    private static double[] expected(int outcomes) {
        double[] e = new double[outcomes];
        Arrays.fill(e, (double) DRAWS / outcomes);
        return e;
    }
}
