package dev.touchstone.spark;

import dev.touchstone.harness.study.RunDefinition;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Splits a list of runs into Spark tasks. All runs of one replicate go to the same task, so
 * the replicate is drawn once; consecutive replicates (in the list's order) are packed into
 * one task while it holds at most {@code maxRuns} runs (a replicate with more runs than that
 * is a task of its own). Fewer, larger tasks cost less scheduling per run; smaller ones
 * balance load and lose less work when a task is retried. Cost: linear in the runs.
 */
final class TaskGroups {

    private TaskGroups() {
    }

    /** The default task size: about four tasks per core, and at most 1,000 runs per task. */
    static int defaultMaxRuns(int runs, int cores) {
        int perCore = Math.max(1, cores) * 4;
        return Math.max(1, Math.min(1000, (runs + perCore - 1) / perCore));
    }

    static List<TaskGroup> pack(List<RunDefinition> runs, int rows, int maxRuns) {
        if (maxRuns < 1) {
            throw new IllegalArgumentException("a task must hold at least one run, got " + maxRuns);
        }
        Map<RunDefinition.ReplicateId, List<RunDefinition>> byReplicate = new LinkedHashMap<>();
        for (RunDefinition r : runs) {
            byReplicate.computeIfAbsent(r.replicateId(), k -> new ArrayList<>()).add(r);
        }
        List<TaskGroup> tasks = new ArrayList<>();
        List<RunDefinition> current = new ArrayList<>();
        for (List<RunDefinition> replicate : byReplicate.values()) {
            if (!current.isEmpty() && current.size() + replicate.size() > maxRuns) {
                tasks.add(task(current, rows));
                current = new ArrayList<>();
            }
            current.addAll(replicate);
        }
        if (!current.isEmpty()) {
            tasks.add(task(current, rows));
        }
        return tasks;
    }

    private static TaskGroup task(List<RunDefinition> runs, int rows) {
        int[] positions = new int[runs.size()];
        String[] keys = new String[runs.size()];
        for (int i = 0; i < positions.length; i++) {
            positions[i] = runs.get(i).index();
            keys[i] = runs.get(i).key();
        }
        return new TaskGroup(positions, keys, rows);
    }
}
