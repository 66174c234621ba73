package dev.touchstone.harness.cli;

import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.harness.study.GeneratorTruthCatalog;
import dev.touchstone.harness.study.TruthCatalog;
import dev.touchstone.harness.study.TruthSetting;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One truth setting from command-line options instead of a study file: a kind per truth
 * section ({@code --network}, or {@code --graph} and {@code --model}; {@code --hidden},
 * {@code --missing}) and {@code --set NAME=VALUE} for their declared parameters. A bare
 * {@code NAME} goes to whichever chosen kind declares it; {@code SECTION.NAME} picks the
 * section when several do. Values are checked by the same {@code ParameterSpec}s study
 * files use, and every problem is one line naming the option.
 */
final class TruthOptions {

    private final TruthCatalog catalog;
    private final Map<String, String> kinds;
    private final Map<String, String> optionOf;

    /**
     * @param kinds    the chosen kind per section name (sections left out take their default)
     * @param optionOf the option that chose each section, for messages (e.g. {@code graph → --graph})
     */
    TruthOptions(TruthCatalog catalog, Map<String, String> kinds, Map<String, String> optionOf) {
        this.catalog = catalog;
        this.kinds = kinds;
        this.optionOf = optionOf;
    }

    /**
     * The truth setting these options describe.
     *
     * @param given    the {@code --set} values by name
     * @param baseDir  the folder relative paths resolve against (the working folder)
     * @throws UsageException naming the option at fault
     */
    TruthSetting setting(Map<String, String> given, Path baseDir) {
        Map<String, String> settings = new LinkedHashMap<>(given);
        List<TruthCatalog.Section> chosen = new ArrayList<>();
        List<TruthCatalog.Kind> chosenKinds = new ArrayList<>();
        for (TruthCatalog.Section s : catalog.sections()) {
            String kind = kinds.get(s.name());
            if (kind == null) {
                if (s.defaultKind() == null) {
                    continue; // left to another section (a network stands in for graph and model)
                }
                kind = s.defaultKind();
            }
            if (s.shorthand() != null && !s.bareValueIsKind() && kind.matches("\\d+")) {
                settings.putIfAbsent(s.name() + "." + s.shorthand(), kind);
                kind = s.shorthandKind();
            }
            TruthCatalog.Kind k = s.kind(kind);
            if (k == null) {
                throw new UsageException(optionOf.get(s.name()) + ": unknown " + s.name() + " " + s.kindField() + " '"
                        + kind + "' (allowed: " + String.join(", ", s.kindNames()) + ")");
            }
            chosen.add(s);
            chosenKinds.add(k);
        }
        List<Map<String, Object>> raw = new ArrayList<>();
        for (int i = 0; i < chosen.size(); i++) {
            raw.add(new LinkedHashMap<>());
        }
        for (Map.Entry<String, String> e : settings.entrySet()) {
            String name = e.getKey();
            String plain = name.contains(".") ? name.substring(name.indexOf('.') + 1) : name;
            raw.get(target(chosen, chosenKinds, name, name + "=" + e.getValue())).put(plain, e.getValue());
        }
        List<TruthSetting.Choice> choices = new ArrayList<>();
        for (int i = 0; i < chosen.size(); i++) {
            TruthCatalog.Section s = chosen.get(i);
            TruthCatalog.Kind k = chosenKinds.get(i);
            Map<String, Object> written = raw.get(i);
            for (Map.Entry<String, Object> e : written.entrySet()) {
                try {
                    e.setValue(catalog.bind(s.name(), k.name(), e.getKey(), k.parameter(e.getKey()).parse(e.getValue()),
                            baseDir));
                } catch (IllegalArgumentException ex) {
                    throw new UsageException("--set " + e.getKey() + "=" + e.getValue() + ": " + ex.getMessage(), ex);
                }
            }
            ParameterValues values;
            try {
                values = ParameterValues.resolve(s.name() + " " + k.name(), k.parameters(), written);
            } catch (ParameterException ex) {
                throw new UsageException("--set: " + ex.getMessage(), ex);
            }
            // the same choice a study's expansion makes (fingerprint and locations), so seeds agree with a study's
            choices.add(catalog.choice(s.name(), k.name(), values, written));
        }
        TruthSetting t = new TruthSetting(0, choices);
        try {
            catalog.checkCombination(t);
        } catch (IllegalArgumentException e) {
            throw new UsageException("the options do not fit together: " + e.getMessage() + " (" + t.label() + ")", e);
        }
        return t;
    }

    /** The index of the chosen section a {@code --set} name belongs to; {@code shown} is the option as given. */
    private int target(List<TruthCatalog.Section> chosen, List<TruthCatalog.Kind> kinds, String name, String shown) {
        int dot = name.indexOf('.');
        String section = dot < 0 ? null : name.substring(0, dot);
        String plain = dot < 0 ? name : name.substring(dot + 1);
        List<Integer> found = new ArrayList<>();
        for (int i = 0; i < chosen.size(); i++) {
            if ((section == null || chosen.get(i).name().equals(section)) && kinds.get(i).parameter(plain) != null) {
                found.add(i);
            }
        }
        if (found.size() == 1) {
            return found.get(0);
        }
        if (found.size() > 1) {
            List<String> names = new ArrayList<>();
            for (int i : found) {
                names.add(chosen.get(i).name() + "." + plain);
            }
            throw new UsageException("--set " + shown + ": more than one part of the truth has this parameter; write "
                    + String.join(" or ", names));
        }
        StringBuilder allowed = new StringBuilder();
        for (int i = 0; i < chosen.size(); i++) {
            List<String> ps = kinds.get(i).parameters().stream().map(ParameterSpec::name).toList();
            if (!ps.isEmpty()) {
                allowed.append(allowed.length() == 0 ? "" : "; ").append(chosen.get(i).name()).append(' ')
                        .append(kinds.get(i).name()).append(": ").append(String.join(", ", ps));
            }
        }
        throw new UsageException("--set " + shown + ": unknown parameter (allowed: "
                + (allowed.length() == 0 ? "none" : allowed) + ")");
    }

    /** The sections of the generators' catalogue and the options that choose them. */
    static Map<String, String> options() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put(GeneratorTruthCatalog.NETWORK, "--network");
        m.put(GeneratorTruthCatalog.GRAPH, "--graph");
        m.put(GeneratorTruthCatalog.MODEL, "--model");
        m.put(GeneratorTruthCatalog.HIDDEN, "--hidden");
        m.put(GeneratorTruthCatalog.MISSING, "--missing");
        return m;
    }
}
