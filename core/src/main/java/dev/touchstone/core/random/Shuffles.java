package dev.touchstone.core.random;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.ArraySampler;
import org.apache.commons.rng.sampling.ListSampler;

import java.util.List;

/**
 * The one seeded shuffle of the project: uniform random permutations and uniform random
 * leading subsets, so that every random order is drawn the same way and from a stream the
 * caller derived with {@link Seeds}.
 *
 * <p>A full shuffle is the Fisher–Yates shuffle (Fisher and Yates 1938; Durstenfeld 1964,
 * "Algorithm 235: Random permutation", CACM 7(7)) as Commons RNG 1.7 draws it: two swap
 * positions from one 64-bit product per step (Brackett-Rozinsky and Lemire 2024, "Batched
 * ranged random integer generation"). It is delegated rather than rewritten so that orders
 * drawn before this class existed, and the data simulated from them, stay the same.
 *
 * <p>A head shuffle ({@link #shuffleHead(UniformRandomProvider, int[], int)}) is the first
 * {@code k} steps of the forward Fisher–Yates shuffle: position {@code i} swaps with a
 * uniform position in {@code [i, n)}, one {@code nextInt(n - i)} per step. The first
 * {@code k} entries are then a uniform random {@code k}-subset in uniform random order, at a
 * cost of {@code k} draws instead of {@code n}.
 */
public final class Shuffles {

    private Shuffles() {
    }

    /** The numbers {@code 0 … n-1} in a uniformly random order. */
    public static int[] permutation(UniformRandomProvider random, int n) {
        return shuffle(random, identity(n));
    }

    /** Shuffles {@code values} in place into a uniformly random order; returns it. */
    public static int[] shuffle(UniformRandomProvider random, int[] values) {
        return ArraySampler.shuffle(random, values);
    }

    /** Shuffles {@code values} in place into a uniformly random order; returns it. */
    public static <T> T[] shuffle(UniformRandomProvider random, T[] values) {
        return ArraySampler.shuffle(random, values);
    }

    /** Shuffles {@code list} (which must allow {@code set}) in place into a uniformly random order. */
    public static <T> void shuffle(UniformRandomProvider random, List<T> list) {
        ListSampler.shuffle(random, list);
    }

    /**
     * Puts a uniformly random choice of {@code k} of the entries, in uniformly random order, in
     * the first {@code k} places of {@code values} (in place); the rest keep what is left. A
     * {@code k} at least the length shuffles the whole array.
     */
    public static int[] shuffleHead(UniformRandomProvider random, int[] values, int k) {
        int n = values.length;
        int steps = Math.min(k, n);
        for (int i = 0; i < steps; i++) {
            int j = i + random.nextInt(n - i);
            int t = values[i];
            values[i] = values[j];
            values[j] = t;
        }
        return values;
    }

    /** As {@link #shuffleHead(UniformRandomProvider, int[], int)}, for a list that allows {@code set}. */
    public static <T> void shuffleHead(UniformRandomProvider random, List<T> list, int k) {
        int n = list.size();
        int steps = Math.min(k, n);
        for (int i = 0; i < steps; i++) {
            int j = i + random.nextInt(n - i);
            T t = list.get(i);
            list.set(i, list.get(j));
            list.set(j, t);
        }
    }

    /** The numbers {@code 0 … n-1} in order. */
    public static int[] identity(int n) {
        int[] out = new int[n];
        for (int i = 0; i < n; i++) {
            out[i] = i;
        }
        return out;
    }
}
