package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.metrics.results.RunResult;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The planning step of a session: which runs of the plan the journal already holds (kept,
 * with their results) and which are to do, in the order to start them, and how many of
 * those are redone because their definition changed (same coordinates, another key).
 * Immutable. Cost: linear in the plan and the journal.
 *
 * @param kept    results of the runs the journal holds, by run position
 * @param todo    the runs to do, in plan order or shuffled
 * @param changed how many runs to do had other definitions in the journal
 */
record SessionPlan(Map<Integer, RunResult> kept, List<RunDefinition> todo, int changed) {

    SessionPlan {
        kept = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(kept));
        todo = List.copyOf(todo);
    }

    /**
     * The session of {@code plan} against the journal's lines.
     *
     * @param shuffle a seed to start runs in a shuffled order (tests of order independence), or null for plan order
     */
    static SessionPlan of(Plan plan, Map<String, JournalCodec.Line> existing, Long shuffle) {
        Set<String> oldCoordinates = new HashSet<>();
        for (JournalCodec.Line l : existing.values()) {
            oldCoordinates.add(l.coordinates());
        }
        Map<Integer, RunResult> kept = new LinkedHashMap<>();
        List<RunDefinition> todo = new ArrayList<>();
        int changed = 0;
        for (RunDefinition r : plan.runs()) {
            JournalCodec.Line done = existing.get(r.key());
            if (done != null) {
                kept.put(r.index(), done.result());
            } else {
                if (oldCoordinates.contains(r.coordinates())) {
                    changed++;
                }
                todo.add(r);
            }
        }
        if (shuffle != null) {
            dev.touchstone.core.random.Shuffles.shuffle(dev.touchstone.core.random.Seeds.random(shuffle), todo);
        }
        return new SessionPlan(kept, todo, changed);
    }

    /** How many runs are kept from the journal. */
    int reused() {
        return kept.size();
    }
}
