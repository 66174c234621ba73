package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.RunDefinition;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Function;

/**
 * Holds each replicate's draw while some of its runs are still to do: the first run to
 * need it draws it (others wait for that one draw), and the last run to finish with it
 * drops it. With runs handed out in plan order (replicate by replicate) at most about one
 * replicate per worker thread is alive, which bounds memory.
 */
final class ReplicateCache {

    private final Function<RunDefinition.ReplicateId, Replicate> draw;
    private final Map<RunDefinition.ReplicateId, Holder> holders = new ConcurrentHashMap<>();

    /** The outcome of a draw: the replicate or the reason it could not be drawn. */
    record Drawn(Replicate replicate, Throwable failure) {
    }

    private final class Holder {
        final RunDefinition.ReplicateId id;
        final AtomicInteger remaining;
        private Drawn drawn;

        Holder(RunDefinition.ReplicateId id, int uses) {
            this.id = id;
            this.remaining = new AtomicInteger(uses);
        }

        synchronized Drawn get() {
            if (drawn == null) {
                try {
                    drawn = new Drawn(draw.apply(id), null);
                } catch (RuntimeException | OutOfMemoryError | StackOverflowError e) {
                    drawn = new Drawn(null, e);
                }
            }
            return drawn;
        }
    }

    /** @param runs the runs that will ask for replicates (to count each replicate's uses) */
    ReplicateCache(List<RunDefinition> runs, Function<RunDefinition.ReplicateId, Replicate> draw) {
        this.draw = draw;
        Map<RunDefinition.ReplicateId, Integer> uses = new HashMap<>();
        for (RunDefinition r : runs) {
            uses.merge(r.replicateId(), 1, Integer::sum);
        }
        uses.forEach((id, n) -> holders.put(id, new Holder(id, n)));
    }

    /** The draw of this run's replicate (drawing it if no run has yet). */
    Drawn acquire(RunDefinition run) {
        Holder h = holders.get(run.replicateId());
        if (h == null) {
            throw new IllegalStateException("run " + run.index() + " was not counted");
        }
        return h.get();
    }

    /** Marks one use done; the draw is dropped after its last use. */
    void release(RunDefinition run) {
        Holder h = holders.get(run.replicateId());
        if (h != null && h.remaining.decrementAndGet() == 0) {
            holders.remove(run.replicateId());
        }
    }

    /** The number of replicates still held (for tests of the memory bound). */
    int held() {
        int n = 0;
        for (Holder h : holders.values()) {
            synchronized (h) {
                if (h.drawn != null) {
                    n++;
                }
            }
        }
        return n;
    }
}
