package dev.touchstone.spark;

import dev.touchstone.harness.execution.Engine;
import dev.touchstone.harness.execution.EngineProvider;
import dev.touchstone.harness.execution.RunRecipe;
import dev.touchstone.harness.study.Plan;

/**
 * The {@code spark} engine ({@code touchstone run STUDY --engine spark [--master URL]}):
 * runs are performed as Apache Spark tasks (Zaharia et al., "Resilient distributed datasets",
 * NSDI 2012), whole replicates per task, and journaled on the driver. Found by the service
 * loader when this module's jar is on the class path.
 */
public final class SparkEngineProvider implements EngineProvider {

    @Override
    public String name() {
        return "spark";
    }

    @Override
    public Engine create(String master, Plan plan, RunRecipe recipe) {
        SparkSettings.check(master);
        String refusal = WorkerCheck.refusal(plan, master);
        if (refusal != null) {
            throw new IllegalArgumentException(refusal);
        }
        return (threads, simulator, performer) -> new SparkRunExecutor(master, plan.study().name(), recipe);
    }
}
