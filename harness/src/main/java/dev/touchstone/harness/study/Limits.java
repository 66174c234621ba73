package dev.touchstone.harness.study;

import java.time.Duration;

/**
 * The limits of a study: the time one run may take (null for none) and the largest grid
 * it may expand to before it is refused as absurd.
 */
public record Limits(Duration perRun, long maxRuns) {

    /** The default largest grid: a study larger than this is almost certainly a typo. */
    public static final long DEFAULT_MAX_RUNS = 200_000;

    public static Limits defaults() {
        return new Limits(null, DEFAULT_MAX_RUNS);
    }

    /** The per-run limit in seconds, or 0 when there is none. */
    public double seconds() {
        return perRun == null ? 0 : perRun.toNanos() / 1e9;
    }
}
