package dev.touchstone.core.learner;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.IntConsumer;
import java.util.function.Supplier;

/**
 * The one parallel loop of learners: items {@code 0 … n−1} spread over the threads a run was
 * given ({@link RunContext#threads()}), never the JVM's common pool, so that a study running
 * several runs at once (one thread each) is not oversubscribed.
 *
 * <p>Items are handed out in fixed-size chunks from a shared counter (chunked self-scheduling,
 * Kruskal and Weiss 1985, "Allocating independent subtasks on parallel processors", IEEE Trans.
 * Software Engineering 11(10)); each thread takes its own worker from a supplier, so scratch arrays are per thread without thread-locals. The caller's
 * thread works too. Items must write only to their own slots: then the result is the same for
 * every thread count and schedule, which is what keeps learners deterministic. The first failure
 * in any thread (such as a passed deadline) stops the others at their next chunk and is rethrown
 * to the caller as it was.
 *
 * <p>A loop holds its threads from the first parallel {@code run} until {@link #close()}, so a
 * search that runs many short loops starts them once; with one thread, or fewer items than one
 * chunk per thread, everything runs on the caller's thread and no thread is started.
 */
public final class ParallelLoop implements AutoCloseable {

    /**
     * A chunk for items of a few microseconds each (one test, one score): large enough that
     * handing out is negligible, small enough to balance a few hundred items over two to eight threads.
     */
    public static final int CHUNK = 32;

    private final int threads;
    private ExecutorService helpers;

    private ParallelLoop(int threads) {
        this.threads = Math.max(1, threads);
    }

    /** A loop over this run's thread budget. */
    public static ParallelLoop of(RunContext context) {
        return new ParallelLoop(context.threads());
    }

    /** A loop over {@code threads} threads (at least one: the caller's). */
    public static ParallelLoop of(int threads) {
        return new ParallelLoop(threads);
    }

    /** Runs one loop on {@code threads} threads and releases them. */
    public static void run(int threads, int items, int chunk, Supplier<IntConsumer> workers) {
        try (ParallelLoop loop = of(threads)) {
            loop.run(items, chunk, workers);
        }
    }

    /** The threads this loop may use, the caller's included. */
    public int threads() {
        return threads;
    }

    /** Calls {@code body} on every item, in chunks of {@code chunk} items. */
    public void run(int items, int chunk, IntConsumer body) {
        run(items, chunk, () -> body);
    }

    /**
     * Calls a worker on every item, in chunks of {@code chunk} items; each thread takes one
     * worker from {@code workers}. Uses at most one thread per chunk.
     */
    public void run(int items, int chunk, Supplier<IntConsumer> workers) {
        if (chunk < 1) {
            throw new IllegalArgumentException("chunk must be at least 1: " + chunk);
        }
        int t = (int) Math.max(1, Math.min(threads, ((long) items + chunk - 1) / chunk));
        if (t == 1) {
            IntConsumer w = workers.get();
            for (int i = 0; i < items; i++) {
                w.accept(i);
            }
            return;
        }
        AtomicInteger next = new AtomicInteger();
        AtomicReference<Throwable> failure = new AtomicReference<>();
        Runnable share = () -> {
            try {
                IntConsumer w = workers.get();
                while (failure.get() == null) {
                    int from = next.getAndAdd(chunk);
                    if (from >= items) {
                        return;
                    }
                    int to = Math.min(items, from + chunk);
                    for (int i = from; i < to; i++) {
                        w.accept(i);
                    }
                }
            } catch (Throwable e) {
                failure.compareAndSet(null, e);
            }
        };
        List<Future<?>> others = new ArrayList<>(t - 1);
        for (int k = 0; k < t - 1; k++) {
            others.add(helpers().submit(share));
        }
        share.run();
        for (Future<?> f : others) {
            try {
                f.get();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                failure.compareAndSet(null, new DeadlineExceededException("interrupted"));
            } catch (ExecutionException e) {
                failure.compareAndSet(null, e.getCause());
            }
        }
        Throwable f = failure.get();
        if (f instanceof RuntimeException re) {
            throw re;
        }
        if (f instanceof Error err) {
            throw err;
        }
        if (f != null) {
            throw new IllegalStateException("parallel loop failed", f);
        }
    }

    /** Stops this loop's threads; the loop can still run on the caller's thread. */
    @Override
    public void close() {
        if (helpers != null) {
            helpers.shutdownNow();
            helpers = null;
        }
    }

    private ExecutorService helpers() {
        if (helpers == null) {
            AtomicInteger made = new AtomicInteger();
            helpers = Executors.newFixedThreadPool(threads - 1, r -> {
                Thread th = new Thread(r, "touchstone-loop-" + made.getAndIncrement());
                th.setDaemon(true);
                return th;
            });
        }
        return helpers;
    }
}
