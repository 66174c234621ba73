package dev.touchstone.metrics.aggregate;

import dev.touchstone.core.random.Seeds;
import dev.touchstone.metrics.against.MetricAgainst;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.scoring.MetricRegistry;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Turns the runs of a study into its summary: one {@link AggregateRow} per setting × learner
 * configuration × metric, in the order settings and configurations first appear in the runs and
 * metrics appear in the list asked for.
 *
 * <p>Each bootstrap interval draws from a seed derived from the study seed and the row's
 * coordinates (setting, configuration, metric), never from the order of the runs, so the summary
 * is the same for any execution order. Cost: O(runs · metrics + rows · resamples · replicates).
 */
public final class Aggregator {

    private Aggregator() {
    }

    /**
     * The summary rows for {@code metrics} (names from {@link MetricRegistry}, or
     * {@link MetricAgainst} names; unknown names are refused).
     *
     * @param seed the study seed
     */
    public static List<AggregateRow> aggregate(List<RunResult> runs, List<String> metrics, long seed) {
        Objects.requireNonNull(runs, "runs");
        for (String m : metrics) {
            MetricAgainst.resolve(m);
        }
        Map<Group, List<RunResult>> groups = new LinkedHashMap<>();
        for (RunResult r : runs) {
            groups.computeIfAbsent(new Group(r.setting(), r.configurationId()), g -> new ArrayList<>()).add(r);
        }
        List<AggregateRow> out = new ArrayList<>();
        for (Map.Entry<Group, List<RunResult>> e : groups.entrySet()) {
            Group g = e.getKey();
            List<RunResult> members = new ArrayList<>(e.getValue());
            // sorted by replicate so that the bootstrap sees the values in an order independent of execution
            members.sort(Comparator.comparingInt(RunResult::replicate).thenComparing(RunResult::key));
            String learnerId = members.get(0).learnerId();
            int ok = 0;
            int failed = 0;
            int skipped = 0;
            for (RunResult r : members) {
                if (!r.learnerId().equals(learnerId)) {
                    throw new IllegalArgumentException("learner configuration '" + g.configurationId
                            + "' is used with two learners: " + learnerId + " and " + r.learnerId());
                }
                if (r.isOk()) {
                    ok++;
                } else if (r.status().isFailure()) {
                    failed++;
                } else {
                    skipped++;
                }
            }
            for (String metric : metrics) {
                double[] values = members.stream().map(r -> r.value(metric)).filter(Objects::nonNull)
                        .mapToDouble(Double::doubleValue).toArray();
                long rowSeed = Seeds.derive(seed, "summary", g.setting.label(), g.configurationId, metric);
                out.add(AggregateRow.builder().setting(g.setting).configurationId(g.configurationId)
                        .learnerId(learnerId).metric(metric).okRuns(ok).failedRuns(failed).skippedRuns(skipped)
                        .summary(Summaries.of(values, Seeds.random(rowSeed))).build());
            }
        }
        return out;
    }

    private record Group(Setting setting, String configurationId) {
    }
}
