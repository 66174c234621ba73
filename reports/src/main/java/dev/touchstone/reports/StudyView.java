package dev.touchstone.reports;

import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.reports.tables.Cell;
import dev.touchstone.reports.tables.Numbers;
import dev.touchstone.reports.tables.Table;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The derived views shared by the HTML and Markdown reports (one place for each: the
 * configurations in study order, pooled headline values, status counts), so the two
 * formats can never disagree.
 */
final class StudyView {

    private final ReportData data;
    private final Map<String, String> learnerOf = new LinkedHashMap<>();
    private final Map<String, Map<String, String>> parametersOf = new LinkedHashMap<>();
    private final Map<String, Map<String, Summary>> pooled = new LinkedHashMap<>();

    StudyView(ReportData data) {
        this.data = data;
        for (RunResult r : data.runs()) {
            learnerOf.putIfAbsent(r.configurationId(), r.learnerId());
            parametersOf.putIfAbsent(r.configurationId(), r.parameters());
        }
        for (AggregateRow a : data.summary()) {
            learnerOf.putIfAbsent(a.configurationId(), a.learnerId());
        }
        for (String config : learnerOf.keySet()) {
            Map<String, Summary> byMetric = new LinkedHashMap<>();
            for (String metric : data.metrics()) {
                List<Double> values = new ArrayList<>();
                for (RunResult r : data.runs()) {
                    Double v = r.configurationId().equals(config) ? r.value(metric) : null;
                    if (v != null) {
                        values.add(v);
                    }
                }
                byMetric.put(metric, data.summarize(values));
            }
            pooled.put(config, byMetric);
        }
    }

    ReportData data() {
        return data;
    }

    /** Learner configurations in the order they first appear. */
    List<String> configurations() {
        return new ArrayList<>(learnerOf.keySet());
    }

    String learnerOf(String config) {
        return learnerOf.get(config);
    }

    Map<String, String> parametersOf(String config) {
        return parametersOf.getOrDefault(config, Map.of());
    }

    /** The summary of a metric pooled over every ok run of a configuration. */
    Summary pooled(String config, String metric) {
        return pooled.getOrDefault(config, Map.of()).getOrDefault(metric, Summary.EMPTY);
    }

    /** The distinct settings, in first-appearance order. */
    List<Setting> settings() {
        Set<Setting> s = new LinkedHashSet<>();
        for (RunResult r : data.runs()) {
            s.add(r.setting());
        }
        for (AggregateRow a : data.summary()) {
            s.add(a.setting());
        }
        return new ArrayList<>(s);
    }

    Map<RunStatus, Integer> statusCounts() {
        Map<RunStatus, Integer> m = new EnumMap<>(RunStatus.class);
        for (RunStatus s : RunStatus.values()) {
            m.put(s, 0);
        }
        for (RunResult r : data.runs()) {
            m.merge(r.status(), 1, Integer::sum);
        }
        return m;
    }

    /**
     * Each configuration's pooled mean of each chosen metric with its 95% interval; the best
     * value of each column (by the metric's direction) is marked, ties all marked.
     */
    Table headline() {
        List<String> cols = new ArrayList<>();
        cols.add("learner configuration");
        cols.add("ok runs");
        cols.addAll(data.metrics());
        Table.Builder t = Table.builder(cols);
        Map<String, Double> best = new LinkedHashMap<>();
        for (String m : data.metrics()) {
            Boolean higher = data.higherIsBetter(m);
            if (higher == null) {
                continue;
            }
            for (String c : configurations()) {
                Double mean = pooled(c, m).mean();
                if (mean != null) {
                    best.merge(m, mean, (a, b) -> higher ? Math.max(a, b) : Math.min(a, b));
                }
            }
        }
        for (String c : configurations()) {
            List<Cell> row = new ArrayList<>();
            row.add(Cell.of(c));
            row.add(Cell.of(Integer.toString(okRuns(c))));
            for (String m : data.metrics()) {
                Summary s = pooled(c, m);
                boolean isBest = s.mean() != null && best.containsKey(m) && s.mean().equals(best.get(m));
                row.add(new Cell(Numbers.withInterval(s.mean(), s.low(), s.high()), isBest));
            }
            t.row(row);
        }
        return t.build();
    }

    int okRuns(String config) {
        int n = 0;
        for (RunResult r : data.runs()) {
            if (r.configurationId().equals(config) && r.isOk()) {
                n++;
            }
        }
        return n;
    }

    /** The paired comparisons as a table (differences are configuration − reference). */
    Table comparisons() {
        Table.Builder t = Table.builder(List.of("setting", "metric", "learner configuration", "pairs",
                "mean difference [95% interval]", "Wilcoxon p", "Holm p", "wins / ties / losses"));
        for (var c : data.comparisons()) {
            String wtl = c.wins() == null ? Numbers.UNDEFINED : c.wins() + " / " + c.ties() + " / " + c.losses();
            t.row(c.setting().label(), c.metric(), c.configurationId(), Integer.toString(c.pairs()),
                    Numbers.withInterval(c.meanDifference(), c.low(), c.high()), Numbers.format(c.pValue()),
                    Numbers.format(c.pHolm()), wtl);
        }
        return t.build();
    }
}
