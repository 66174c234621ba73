package dev.touchstone.harness.study;

import java.util.List;

/**
 * An expanded study: its truth settings, learner configurations and runs in their fixed
 * order. Everything a runner, a resume or a report needs, computed before anything runs.
 * Immutable.
 */
public record Plan(Study study, List<TruthSetting> truths, List<LearnerConfig> configs, List<RunDefinition> runs) {

    public Plan {
        truths = List.copyOf(truths);
        configs = List.copyOf(configs);
        runs = List.copyOf(runs);
    }

    /** The number of settings (truth settings × sample sizes). */
    public int settingCount() {
        return truths.size() * study.samples().size();
    }

    /** The number of replicates whose data must be generated. */
    public int replicateCount() {
        return truths.size() * study.replicates();
    }

    /** The configuration of the reference learner ({@code compare_to}), or null. */
    public LearnerConfig reference() {
        if (study.compareTo() == null) {
            return null;
        }
        for (LearnerConfig c : configs) {
            if (c.entryId().equals(study.compareTo())) {
                return c;
            }
        }
        return null;
    }

    /** A hash of every run's key, in order: equal for two studies that define exactly the same runs. */
    public String hash() {
        StringBuilder sb = new StringBuilder();
        for (RunDefinition r : runs) {
            sb.append(r.key()).append('\n');
        }
        return Canonical.hash(sb.toString());
    }
}
