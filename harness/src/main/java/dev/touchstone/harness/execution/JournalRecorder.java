package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.metrics.results.RunResult;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The recording step of a study session: appends each performed run to the journal (with its
 * estimate and the versions it was made with), and counts it done, for the results and for
 * progress, only once its line is on the disk. Starts from the runs the journal already held.
 * Thread-safe.
 */
final class JournalRecorder implements RunBatch.Recorder {

    private final Journal journal;
    private final RunVersions versions;
    private final Progress progress;
    private final Map<Integer, RunResult> results;

    JournalRecorder(Journal journal, RunVersions versions, Progress progress, Map<Integer, RunResult> kept) {
        this.journal = journal;
        this.versions = versions;
        this.progress = progress;
        this.results = new ConcurrentHashMap<>(kept);
    }

    @Override
    public void record(RunDefinition run, PerformedRun performed) {
        RunVersions.Stamp stamp = versions.stamp(run.config().learner().description().id());
        journal.append(new JournalCodec.Line(run.index(), run.coordinates(), performed.result(), stamp),
                performed.estimate(), line -> {
                    results.put(line.run(), line.result());
                    progress.finished(line.result());
                });
    }

    /** Every run's result in plan order; refused when a run has none (the journal may be damaged). */
    List<RunResult> inPlanOrder(Plan plan) {
        if (results.size() != plan.runs().size()) {
            throw new IllegalStateException("only " + results.size() + " of " + plan.runs().size()
                    + " runs have results; the journal may be damaged");
        }
        List<RunResult> out = new ArrayList<>(plan.runs().size());
        for (RunDefinition r : plan.runs()) {
            out.add(results.get(r.index()));
        }
        return out;
    }
}
