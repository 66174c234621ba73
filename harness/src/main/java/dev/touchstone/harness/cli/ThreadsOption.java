package dev.touchstone.harness.cli;

import dev.touchstone.harness.execution.LocalExecutor;
import picocli.CommandLine.Option;

/** {@code --threads N}, the same in every command that runs learners locally: default all cores. */
final class ThreadsOption {

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads of the local engine (default: all"
            + " cores).")
    Integer threads;

    /** The threads given, or one per core; fewer than one is refused. */
    int value() {
        int n = threads == null ? LocalExecutor.defaultThreads() : threads;
        if (n < 1) {
            throw new UsageException("--threads must be at least 1, got " + n);
        }
        return n;
    }
}
