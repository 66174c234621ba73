package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeadlineExceededException;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.harness.study.Canonical;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Timings;
import dev.touchstone.metrics.scoring.SearchGapMeasure;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Performs one run on its replicate and turns whatever happens into a {@link RunResult}:
 * {@code ok} with metric values and timings; {@code timeout} when the learner passes its
 * deadline; {@code failed} with the exception's message when it (or scoring) throws,
 * including out-of-memory and stack overflow; {@code skipped} with the reason when the
 * learner cannot take the input (the oracle it cannot use, a data kind it does not
 * accept). Never throws for a learner's fault, so the study goes on.
 *
 * <p>Timings: wall seconds around {@code learn}, CPU seconds and allocated bytes of the
 * calling thread (learners that use more threads are under-counted), and the run context's
 * test and score counters. Cost: the learner's, plus scoring.
 */
public final class RunPerformer {

    private static final ThreadMXBean THREADS = ManagementFactory.getThreadMXBean();

    private final Scorer scorer;
    private final RunCoordinates coordinates;

    /**
     * @param scorer      scores estimates against the truth
     * @param coordinates the setting each result is written with
     */
    public RunPerformer(Scorer scorer, RunCoordinates coordinates) {
        this.scorer = scorer;
        this.coordinates = coordinates;
    }

    /** A run whose replicate could not be drawn: failed, with the reason. */
    public RunResult simulationFailed(RunDefinition run, Throwable cause) {
        return result(run, RunStatus.FAILED, "simulation failed: " + message(cause), null, null, Map.of(),
                Timings.NONE);
    }

    /** The run's result alone (see {@link #performRun}). */
    public RunResult perform(RunDefinition run, Replicate replicate) {
        return performRun(run, replicate).result();
    }

    /** Performs the run: its result and the estimate the learner returned (null when it returned none). */
    public PerformedRun performRun(RunDefinition run, Replicate replicate) {
        Learner learner = run.config().learner();
        LearnerDescription d = learner.description();
        if (run.sample().isOracle()) {
            if (d.oracle() == OracleUse.NONE) {
                return PerformedRun.without(skipped(run, "learner " + d.id() + " cannot use the oracle"));
            }
            if (d.oracle() == OracleUse.COVARIANCE && replicate.populationCovariance() == null) {
                return PerformedRun.without(skipped(run, "learner " + d.id() + " needs the population covariance,"
                        + " which this model does not provide"));
            }
        }
        LearnerInput input;
        try {
            input = replicate.input(run.sample());
            d.checkAccepts(input);
        } catch (LearnerException e) {
            return PerformedRun.without(skipped(run, message(e)));
        }
        RunContext context = RunContext.of(run.learnerSeed(), run.limit(), 1);
        long threadId = Thread.currentThread().getId();
        long cpu0 = cpuNanos();
        long alloc0 = allocatedBytes(threadId);
        long t0 = System.nanoTime();
        Estimate estimate;
        Knowledge knowledge = replicate.knowledge(run.config().knowledge());
        try {
            estimate = learner.learn(input, knowledge, run.config().values(), context);
            if (estimate == null) {
                throw new LearnerException("learner " + d.id() + " returned no estimate");
            }
            if (!estimate.graph().names().equals(input.variableNames())) {
                throw new LearnerException("learner " + d.id() + " returned a graph over " + estimate.graph().names()
                        + ", not over the input's variables " + input.variableNames());
            }
        } catch (DeadlineExceededException e) {
            Timings t = timings(t0, cpu0, alloc0, threadId, context);
            return PerformedRun.without(result(run, RunStatus.TIMEOUT, "time limit of "
                    + Canonical.value(run.limit().toMillis() / 1000.0) + " s reached" + detail(e), null, null,
                    Map.of(), t));
        } catch (OutOfMemoryError | StackOverflowError | RuntimeException e) {
            Timings t = timings(t0, cpu0, alloc0, threadId, context);
            return PerformedRun.without(result(run, RunStatus.FAILED, message(e), null, null, Map.of(), t));
        }
        Timings t = timings(t0, cpu0, alloc0, threadId, context);
        List<String> structural = new ArrayList<>();
        for (String m : run.metrics()) {
            if (!Scorer.MEASURED.contains(m) && !SearchGapMeasure.isOne(m)) {
                structural.add(m);
            }
        }
        Scorer.Scored scored;
        Map<String, Double> gap = Map.of();
        try {
            scored = scorer.score(replicate, estimate, structural);
            if (SearchGapScorer.wanted(run.metrics())) {
                gap = SearchGapScorer.score(learner, input, run.config().values(), knowledge, replicate.trueDag(),
                        estimate, run.limit());
            }
        } catch (RuntimeException e) {
            return new PerformedRun(result(run, RunStatus.FAILED, "scoring failed: " + message(e),
                    estimate.graphClass(), null, Map.of(), t), estimate);
        }
        Map<String, Double> values = new LinkedHashMap<>();
        for (String m : structural) {
            Double v = scored.values().get(m);
            values.put(m, v == null || !Double.isFinite(v) ? null : v);
        }
        for (String m : run.metrics()) {
            if (SearchGapMeasure.isOne(m)) {
                Double v = gap.get(m);
                values.put(m, v == null || !Double.isFinite(v) ? null : v);
            }
        }
        return new PerformedRun(result(run, RunStatus.OK, null, estimate.graphClass(), scored.scoredAgainst(), values,
                t), estimate);
    }

