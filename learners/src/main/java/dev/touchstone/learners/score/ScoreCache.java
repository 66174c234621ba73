package dev.touchstone.learners.score;

import dev.touchstone.core.learner.RunContext;

import java.util.Arrays;
import java.util.List;
import java.util.concurrent.ConcurrentHashMap;

/**
 * A thread-safe memo in front of a {@link LocalScore}, keyed by the node and its parent
 * set (order of the parents does not matter), that counts every evaluation of the
 * underlying score in {@link RunContext#countScores(long)} (cache hits are not counted:
 * the counter measures the scoring work done). Parent sets for which the score says a memo
 * does not pay ({@link LocalScore#worthCaching(int)}; small BIC terms) are evaluated
 * directly and counted every time.
 *
 * <p>The memo is bounded: when it holds more than {@code capacity} entries it is emptied
 * and starts again, which keeps memory flat on large searches at the price of some
 * recomputation (common practice for score caches). Cost of a hit: one sorted copy of the
 * parent array and a hash lookup.
 */
public final class ScoreCache implements LocalScore {

    /** The default number of entries kept before the memo is emptied. */
    public static final int DEFAULT_CAPACITY = 1 << 20;

    private final LocalScore score;
    private final RunContext context;
    private final int capacity;
    private final ConcurrentHashMap<Key, Double> memo = new ConcurrentHashMap<>();

    private ScoreCache(LocalScore score, RunContext context, int capacity) {
        this.score = score;
        this.context = context;
        this.capacity = capacity;
    }

    /** A cache over {@code score} that counts evaluations in {@code context}. */
    public static ScoreCache of(LocalScore score, RunContext context) {
        return new ScoreCache(score, context, DEFAULT_CAPACITY);
    }

    /** A cache with an explicit capacity (entries kept before the memo is emptied). */
    public static ScoreCache of(LocalScore score, RunContext context, int capacity) {
        if (capacity < 1) {
            throw new IllegalArgumentException("a score cache needs a positive capacity, got " + capacity);
        }
        return new ScoreCache(score, context, capacity);
    }

    @Override
    public List<String> names() {
        return score.names();
    }

    @Override
    public double localScore(int node, int[] parents) {
        int[] sorted = parents.clone();
        Arrays.sort(sorted);
        if (!score.worthCaching(sorted.length)) {
            context.countScores(1);
            return score.localScore(node, sorted);
        }
        Key key = new Key(node, sorted);
        Double v = memo.get(key);
        if (v != null) {
            return v;
        }
        double s = score.localScore(node, sorted);
        context.countScores(1);
        if (memo.size() >= capacity) {
            memo.clear();
        }
        memo.put(key, s);
        return s;
    }

    /** Passed to the score behind the memo (a batch is not worth memoising), counting one evaluation per candidate. */
    @Override
    public void scoreAdditions(int node, int[] parents, boolean[] candidates, double[] out) {
        long n = 0;
        for (boolean c : candidates) {
            n += c ? 1 : 0;
        }
        context.countScores(n);
        score.scoreAdditions(node, parents, candidates, out);
    }

    /** The score behind the cache. */
    public LocalScore underlying() {
        return score;
    }

    @Override
    public String describe() {
        return score.describe();
    }

    private static final class Key {
        private final int node;
        private final int[] parents;
        private final int hash;

        Key(int node, int[] parents) {
            this.node = node;
            this.parents = parents;
            this.hash = mix(node, parents);
        }

        /**
         * A well-mixed hash: parent sets of one node differ in few small integers, and a
         * polynomial hash of them collides so often that hash bins degrade to lists.
         * Multiply-and-add per element, then the MurmurHash3 32-bit finaliser (Appleby 2011).
         */
        private static int mix(int node, int[] parents) {
            int h = (node + 1) * 0x9E3779B1;
            for (int v : parents) {
                h = (h + v + 1) * 0x85EBCA77;
                h ^= h >>> 15;
            }
            h ^= parents.length;
            h ^= h >>> 16;
            h *= 0x85EBCA6B;
            h ^= h >>> 13;
            h *= 0xC2B2AE35;
            h ^= h >>> 16;
            return h;
        }

        @Override
        public boolean equals(Object o) {
            if (!(o instanceof Key)) {
                return false;
            }
            Key k = (Key) o;
            return node == k.node && Arrays.equals(parents, k.parents);
        }

        @Override
        public int hashCode() {
            return hash;
        }
    }
}
