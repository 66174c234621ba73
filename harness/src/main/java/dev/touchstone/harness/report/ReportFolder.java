package dev.touchstone.harness.report;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.touchstone.harness.execution.Aggregator;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.harness.execution.EstimateCodec;
import dev.touchstone.harness.execution.Journal;
import dev.touchstone.harness.execution.JournalCodec;
import dev.touchstone.harness.execution.Simulator;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.reports.ReportData;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Re-renders the report of a study's output folder from its journal and kept estimates: works for a finished
 * study and for one still running or interrupted (then marked partial). The journal is only
 * read; runs recorded under an older definition of the study are left out.
 */
public final class ReportFolder {

    private ReportFolder() {
    }

    /** The report data of the study in {@code out}, planned as {@code plan}. */
    public static ReportData read(Path out, Plan plan, Simulator simulator, Aggregator aggregator) {
        Map<String, JournalCodec.Line> lines;
        Map<String, Estimate> estimates = new HashMap<>();
        try {
            lines = Journal.read(out.resolve(Journal.FILE_NAME)).lines();
            // The journal is decoded once: its keys are what the kept estimates are reconciled with.
            // Only replicate 0 is pictured: the other runs' graphs are not decoded.
            java.util.Set<String> pictured = new java.util.HashSet<>();
            for (RunDefinition r : plan.runs()) {
                if (r.replicate() == 0) {
                    pictured.add(r.key());
                }
            }
            for (EstimateCodec.Kept k : Journal.readEstimates(out.resolve(Journal.FILE_NAME), lines.keySet(),
                            pictured::contains)
                    .values()) {
                if (k.estimate() != null) {
                    estimates.put(k.key(), k.estimate());
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read the journal in " + out + ": " + e.getMessage(), e);
        }
        List<RunResult> runs = new ArrayList<>();
        for (RunDefinition r : plan.runs()) {
            JournalCodec.Line l = lines.get(r.key());
            if (l != null) {
                runs.add(l.result());
            }
        }
        boolean partial = runs.size() < plan.runs().size();
        return StudyReports.gather(plan, runs, partial, simulator, aggregator, provenance(out), estimates);
    }

    /**
     * The versions part of provenance in words: this session's versions and, when the study's
     * runs were made with more than one, a warning with the runs by version.
     */
    private static void versions(Map<String, String> m, JsonNode v) {
        StringBuilder sb = new StringBuilder("tool " + v.path("tool").asText());
        for (Iterator<Map.Entry<String, JsonNode>> it = v.path("learners").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> l = it.next();
            if (!l.getValue().asText().equals(v.path("tool").asText())) {
                sb.append("; learner ").append(l.getKey()).append(' ').append(l.getValue().asText());
            }
        }
        m.put("versions", sb.toString());
        if (v.path("mixed").asBoolean(false)) {
            StringBuilder by = new StringBuilder("MIXED: this study's runs were made with more than one version"
                    + " (resumed with --accept-version-change); runs by version: ");
            boolean first = true;
            for (Iterator<Map.Entry<String, JsonNode>> it = v.path("runs_by_version").fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> r = it.next();
                by.append(first ? "" : "; ").append(r.getValue().asInt()).append(" with ").append(r.getKey());
                first = false;
            }
            m.put("versions_mixed", by.toString());
        }
    }

    /** The top-level fields of provenance.json as text, or an empty map when it is missing. */
    public static Map<String, String> provenance(Path out) {
        Map<String, String> m = new LinkedHashMap<>();
        Path file = out.resolve("provenance.json");
        if (!Files.exists(file)) {
            return m;
        }
        try {
            JsonNode root = new ObjectMapper().readTree(file.toFile());
            for (Iterator<Map.Entry<String, JsonNode>> it = root.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                if (e.getKey().equals("versions") && e.getValue().isObject()) {
                    versions(m, e.getValue());
                    continue;
                }
                m.put(e.getKey(), e.getValue().isValueNode() ? e.getValue().asText() : e.getValue().toString());
            }
        } catch (IOException e) {
            m.put("provenance", "unreadable: " + e.getMessage());
        }
        return m;
    }
}
