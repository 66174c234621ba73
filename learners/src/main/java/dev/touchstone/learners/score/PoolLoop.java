package dev.touchstone.learners.score;

import dev.touchstone.core.learner.DeadlineExceededException;

import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.function.IntConsumer;
import java.util.stream.IntStream;

/**
 * The parallel loop of the score searches: items 0 … count−1 on the search's own pool (so a
 * run uses the threads it was given, not the common pool), or on the caller's thread when
 * there is no pool or too few items to repay handing them out. A failure in a worker, such as
 * a passed deadline, is rethrown as it was.
 */
final class PoolLoop {

    /** Fewer items than this run on the caller's thread. */
    static final int MIN_PARALLEL = 64;

    private PoolLoop() {
    }

    static void run(ForkJoinPool pool, int count, IntConsumer body) {
        if (pool == null || count < MIN_PARALLEL) {
            for (int i = 0; i < count; i++) {
                body.accept(i);
            }
            return;
        }
        try {
            pool.submit(() -> IntStream.range(0, count).parallel().forEach(body)).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new DeadlineExceededException("interrupted");
        } catch (ExecutionException e) {
            Throwable cause = e.getCause();
            if (cause instanceof RuntimeException) {
                throw (RuntimeException) cause;
            }
            throw new IllegalStateException(cause);
        }
    }
}
