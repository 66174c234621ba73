package dev.touchstone.core.learner;

import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;

import java.time.Duration;
import java.util.concurrent.atomic.LongAdder;

/**
 * What one run gives a learner besides its input: the seed all its randomness must come
 * from, a deadline it must check, the number of threads it may use, and counters of the
 * work it does (independence tests, score evaluations). Counters are thread-safe.
 */
public final class RunContext {

    private final long seed;
    private final long deadlineNanos;
    private final boolean limited;
    private final int threads;
    private final LongAdder tests = new LongAdder();
    private final LongAdder scores = new LongAdder();

    private RunContext(long seed, Duration limit, int threads) {
        if (threads < 1) {
            throw new IllegalArgumentException("a run needs at least one thread, got " + threads);
        }
        this.seed = seed;
        this.threads = threads;
        this.limited = limit != null;
        this.deadlineNanos = limited ? System.nanoTime() + limit.toNanos() : Long.MAX_VALUE;
    }

    /** A context with this seed, a time limit counted from now (null for none) and a thread budget. */
    public static RunContext of(long seed, Duration limit, int threads) {
        return new RunContext(seed, limit, threads);
    }

    /** A single-threaded context without a time limit. */
    public static RunContext unlimited(long seed) {
        return new RunContext(seed, null, 1);
    }

    public long seed() {
        return seed;
    }

    /** A fresh generator seeded from this run's seed and {@code purpose}, so separate uses do not share a stream. */
    public UniformRandomProvider random(String purpose) {
        return Seeds.random(Seeds.derive(seed, purpose));
    }

    /** The number of threads the learner may use. */
    public int threads() {
        return threads;
    }

    /** Whether the time limit has passed. */
    public boolean pastDeadline() {
        return limited && System.nanoTime() - deadlineNanos > 0;
    }

    /** Nanoseconds left before the limit ({@link Long#MAX_VALUE} without one; may be negative). */
    public long remainingNanos() {
        return limited ? deadlineNanos - System.nanoTime() : Long.MAX_VALUE;
    }

    /**
     * Stops the run if its time limit has passed.
     *
     * @throws DeadlineExceededException when it has
     */
    public void checkDeadline() {
        if (pastDeadline()) {
            throw new DeadlineExceededException("time limit reached");
        }
    }

    public void countTests(long n) {
        tests.add(n);
    }

    public void countScores(long n) {
        scores.add(n);
    }

    public long tests() {
        return tests.sum();
    }

    public long scores() {
        return scores.sum();
    }
}
