package dev.touchstone.core.learner;

import org.junit.jupiter.api.Test;

import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicIntegerArray;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Checks of {@link ParallelLoop}: every item exactly once, slot-wise results the same for every
 * thread count (compared with a plain loop, common practice), a worker per thread, failures
 * rethrown as they were, and the caller's thread alone when one thread or one chunk suffices.
 */
class ParallelLoopTest {

    @Test
    void everyItemRunsExactlyOnceOnAnyThreadCount() {
        for (int threads = 1; threads <= 4; threads++) {
            for (int items : new int[] {0, 1, 31, 32, 33, 1000}) {
                AtomicIntegerArray seen = new AtomicIntegerArray(items);
                ParallelLoop.run(threads, items, 7, () -> seen::incrementAndGet);
                for (int i = 0; i < items; i++) {
                    assertEquals(1, seen.get(i), "item " + i + " of " + items + " on " + threads + " threads");
                }
            }
        }
    }

    @Test
    void slotWiseResultsMatchAPlainLoop() {
        int n = 5000;
        double[] plain = new double[n];
        for (int i = 0; i < n; i++) {
            plain[i] = Math.sin(i) * Math.sqrt(i);
        }
        try (ParallelLoop loop = ParallelLoop.of(3)) {
            for (int round = 0; round < 3; round++) {
                double[] out = new double[n];
                loop.run(n, 16, i -> out[i] = Math.sin(i) * Math.sqrt(i));
                assertArrayEquals(plain, out);
            }
        }
    }

    @Test
    void eachThreadTakesItsOwnWorker() {
        AtomicInteger workers = new AtomicInteger();
        Set<Thread> used = ConcurrentHashMap.newKeySet();
        ParallelLoop.run(3, 300, 1, () -> {
            workers.incrementAndGet();
            return i -> {
                used.add(Thread.currentThread());
                sleepBriefly();
            };
        });
        assertTrue(workers.get() >= 1 && workers.get() <= 3, "workers: " + workers.get());
        assertTrue(used.size() <= 3);
    }

    @Test
    void oneThreadOrOneChunkStaysOnTheCallersThread() {
        Thread caller = Thread.currentThread();
        Set<Thread> used = ConcurrentHashMap.newKeySet();
        ParallelLoop.run(1, 500, 1, () -> i -> used.add(Thread.currentThread()));
        ParallelLoop.run(4, 32, 32, () -> i -> used.add(Thread.currentThread()));
        assertEquals(Set.of(caller), used);
    }

    @Test
    void aFailureInAWorkerIsRethrownAsItWas() {
        DeadlineExceededException thrown = new DeadlineExceededException("time limit passed");
        DeadlineExceededException e = assertThrows(DeadlineExceededException.class,
                () -> ParallelLoop.run(3, 1000, 4, () -> i -> {
                    if (i == 517) {
                        throw thrown;
                    }
                }));
        assertSame(thrown, e);
    }

    @Test
    void aBadChunkIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> ParallelLoop.run(2, 10, 0, () -> i -> { }));
    }

    private static void sleepBriefly() {
        try {
            Thread.sleep(1);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }
}
