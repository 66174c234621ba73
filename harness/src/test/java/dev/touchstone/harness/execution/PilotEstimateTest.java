package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.testing.TestWorld;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.concurrent.atomic.AtomicInteger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The pilot behind {@code check}'s time estimate: what it runs is fixed by the plan, it stays
 * within its budget, and its extrapolation is the arithmetic its documentation states (checked
 * against learners of known cost: one that sleeps a given time, checking its deadline).
 */
class PilotEstimateTest {

    /** 2 truth settings × 2 sample sizes × 2 configurations = 8 pairs; 5 replicates, 40 runs. */
    private static final String STUDY = "name: pilot\nseed: 3\nreplicates: 5\n"
            + "truth:\n  graph: {family: chain, nodes: [4, 6]}\n  model: {kind: linear-gaussian}\n"
            + "samples: [30, 60]\n"
            + "learners:\n  - {id: s, use: sleeper-test, with: {millis: [20, 40]}}\n"
            + "metrics: [shd, seconds]\n";

    @Test
    @DisplayName("one draw per truth setting and one run per (configuration x setting), whatever the timing")
    void runsWhatThePlanSays() {
        Plan plan = TestWorld.plan(STUDY);
        AtomicInteger draws = new AtomicInteger();
        AtomicInteger scored = new AtomicInteger();
        Simulator counting = (t, seeds, rows) -> {
            draws.incrementAndGet();
            return TestWorld.SIMULATOR.draw(t, seeds, rows);
        };
        Scorer scorer = (replicate, estimate, metrics) -> {
            scored.incrementAndGet();
            return TestWorld.SCORER.score(replicate, estimate, metrics);
        };
        PilotEstimate.Figures f = PilotEstimate.of(plan, counting, scorer, 2, Duration.ofSeconds(30));
        assertEquals(2, draws.get());
        assertEquals(8, scored.get());
        assertEquals(8, f.pilotRuns());
        assertEquals(0, f.capped());
        assertFalse(f.lowerBound());
    }

    @Test
    @DisplayName("extrapolation: replicates x the measured pair costs, divided by the workers (sleeping learners of"
            + " known cost)")
    void extrapolates() {
        Plan plan = TestWorld.plan(STUDY);
        PilotEstimate.Figures f = PilotEstimate.of(plan, TestWorld.SIMULATOR, TestWorld.SCORER, 1,
                Duration.ofSeconds(30));
        // Each setting has a 20 ms and a 40 ms pair: 4 settings x 60 ms x 5 replicates = 1.2 s of learning.
        double expected = 4 * 0.060 * 5;
        assertTrue(f.runSeconds() >= expected, f.toString());
        assertTrue(f.runSeconds() < 3 * expected, "sleeps overrun by scheduling, not threefold: " + f);
        assertEquals(1, f.workers());
        assertEquals(f.drawSeconds() + f.runSeconds() + PilotEstimate.FIXED_SECONDS, f.estimatedSeconds(), 1e-9);
        PilotEstimate.Figures two = PilotEstimate.of(plan, TestWorld.SIMULATOR, TestWorld.SCORER, 2,
                Duration.ofSeconds(30));
        int workers = Math.min(2, Runtime.getRuntime().availableProcessors());
        assertEquals(workers, two.workers());
        assertEquals((two.drawSeconds() + two.runSeconds()) / workers + PilotEstimate.FIXED_SECONDS,
                two.estimatedSeconds(), 1e-9);
    }

    @Test
    @DisplayName("bounded: each pilot run is limited to budget / pairs; capped pairs make the estimate a lower bound")
    void bounded() {
        Plan plan = TestWorld.plan(STUDY.replace("millis: [20, 40]", "millis: [2000, 4000]"));
        PilotEstimate.Figures f = PilotEstimate.of(plan, TestWorld.SIMULATOR, TestWorld.SCORER, 1,
                Duration.ofMillis(400));
        assertEquals(0.05, f.capSeconds(), 1e-9);
        assertEquals(8, f.capped());
        assertTrue(f.lowerBound());
        assertTrue(f.pilotSeconds() < 3.0, "8 runs limited to 50 ms each, not 24 s of sleeping: " + f);
        assertTrue(PilotEstimate.describe(f).get(0).contains("at least"), PilotEstimate.describe(f).toString());
    }

    @Test
    @DisplayName("the study's own time limit, when smaller, is the pilot run's limit, and a run stopped by it is not"
            + " a lower bound")
    void studyLimitWins() {
        Plan plan = TestWorld.plan(STUDY.replace("millis: [20, 40]", "millis: [2000, 4000]")
                + "limits: {seconds: 0.02}\n");
        PilotEstimate.Figures f = PilotEstimate.of(plan, TestWorld.SIMULATOR, TestWorld.SCORER, 1,
                Duration.ofSeconds(30));
        assertEquals(0, f.capped());
        assertFalse(f.lowerBound());
        assertTrue(f.pilotSeconds() < 3.0, f.toString());
    }
}
