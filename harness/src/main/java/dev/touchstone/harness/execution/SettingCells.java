package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.metrics.results.Setting;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * How a setting is laid out in the study's CSV tables: the truth-setting index
 * ({@code truth_setting}, the same number as in the {@code replicates.csv} of
 * {@code touchstone simulate}), one {@code truth.NAME} column per truth coordinate, then
 * {@code samples} as a whole number (empty for the oracle) and the boolean {@code oracle}.
 * Splitting the oracle out keeps {@code samples} an integer column for R and pandas.
 *
 * @param coordinates the setting's coordinate names (from {@link SettingLayout#columns()})
 * @param truthIndex  the truth-setting index of every setting of the study
 */
public record SettingCells(List<String> coordinates, Map<Setting, Integer> truthIndex) {

    /** The prefix of truth coordinate columns. */
    public static final String TRUTH_PREFIX = "truth.";
    /** The column of the truth-setting index. */
    public static final String TRUTH_SETTING = "truth_setting";
    /** The boolean column saying that a run used the oracle instead of data. */
    public static final String ORACLE = "oracle";

    public SettingCells {
        coordinates = List.copyOf(coordinates);
        truthIndex = Map.copyOf(truthIndex);
    }

    /** The layout of a plan's settings. */
    public static SettingCells of(Plan plan, SettingLayout layout) {
        Map<Setting, Integer> index = new HashMap<>();
        for (RunDefinition r : plan.runs()) {
            index.putIfAbsent(layout.setting(r), r.truth().index());
        }
        return new SettingCells(layout.columns(), index);
    }

    /** The header cells, in order. */
    public List<String> header() {
        List<String> h = new ArrayList<>(List.of(TRUTH_SETTING));
        for (String c : coordinates) {
            if (c.equals(SettingLayout.SAMPLES)) {
                h.add(SettingLayout.SAMPLES);
                h.add(ORACLE);
            } else {
                h.add(TRUTH_PREFIX + c);
            }
        }
        return h;
    }

    /** The cells of one setting, matching {@link #header()}. */
    public List<String> cells(Setting s) {
        Integer index = truthIndex.get(s);
        if (index == null) {
            throw new IllegalArgumentException("setting " + s.label() + " is not one of the study's settings");
        }
        List<String> row = new ArrayList<>(List.of(Integer.toString(index)));
        for (String c : coordinates) {
            String v = s.get(c);
            if (c.equals(SettingLayout.SAMPLES)) {
                boolean oracle = SampleSize.ORACLE_WORD.equals(v);
                row.add(oracle ? "" : Cells.text(v));
                row.add(Boolean.toString(oracle));
            } else {
                row.add(Cells.text(v));
            }
        }
        return row;
    }
}
