package dev.touchstone.harness.execution;

import dev.touchstone.core.random.Seeds;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;

import java.nio.file.Path;
import java.time.Instant;
import java.util.AbstractMap;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The report step of a study session that has every run's result: the three tables
 * ({@code runs.csv}, {@code summary.csv}, {@code comparisons.csv}, rebuilt from the results in
 * plan order), the final provenance with the runs by status, and last the finished marker,
 * which vouches for all of them. Cost: the aggregator's, plus writing the tables.
 */
final class StudyOutputs {

    private final Aggregator aggregator;

    StudyOutputs(Aggregator aggregator) {
        this.aggregator = aggregator;
    }

    /**
     * Writes the session's outputs into {@code out} and returns the runs by status.
     *
     * @param results every run's result, in plan order
     * @param session what the session planned (for the runs done now)
     * @param running the provenance written when the session started
     * @param marker  what the finished marker records of the session
     */
    Map<RunStatus, Integer> write(Path out, Plan plan, List<RunResult> results, SessionPlan session,
                                  Provenance running, Marker marker) {
        Map<RunStatus, Integer> byStatus = new LinkedHashMap<>();
        for (RunResult res : results) {
            byStatus.merge(res.status(), 1, Integer::sum);
        }
        tables(out, plan, results);
        Map<String, Integer> counts = new LinkedHashMap<>();
        counts.put("total", plan.runs().size());
        for (RunStatus s : RunStatus.values()) {
            counts.put(s.word(), byStatus.getOrDefault(s, 0));
        }
        counts.put("done_this_session", session.todo().size());
        OutputFiles.write(out.resolve(StudyRunner.PROVENANCE_FILE), running.finished(Instant.now(), counts).json());
        List<String> vouched = new ArrayList<>(List.of(Journal.FILE_NAME, Journal.ESTIMATES_FILE,
                StudyRunner.STUDY_FILE, StudyRunner.PROVENANCE_FILE, StudyRunner.RUNS_FILE, StudyRunner.SUMMARY_FILE,
                StudyRunner.COMPARISONS_FILE));
        vouched.addAll(FinishedIndex.present(out, OutputFolder.learnersCopies()));
        FinishedIndex.of(out, marker.hashes(), marker.versionChanges(), counts, vouched).write(out);
        return byStatus;
    }

    /**
     * What the finished marker records of a session besides its files.
     *
     * @param hashes         the plan's, the study text's and the versions' hashes
     * @param versionChanges whether kept runs were made with other versions
     */
    record Marker(FinishedIndex.Hashes hashes, boolean versionChanges) {
    }

    private void tables(Path out, Plan plan, List<RunResult> results) {
        List<Map.Entry<Integer, RunResult>> ordered = new ArrayList<>();
        for (int i = 0; i < results.size(); i++) {
            RunDefinition r = plan.runs().get(i);
            ordered.add(new AbstractMap.SimpleEntry<>(r.index(), results.get(i)));
        }
        List<String> structural = new ArrayList<>();
        for (String m : plan.study().allMetrics()) {
            if (!Scorer.MEASURED.contains(m)) {
                structural.add(m);
            }
        }
        SettingCells columns = SettingCells.of(plan, new SettingLayout(plan));
        OutputFiles.write(out.resolve(StudyRunner.RUNS_FILE), ResultTables.runs(columns, structural, ordered));
        long statsSeed = Seeds.derive(plan.study().seed(), "statistics");
        OutputFiles.write(out.resolve(StudyRunner.SUMMARY_FILE), ResultTables.summary(columns,
                aggregator.summarise(results, plan.study().allMetrics(), statsSeed)));
        var reference = plan.reference();
        OutputFiles.write(out.resolve(StudyRunner.COMPARISONS_FILE), ResultTables.comparisons(columns,
                reference == null ? List.of()
                        : aggregator.compare(results, plan.study().allMetrics(), reference.label(), statsSeed)));
    }
}
