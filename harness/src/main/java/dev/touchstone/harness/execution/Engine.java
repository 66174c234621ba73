package dev.touchstone.harness.execution;

/**
 * Where a study's runs are performed: a factory of {@link RunExecutor}s, configured once for
 * a session. The default is {@link #LOCAL} (worker threads in this JVM); other engines come
 * from {@link EngineProvider} services on the class path (for example a cluster engine in its
 * own module), so the harness never depends on them.
 */
@FunctionalInterface
public interface Engine {

    /** Threads of this JVM: {@link LocalExecutor}. */
    Engine LOCAL = LocalExecutor::new;

    /**
     * An executor for one session.
     *
     * @param threads   worker threads asked for on this machine (engines that run elsewhere may ignore it)
     * @param simulator draws replicates in this JVM
     * @param performer performs single runs in this JVM
     */
    RunExecutor executor(int threads, Simulator simulator, RunPerformer performer);
}
