package dev.touchstone.spark;

import dev.touchstone.harness.execution.EstimateCodec;
import dev.touchstone.harness.execution.JournalCodec;
import dev.touchstone.harness.execution.LocalExecutor;
import dev.touchstone.harness.execution.RunRecipe;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * What a Spark task does on an executor: rebuild the plan from the recipe (once per executor
 * JVM and recipe), check that the task's runs have the driver's keys, perform them on one
 * thread with each replicate drawn once, and return one journal line per run with its estimate. A run that
 * fails or times out becomes its journal line exactly as locally; only a fault outside any
 * run (a plan that differs, an error no run catches) fails the task, which Spark retries.
 */
final class TaskWork {

    /**
     * Between a run's journal line and its estimate line in the text a task returns: JSON
     * escapes every control character inside strings, so a raw tab never occurs in either.
     */
    static final char SEPARATOR = '\t';

    private static final Map<RunRecipe, RunRecipe.Workbench> BENCHES = new ConcurrentHashMap<>();

    private TaskWork() {
    }

    /**
     * The task's records, one line per run: the run's journal line and its estimate line
     * (see {@link #SEPARATOR}), so that the estimate reaches the driver with its result.
     */
    static String perform(RunRecipe recipe, TaskGroup task) {
        RunRecipe.Workbench bench = BENCHES.computeIfAbsent(recipe, RunRecipe::rebuild);
        Plan plan = bench.plan();
        List<RunDefinition> runs = new ArrayList<>(task.size());
        Map<String, RunDefinition> byKey = new HashMap<>();
        for (int i = 0; i < task.size(); i++) {
            int position = task.runs()[i];
            RunDefinition r = position < plan.runs().size() ? plan.runs().get(position) : null;
            if (r == null || !r.key().equals(task.keys()[i])) {
                throw new IllegalStateException("run " + position + " has another definition on this executor than on"
                        + " the driver (another Touchstone version or other plug-ins on the workers?)");
            }
            runs.add(r);
            byKey.put(r.key(), r);
        }
        StringBuilder lines = new StringBuilder(task.size() * 600);
        new LocalExecutor(1, bench.simulator(), bench.performer()).execute(runs, task.rows(), performed -> {
            var result = performed.result();
            RunDefinition def = byKey.get(result.key());
            if (lines.length() > 0) {
                lines.append('\n');
            }
            lines.append(JournalCodec.write(new JournalCodec.Line(def.index(), def.coordinates(), result)))
                    .append(SEPARATOR).append(EstimateCodec.write(result.key(), performed.estimate()));
        });
        return lines.toString();
    }
}
