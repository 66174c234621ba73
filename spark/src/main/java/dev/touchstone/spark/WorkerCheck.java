package dev.touchstone.spark;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.harness.outside.CommandLearner;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.learners.composed.ComposedLearner;
import dev.touchstone.learners.composed.ComposedStep;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * Refuses, before anything runs, a study whose command learners may be missing on the
 * cluster's workers: an external command runs wherever the task runs, so the learners file
 * must say {@code installed_on_workers: true} for each command the study uses. On a
 * {@code local} master the workers are this machine, where the command is installed.
 */
final class WorkerCheck {

    private WorkerCheck() {
    }

    /** The reason to refuse, or null when every command the plan uses may run on the workers. */
    static String refusal(Plan plan, String master) {
        if (SparkSettings.isLocal(master)) {
            return null;
        }
        Set<String> missing = new LinkedHashSet<>();
        String source = null;
        for (RunDefinition r : plan.runs()) {
            for (Learner l : stepsOf(r.config().learner())) {
                if (l instanceof CommandLearner c && !c.spec().onWorkers()) {
                    missing.add(c.description().id());
                    source = c.spec().source();
                }
            }
        }
        if (missing.isEmpty()) {
            return null;
        }
        return "the command learner" + (missing.size() == 1 ? " " : "s ") + String.join(", ", missing)
                + " would run on the cluster's workers, and " + source + " does not say "
                + (missing.size() == 1 ? "it is" : "they are") + " installed there; install "
                + (missing.size() == 1 ? "it" : "them") + " on every worker and add `installed_on_workers: true`"
                + " to " + (missing.size() == 1 ? "its entry" : "their entries") + " (docs/outside-learners.md)";
    }

    /** The learners a run calls: the learner itself, or every step of a composed one. */
    private static List<Learner> stepsOf(Learner learner) {
        if (learner instanceof ComposedLearner c) {
            return c.steps().stream().map(ComposedStep::learner).toList();
        }
        return List.of(learner);
    }

}
