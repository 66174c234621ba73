package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Which versions a study's runs were made with: the changes a resume would mix in (the kept
 * runs' recorded versions against this session's), and the count of runs by version for
 * provenance. Runs recorded without versions (by builds that did not record them) are
 * counted as {@code not recorded} and are not a change, since nothing says they differ.
 *
 * @param changes     what differs between kept runs and this session, one phrase each
 *                    (e.g. {@code tool 0.1.0 → 0.2.0}), in plan order, without repeats
 * @param byVersion   runs of the plan by the versions they have (kept: recorded; others: this
 *                    session's), keyed by a phrase such as {@code tool 0.2.0, learner pc 0.2.0}
 * @param mixed       whether some learner's runs were made with more than one set of versions
 */
public record VersionLedger(List<String> changes, Map<String, Integer> byVersion, boolean mixed) {

    public VersionLedger {
        changes = List.copyOf(changes);
        byVersion = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(byVersion));
    }

    /** Compares the plan's kept runs (those whose key is in {@code existing}) with {@code now}. */
    public static VersionLedger of(Plan plan, Map<String, JournalCodec.Line> existing, RunVersions now) {
        Set<String> changes = new LinkedHashSet<>();
        Map<String, Integer> byVersion = new LinkedHashMap<>();
        Map<String, Set<RunVersions.Stamp>> stampsByLearner = new LinkedHashMap<>();
        for (RunDefinition r : plan.runs()) {
            String learner = r.config().learner().description().id();
            RunVersions.Stamp current = now.stamp(learner);
            JournalCodec.Line done = existing.get(r.key());
            RunVersions.Stamp had = done == null ? current : done.versions();
            if (had == null) {
                byVersion.merge("not recorded", 1, Integer::sum);
                continue;
            }
            byVersion.merge(phrase(had, learner), 1, Integer::sum);
            stampsByLearner.computeIfAbsent(learner, k -> new LinkedHashSet<>()).add(had);
            if (!had.tool().equals(current.tool())) {
                changes.add("tool " + had.tool() + " → " + current.tool());
            }
            if (!had.learner().equals(current.learner())) {
                // A built-in learner's version is the tool's: its change is the tool's, said once.
                boolean followsTool = had.learner().equals(had.tool()) && current.learner().equals(current.tool());
                if (!followsTool) {
                    changes.add("learner " + learner + " " + had.learner() + " → " + current.learner());
                }
            }
        }
        boolean mixed = stampsByLearner.values().stream().anyMatch(v -> v.size() > 1);
        return new VersionLedger(new ArrayList<>(changes), byVersion, mixed);
    }

    /** The one line a refused resume says. */
    public String refusal(java.nio.file.Path out) {
        List<String> shown = changes.size() <= 4 ? changes : changes.subList(0, 4);
        String more = changes.size() > shown.size() ? " and " + (changes.size() - shown.size()) + " more" : "";
        return "the runs kept in " + out + " were made with other versions (" + String.join("; ", shown) + more
                + "); pass --accept-version-change to resume anyway (each run keeps the versions it was made"
                + " with and the report says the study is mixed), or choose another --out";
    }

    private static String phrase(RunVersions.Stamp s, String learner) {
        return "tool " + s.tool() + ", learner " + learner + " " + s.learner();
    }
}
