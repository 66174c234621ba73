package dev.touchstone.harness.study;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Writes a study back out normalised: every field explicit (defaults filled in for
 * replicates, metrics and limits), values as parsed, grouped parameters flattened, in a
 * fixed field order. Reading the normalised file back gives the same plan and keys.
 *
 * <p>The text is written by {@link BlockYaml} rather than a YAML data-binding mapper: a resume
 * of a finished study hashes this text, and setting up a mapper only for that was about a
 * fifth of that resume's time.
 */
public final class StudyWriter {

    private StudyWriter() {
    }

    public static String yaml(Study s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put(StudyFields.NAME, s.name());
        if (!s.description().isEmpty()) {
            m.put(StudyFields.DESCRIPTION, s.description());
        }
        m.put(StudyFields.SEED, s.seed());
        m.put(StudyFields.REPLICATES, s.replicates());
        List<Object> blocks = new ArrayList<>();
        for (List<ComponentSpec> block : s.truths()) {
            Map<String, Object> truth = new LinkedHashMap<>();
            for (ComponentSpec c : block) {
                Map<String, Object> section = new LinkedHashMap<>();
                section.put(c.kindField(), c.kinds().size() == 1 ? c.kind() : c.kinds());
                c.axes().forEach((k, v) -> section.put(k, v.size() == 1 ? v.get(0) : v));
                truth.put(c.section(), section);
            }
            blocks.add(truth);
        }
        m.put(StudyFields.TRUTH, blocks.size() == 1 ? blocks.get(0) : blocks);
        List<Object> samples = new ArrayList<>();
        for (SampleSize n : s.samples()) {
            samples.add(n.isOracle() ? SampleSize.ORACLE_WORD : n.rows());
        }
        m.put(StudyFields.SAMPLES, samples);
        List<Object> learners = new ArrayList<>();
        for (LearnerEntry e : s.learners()) {
            Map<String, Object> entry = new LinkedHashMap<>();
            entry.put(StudyFields.ENTRY_ID, e.id());
            if (e.composed()) {
                List<Object> steps = new ArrayList<>();
                for (LearnerEntry.Step step : e.steps()) {
                    Map<String, Object> m2 = new LinkedHashMap<>();
                    m2.put(StudyFields.ENTRY_USE, step.use());
                    putWith(m2, step.axes());
                    if (step.given() != null) {
                        m2.put(StudyFields.STEP_GIVEN, step.given().word());
                    }
                    steps.add(m2);
                }
                entry.put(StudyFields.ENTRY_STEPS, steps);
            } else {
                entry.put(StudyFields.ENTRY_USE, e.use());
                putWith(entry, e.axes());
            }
            if (e.knowledge() != KnowledgeSource.NONE) {
                entry.put(StudyFields.ENTRY_KNOWLEDGE, e.knowledge().word());
            }
            learners.add(entry);
        }
        m.put(StudyFields.LEARNERS, learners);
        m.put(StudyFields.METRICS, s.metrics());
        Map<String, Object> limits = new LinkedHashMap<>();
        if (s.limits().perRun() != null) {
            limits.put(StudyFields.LIMIT_SECONDS, s.limits().seconds());
        }
        limits.put(StudyFields.LIMIT_MAX_RUNS, s.limits().maxRuns());
        m.put(StudyFields.LIMITS, limits);
        if (s.compareTo() != null) {
            m.put(StudyFields.COMPARE_TO, s.compareTo());
        }
        if (!s.scoreAgainst().isEmpty()) {
            m.put(StudyFields.SCORE_AGAINST, s.scoreAgainst().stream().map(c -> c.word()).toList());
        }
        return "# The study as run, normalised by touchstone: every field explicit.\n" + BlockYaml.text(m);
    }

    private static void putWith(Map<String, Object> entry, Map<String, List<Object>> axes) {
        if (!axes.isEmpty()) {
            Map<String, Object> with = new LinkedHashMap<>();
            axes.forEach((k, v) -> with.put(k, v.size() == 1 ? v.get(0) : v));
            entry.put(StudyFields.ENTRY_WITH, with);
        }
    }

}
