package dev.touchstone.learners.constraint;

import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.IntConsumer;
import java.util.function.Supplier;

/**
 * Runs the independent items of one search level on a few threads: items are handed out
 * in chunks from a shared counter, each thread gets its own worker (with its own scratch
 * arrays), and the first failure (such as a passed deadline) stops the others and is
 * rethrown to the caller. With one thread everything runs on the caller's thread.
 */
final class ParallelLoop {

    private static final int CHUNK = 32;

    private ParallelLoop() {
    }

    /** Calls a worker from {@code workers} on every item 0 … items−1, using up to {@code threads} threads. */
    static void run(int items, int threads, Supplier<IntConsumer> workers) {
        int t = Math.max(1, Math.min(threads, (items + CHUNK - 1) / CHUNK));
        if (t == 1) {
            IntConsumer w = workers.get();
            for (int i = 0; i < items; i++) {
                w.accept(i);
            }
            return;
        }
        AtomicInteger next = new AtomicInteger();
        AtomicReference<Throwable> failure = new AtomicReference<>();
        Runnable body = () -> {
            try {
                IntConsumer w = workers.get();
                while (failure.get() == null) {
                    int from = next.getAndAdd(CHUNK);
                    if (from >= items) {
                        return;
                    }
                    int to = Math.min(items, from + CHUNK);
                    for (int i = from; i < to; i++) {
                        w.accept(i);
                    }
                }
            } catch (Throwable e) {
                failure.compareAndSet(null, e);
            }
        };
        Thread[] pool = new Thread[t - 1];
        for (int k = 0; k < pool.length; k++) {
            pool[k] = new Thread(body, "touchstone-search-" + k);
            pool[k].setDaemon(true);
            pool[k].start();
        }
        body.run();
        for (Thread th : pool) {
            try {
                th.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                failure.compareAndSet(null, e);
            }
        }
        Throwable f = failure.get();
        if (f instanceof RuntimeException) {
            throw (RuntimeException) f;
        }
        if (f instanceof Error) {
            throw (Error) f;
        }
        if (f != null) {
            throw new IllegalStateException("search interrupted", f);
        }
    }
}
