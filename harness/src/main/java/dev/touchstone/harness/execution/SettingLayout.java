package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Canonical;
import dev.touchstone.harness.study.ComponentSpec;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.TruthSetting;
import dev.touchstone.metrics.results.Setting;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The coordinates a study's settings are written with: one column per truth section (its
 * kind), one per truth parameter the study gives, and {@code samples}. With several truth
 * blocks the columns are the union of theirs; a setting has no coordinate for what its
 * block lacks (a network's setting has no {@code graph} or {@code nodes}), written as an
 * empty cell. A parameter keeps
 * its plain name unless another section uses the same one, in which case both are
 * prefixed with their section ({@code model_scale}, {@code missing_scale}).
 */
public final class SettingLayout implements RunCoordinates {

    /** The column of the sample size. */
    public static final String SAMPLES = "samples";

    private final List<String> sections = new ArrayList<>();
    private final Map<String, String> columnByParameter = new LinkedHashMap<>();

    public SettingLayout(Plan plan) {
        Map<String, Set<String>> sectionsByParameter = new HashMap<>();
        for (List<ComponentSpec> block : plan.study().truths()) {
            for (ComponentSpec c : block) {
                if (!sections.contains(c.section())) {
                    sections.add(c.section());
                }
                for (String p : c.axes().keySet()) {
                    sectionsByParameter.computeIfAbsent(p, k -> new HashSet<>()).add(c.section());
                }
            }
        }
        Set<String> reserved = new HashSet<>(sections);
        reserved.add(SAMPLES);
        for (List<ComponentSpec> block : plan.study().truths()) {
            for (ComponentSpec c : block) {
                for (String p : c.axes().keySet()) {
                    String column = sectionsByParameter.get(p).size() > 1 || reserved.contains(p)
                            ? c.section() + "_" + p : p;
                    columnByParameter.putIfAbsent(c.section() + "." + p, column);
                }
            }
        }
    }

    /** The coordinate names in order. */
    public List<String> columns() {
        List<String> out = new ArrayList<>(sections);
        out.addAll(columnByParameter.values());
        out.add(SAMPLES);
        return out;
    }

    /** The setting of a run. */
    @Override
    public Setting setting(RunDefinition run) {
        Map<String, String> m = new LinkedHashMap<>();
        TruthSetting t = run.truth();
        for (String s : sections) {
            TruthSetting.Choice c = t.choice(s);
            if (c != null) {
                m.put(s, c.kind());
            }
        }
        columnByParameter.forEach((key, column) -> {
            int dot = key.indexOf('.');
            TruthSetting.Choice c = t.choice(key.substring(0, dot));
            Object v = c == null ? null : c.values().asMap().get(key.substring(dot + 1));
            if (v != null) {
                m.put(column, Canonical.value(v));
            }
        });
        m.put(SAMPLES, run.sample().word());
        return new Setting(m);
    }
}
