package dev.touchstone.metrics.results;

/**
 * What a run cost: wall-clock seconds, CPU seconds of the running thread(s), megabytes
 * allocated, independence tests and score evaluations counted by the run context. Any of them
 * may be null when not measured (for example allocation in an external process).
 */
public record Timings(Double seconds, Double cpuSeconds, Double allocatedMb, Long tests, Long scores) {

    /** Nothing measured. */
    public static final Timings NONE = new Timings(null, null, null, null, null);

    public Timings {
        Records.finiteOrNull(seconds, "seconds");
        Records.finiteOrNull(cpuSeconds, "cpu_seconds");
        Records.finiteOrNull(allocatedMb, "allocated_mb");
        if (seconds != null && seconds < 0 || cpuSeconds != null && cpuSeconds < 0
                || allocatedMb != null && allocatedMb < 0) {
            throw new IllegalArgumentException("timings must be ≥ 0, got seconds=" + seconds
                    + ", cpu_seconds=" + cpuSeconds + ", allocated_mb=" + allocatedMb);
        }
        if (tests != null && tests < 0 || scores != null && scores < 0) {
            throw new IllegalArgumentException("counts must be ≥ 0, got tests=" + tests + ", scores=" + scores);
        }
    }

    /**
     * The measurement of this name as a number: {@code seconds}, {@code cpu_seconds},
     * {@code allocated_mb}, {@code tests} or {@code scores}; null when not measured or when
     * the name is none of these.
     */
    public Double value(String name) {
        switch (name) {
            case "seconds": return seconds;
            case "cpu_seconds": return cpuSeconds;
            case "allocated_mb": return allocatedMb;
            case "tests": return tests == null ? null : tests.doubleValue();
            case "scores": return scores == null ? null : scores.doubleValue();
            default: return null;
        }
    }
}
