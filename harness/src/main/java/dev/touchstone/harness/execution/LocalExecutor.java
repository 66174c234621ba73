package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.TruthSetting;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Consumer;

/**
 * Runs a list of runs on a pool of worker threads in this JVM (default: all cores). Each
 * worker takes the next run in list order; a replicate's data are drawn once, by the first
 * run that needs them, shared by all its runs, and dropped after the last (see
 * {@link ReplicateCache}), so with runs in plan order memory holds about one replicate per
 * worker. Results do not depend on the number of threads or the order: every seed comes
 * from the run's coordinates.
 *
 * <p>Time limits are enforced through each run's {@link dev.touchstone.core.learner.RunContext}
 * deadline (and, for external commands, by killing the process tree). Cost: the runs'
 * own, plus a few microseconds per run for hand-out and bookkeeping.
 */
public final class LocalExecutor implements RunExecutor {

    private final int threads;
    private final Simulator simulator;
    private final RunPerformer performer;

    /**
     * @param threads   worker threads, at least 1
     * @param simulator draws replicates
     * @param performer performs and records single runs
     */
    public LocalExecutor(int threads, Simulator simulator, RunPerformer performer) {
        if (threads < 1) {
            throw new IllegalArgumentException("at least one thread is needed, got " + threads);
        }
        this.threads = threads;
        this.simulator = simulator;
        this.performer = performer;
    }

    /** All cores of this machine. */
    public static int defaultThreads() {
        return Runtime.getRuntime().availableProcessors();
    }

    /**
     * Performs every run and hands each result to {@code sink} (from worker threads, as they
     * finish). Returns when all are done.
     *
     * @param runs the runs, in the order to start them
     * @param rows the number of rows each replicate's draw must have (the study's largest
     *             finite sample size, whatever subset of runs is being done, so that data are
     *             the same on resume), 0 for oracle-only studies
     */
    @Override
    public void execute(List<RunDefinition> runs, int rows, Consumer<PerformedRun> sink) {
        Map<RunDefinition.ReplicateId, RunDefinition> firstOf = new HashMap<>();
        for (RunDefinition r : runs) {
            firstOf.putIfAbsent(r.replicateId(), r);
        }
        ReplicateCache cache = new ReplicateCache(runs, id -> {
            RunDefinition r = firstOf.get(id);
            TruthSetting truth = r.truth();
            return simulator.draw(truth, r.seeds(), rows);
        });
        AtomicInteger next = new AtomicInteger();
        int workers = Math.max(1, Math.min(threads, runs.size()));
        List<Thread> pool = new ArrayList<>(workers);
        List<Throwable> crashes = java.util.Collections.synchronizedList(new ArrayList<>());
        for (int w = 0; w < workers; w++) {
            Thread t = new Thread(() -> {
                for (int i = next.getAndIncrement(); i < runs.size(); i = next.getAndIncrement()) {
                    RunDefinition run = runs.get(i);
                    PerformedRun result;
                    try {
                        ReplicateCache.Drawn d = cache.acquire(run);
                        result = d.failure() != null ? PerformedRun.without(performer.simulationFailed(run, d.failure()))
                                : performer.performRun(run, d.replicate());
                    } finally {
                        cache.release(run);
                    }
                    sink.accept(result);
                }
            }, "run-worker-" + w);
            t.setDaemon(true);
            t.setUncaughtExceptionHandler((th, e) -> {
                crashes.add(e);
                next.set(runs.size());
            });
            pool.add(t);
            t.start();
        }
        for (Thread t : pool) {
            try {
                t.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("interrupted while runs were in progress", e);
            }
        }
        if (!crashes.isEmpty()) {
            Throwable e = crashes.get(0);
            throw e instanceof RuntimeException ? (RuntimeException) e
                    : new IllegalStateException("a worker stopped: " + e, e);
        }
    }
}
