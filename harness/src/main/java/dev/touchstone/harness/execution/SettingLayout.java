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
 * kind), one per truth parameter the study gives, and {@code samples}. A parameter keeps
 * its plain name unless another section uses the same one, in which case both are
 * prefixed with their section ({@code model_scale}, {@code missing_scale}).
 */
public final class SettingLayout {

    /** The column of the sample size. */
    public static final String SAMPLES = "samples";

    private final List<String> sections = new ArrayList<>();
    private final Map<String, String> columnByParameter = new LinkedHashMap<>();

    public SettingLayout(Plan plan) {
        Map<String, Integer> uses = new HashMap<>();
        for (ComponentSpec c : plan.study().truth()) {
            sections.add(c.section());
            for (String p : c.axes().keySet()) {
                uses.merge(p, 1, Integer::sum);
            }
        }
        Set<String> reserved = new HashSet<>(sections);
        reserved.add(SAMPLES);
        for (ComponentSpec c : plan.study().truth()) {
            for (String p : c.axes().keySet()) {
                String column = uses.get(p) > 1 || reserved.contains(p) ? c.section() + "_" + p : p;
                columnByParameter.put(c.section() + "." + p, column);
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
    public Setting setting(RunDefinition run) {
        Map<String, String> m = new LinkedHashMap<>();
        TruthSetting t = run.truth();
        for (String s : sections) {
            m.put(s, t.choice(s).kind());
        }
        columnByParameter.forEach((key, column) -> {
            int dot = key.indexOf('.');
            TruthSetting.Choice c = t.choice(key.substring(0, dot));
            m.put(column, Canonical.value(c.values().get(key.substring(dot + 1))));
        });
        m.put(SAMPLES, run.sample().word());
        return new Setting(m);
    }
}