    private static String detail(DeadlineExceededException e) {
        String m = e.getMessage();
        return m == null || m.isBlank() || m.equals("time limit reached") ? "" : " (" + m + ")";
    }

    private RunResult skipped(RunDefinition run, String reason) {
        return result(run, RunStatus.SKIPPED, reason, null, null, Map.of(), Timings.NONE);
    }

    private RunResult result(RunDefinition run, RunStatus status, String message, GraphClass estimateClass,
                             GraphClass scoredAgainst, Map<String, Double> metrics, Timings timings) {
        Setting setting = coordinates.setting(run);
        Map<String, String> params = new LinkedHashMap<>();
        run.config().values().asMap().forEach((k, v) -> params.put(k, Canonical.value(v)));
        return RunResult.builder().key(run.key()).setting(setting).replicate(run.replicate())
                .configurationId(run.config().label()).learnerId(run.config().use()).parameters(params)
                .seed(run.learnerSeed()).status(status).message(message).estimateClass(estimateClass)
                .scoredAgainst(scoredAgainst).metrics(metrics).timings(timings).build();
    }

    private static Timings timings(long t0, long cpu0, long alloc0, long threadId, RunContext context) {
        double seconds = (System.nanoTime() - t0) / 1e9;
        long cpu1 = cpuNanos();
        long alloc1 = allocatedBytes(threadId);
        Double cpu = cpu0 < 0 || cpu1 < 0 ? null : Math.max(0, cpu1 - cpu0) / 1e9;
        Double mb = alloc0 < 0 || alloc1 < 0 ? null : Math.max(0, alloc1 - alloc0) / (1024.0 * 1024.0);
        return new Timings(Math.max(0, seconds), cpu, mb, context.tests(), context.scores());
    }

    private static long cpuNanos() {
        return THREADS.isCurrentThreadCpuTimeSupported() ? THREADS.getCurrentThreadCpuTime() : -1;
    }

    private static long allocatedBytes(long threadId) {
        if (THREADS instanceof com.sun.management.ThreadMXBean) {
            com.sun.management.ThreadMXBean t = (com.sun.management.ThreadMXBean) THREADS;
            return t.isThreadAllocatedMemorySupported() && t.isThreadAllocatedMemoryEnabled()
                    ? t.getThreadAllocatedBytes(threadId) : -1;
        }
        return -1;
    }

    /** One line: the exception's message, or its type when it has none. */
    static String message(Throwable e) {
        String m = e.getMessage();
        String text = m == null || m.isBlank() ? e.getClass().getSimpleName() : m;
        if (e instanceof OutOfMemoryError) {
            text = "out of memory: " + text;
        } else if (e instanceof StackOverflowError) {
            text = "stack overflow";
        } else if (!(e instanceof LearnerException) && !(e instanceof IllegalArgumentException)
                && !(e instanceof IllegalStateException)) {
            text = e.getClass().getSimpleName() + ": " + text;
        }
        return text.replace('\n', ' ').replace('\r', ' ').trim();
    }
}
