package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.LearnerConfig;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.harness.study.TruthSetting;
import dev.touchstone.metrics.results.RunStatus;

import java.time.Duration;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The wall time a study will take, extrapolated from a pilot: replicate 0 of every truth
 * setting is drawn once, and every distinct (learner configuration × setting) pair is
 * performed once on it (learning and scoring, as in the study), one after another on the
 * calling thread. Each pair's measured wall time stands for all of its replicates; each
 * draw for all replicates of its truth setting. The study's core-seconds are then
 * <pre>
 *   Σ_truth draw × replicates + Σ_pair cost × replicates + runs × {@value #BOOKKEEPING_MS} ms
 * </pre>
 * and its wall time that divided by the workers that can run at once (the smaller of the
 * threads and the cores), plus {@value #FIXED_SECONDS} s for what every {@code run} costs
 * whatever its size: starting the JVM and writing the report (measured on the bundled quick
 * reproductions: their wall time exceeded the pilot's prediction without it by 0.5 to 3.5 s,
 * depending on the load of the 2 shared cores). The bookkeeping term is per-run journaling, tables and statistics,
 * about 0.33 ms of wall time (0.66 ms of core time) per run in the harness benchmark
 * ({@code StudyRunnerBenchmark}), rounded up.
 *
 * <p><b>Bounded and deterministic.</b> What the pilot runs does not depend on timing: always
 * the same pairs in plan order. Each pilot run gets the time limit {@code budget / pairs}
 * (or the study's own limit when that is smaller), so the learners' part of the pilot takes
 * at most about the budget, plus one draw per truth setting and what learners that never
 * check their deadline overrun. A pair stopped by the pilot's limit (not the study's) counts
 * at that limit, so the estimate is then a lower bound, which {@link Figures#lowerBound} says.
 *
 * <p>Why a pilot instead of a table of costs: the costs of learners differ by orders of
 * magnitude with the number of variables, the sample size and the data kind, and outside
 * command learners have no cost known in advance; one measured run per pair captures all of
 * that. What it misses: replicates much slower than replicate 0, and a machine loaded
 * differently during the pilot and the study.
 */
public final class PilotEstimate {

    /** Per-run cost of journaling, tables and statistics, in core milliseconds (see the class comment). */
    static final double BOOKKEEPING_MS = 1.0;

    /** Wall seconds of a {@code run} of any size: JVM start and report (see the class comment). */
    static final double FIXED_SECONDS = 1.0;

    private PilotEstimate() {
    }

    /**
     * What the pilot itself did.
     *
     * @param runs       pairs performed (one run each)
     * @param capSeconds the time limit each pilot run had
     * @param capped     pilot runs stopped by the pilot's limit
     * @param seconds    the pilot's own wall time
     */
    public record Pilot(int runs, double capSeconds, int capped, double seconds) {
    }

    /**
     * What the pilot measured and what it predicts; the estimate and whether it is only a lower
     * bound follow from the parts, so they are computed, not stored.
     *
     * @param pilot       what the pilot did
     * @param drawSeconds core-seconds the study will spend drawing data
     * @param runSeconds  core-seconds the study will spend learning and scoring (and bookkeeping)
     * @param workers     workers running at once in the estimate
     */
    public record Figures(Pilot pilot, double drawSeconds, double runSeconds, int workers) {

        /** The study's estimated wall time. */
        public double estimatedSeconds() {
            return (drawSeconds + runSeconds) / workers + FIXED_SECONDS;
        }

        /** Whether some pilot run was stopped by the pilot's limit, so the study may take longer. */
        public boolean lowerBound() {
            return pilot.capped() > 0;
        }

        public int pilotRuns() {
            return pilot.runs();
        }

        public double capSeconds() {
            return pilot.capSeconds();
        }

        public int capped() {
            return pilot.capped();
        }

        public double pilotSeconds() {
            return pilot.seconds();
        }
    }

    /**
     * Runs the pilot of {@code plan} and extrapolates.
     *
     * @param threads the worker threads the study will be run with
     * @param budget  the time the pilot's learner runs may take in all
     */
    public static Figures of(Plan plan, Simulator simulator, Scorer scorer, int threads, Duration budget) {
        long started = System.nanoTime();
        int rows = StudyRunner.largestRows(plan);
        int pairs = plan.settingCount() * plan.configs().size();
        Duration cap = budget.dividedBy(Math.max(1, pairs));
        Duration studyLimit = plan.study().limits().perRun();
        RunPerformer performer = new RunPerformer(scorer, new SettingLayout(plan));
        Map<String, RunDefinition> firsts = firstReplicates(plan);
        int replicates = plan.study().replicates();
        double draws = 0;
        double runs = 0;
        int capped = 0;
        for (TruthSetting t : plan.truths()) {
            RunDefinition any = firsts.get(pairKey(t, plan.study().samples().get(0), plan.configs().get(0)));
            long d0 = System.nanoTime();
            Replicate replicate;
            try {
                replicate = simulator.draw(t, any.seeds(), rows);
            } catch (RuntimeException e) {
                // The study's runs of this setting fail at once; they cost nothing worth estimating.
                continue;
            } finally {
                draws += seconds(System.nanoTime() - d0) * replicates;
            }
            for (SampleSize n : plan.study().samples()) {
                for (LearnerConfig c : plan.configs()) {
                    RunDefinition r = firsts.get(pairKey(t, n, c));
                    boolean pilotLimit = studyLimit == null || cap.compareTo(studyLimit) < 0;
                    Duration limit = pilotLimit ? cap : studyLimit;
                    RunDefinition pilot = r.toBuilder().limit(limit).build();
                    long r0 = System.nanoTime();
                    RunStatus status = performer.perform(pilot, replicate).status();
                    double took = seconds(System.nanoTime() - r0);
                    if (status == RunStatus.TIMEOUT && pilotLimit) {
                        capped++;
                        took = Math.max(took, seconds(cap.toNanos()));
                    }
                    runs += took * replicates;
                }
            }
        }
        runs += plan.runs().size() * BOOKKEEPING_MS / 1000;
        int workers = Math.max(1, Math.min(Math.min(threads, Runtime.getRuntime().availableProcessors()),
                plan.runs().size()));
        Pilot pilot = new Pilot(pairs, seconds(cap.toNanos()), capped, seconds(System.nanoTime() - started));
        return new Figures(pilot, draws, runs, workers);
    }

    /** Replicate 0's run of every (truth setting, sample size, configuration), by {@link #pairKey}. */
    private static Map<String, RunDefinition> firstReplicates(Plan plan) {
        Map<String, RunDefinition> out = new HashMap<>();
        for (RunDefinition r : plan.runs()) {
            if (r.replicate() == 0) {
                out.put(pairKey(r.truth(), r.sample(), r.config()), r);
            }
        }
        return out;
    }

    private static String pairKey(TruthSetting t, SampleSize n, LearnerConfig c) {
        return t.index() + "|" + n.word() + "|" + c.index();
    }

    private static double seconds(long nanos) {
        return nanos / 1e9;
    }

    /** The words {@code check} prints for these figures (two lines). */
    public static List<String> describe(Figures f) {
        return List.of(String.format(java.util.Locale.ROOT, "  time estimate: %s%.0f s of wall time with %d worker%s"
                                + " (%.1f core-seconds: %.1f drawing data, %.1f learning and scoring; %.0f s to start and report)",
                        f.lowerBound() ? "at least " : "about ", Math.ceil(f.estimatedSeconds()), f.workers(),
                        f.workers() == 1 ? "" : "s", f.drawSeconds() + f.runSeconds(), f.drawSeconds(),
                        f.runSeconds(), FIXED_SECONDS),
                String.format(java.util.Locale.ROOT, "  (from a pilot of %,d runs, one per learner configuration and"
                                + " setting on replicate 0, each limited to %.2f s%s; it took %.1f s)", f.pilotRuns(),
                        f.capSeconds(), f.capped() == 0 ? "" : "; " + f.capped() + " hit that limit", f.pilotSeconds()));
    }
}
