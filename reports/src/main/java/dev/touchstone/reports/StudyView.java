package dev.touchstone.reports;

import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.metrics.scoring.SearchGapMeasure;
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
import java.util.function.Predicate;

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
    /** Computed once: every chart, table and label asks for them, and the runs do not change. */
    private final List<Setting> settings;
    private final Set<String> constantCoordinates;

    StudyView(ReportData data) {
        this.data = data;
        for (RunResult r : data.runs()) {
            learnerOf.putIfAbsent(r.configurationId(), r.learnerId());
            parametersOf.putIfAbsent(r.configurationId(), r.parameters());
        }
        for (AggregateRow a : data.summary()) {
            learnerOf.putIfAbsent(a.configurationId(), a.learnerId());
        }
        pooled.putAll(pool(r -> true));
        settings = List.copyOf(distinctSettings(data));
        constantCoordinates = java.util.Collections.unmodifiableSet(constantOver(settings));
    }

    /** Each configuration's summary of each metric over the ok runs that pass {@code in}. */
    Map<String, Map<String, Summary>> pool(Predicate<RunResult> in) {
        Map<String, Map<String, Summary>> out = new LinkedHashMap<>();
        for (String config : learnerOf.keySet()) {
            Map<String, Summary> byMetric = new LinkedHashMap<>();
            for (String metric : data.metrics()) {
                List<Double> values = new ArrayList<>();
                for (RunResult r : data.runs()) {
                    Double v = r.configurationId().equals(config) && in.test(r) ? r.value(metric) : null;
                    if (v != null) {
                        values.add(v);
                    }
                }
                byMetric.put(metric, data.summarize(values));
            }
            out.put(config, byMetric);
        }
        return out;
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
        return new ArrayList<>(settings);
    }

    private static Set<Setting> distinctSettings(ReportData data) {
        Set<Setting> s = new LinkedHashSet<>();
        for (RunResult r : data.runs()) {
            s.add(r.setting());
        }
        for (AggregateRow a : data.summary()) {
            s.add(a.setting());
        }
        return s;
    }

    /** Coordinates with one value over all settings (left out of chart titles; listed under Settings). */
    Set<String> constantCoordinates() {
        return constantCoordinates;
    }

    private static Set<String> constantOver(List<Setting> settings) {
        Map<String, Set<String>> values = new LinkedHashMap<>();
        for (Setting s : settings) {
            s.coordinates().forEach((k, v) -> values.computeIfAbsent(k, x -> new LinkedHashSet<>()).add(v));
        }
        Set<String> out = new LinkedHashSet<>();
        values.forEach((k, v) -> {
            if (v.size() == 1) {
                out.add(k);
            }
        });
        return out;
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
     * One headline table: its title ("" when the study has one group), the table, and one
     * line per configuration that has no ok run in it but was skipped (with the reason).
     */
    record Headline(String title, Table table, List<String> notRun, String scoredAgainst) {
    }

    /**
     * The headline tables: one over all runs, or, when the data name coordinates to group
     * by ({@link ReportData#groupCoordinates()}), one per group of settings, so that means
     * are pooled only over settings where the configurations ran on the same data (a
     * learner skipped on discrete data does not get a mean that leaves those out beside
     * others' means that include them).
     */
    List<Headline> headlines() {
        if (data.groupCoordinates().isEmpty()) {
            return List.of(headline("", r -> true));
        }
        Set<String> groups = new LinkedHashSet<>();
        for (Setting s : settings()) {
            groups.add(group(s));
        }
        List<Headline> out = new ArrayList<>();
        for (String g : groups) {
            out.add(headline(g, r -> group(r.setting()).equals(g)));
        }
        return out;
    }

    /** The group of a setting: its non-empty values of the grouping coordinates. */
    private String group(Setting s) {
        List<String> parts = new ArrayList<>();
        for (String c : data.groupCoordinates()) {
            String v = s.get(c);
            if (v != null && !v.isEmpty()) {
                parts.add(c + " " + v);
            }
        }
        return String.join(", ", parts);
    }

    /**
     * Each configuration's pooled mean of each chosen metric with its 95% interval over the
     * runs that pass {@code in}; the best value of each column (by the metric's direction)
     * is marked, ties all marked.
     */
    private Headline headline(String title, Predicate<RunResult> in) {
        Map<String, Map<String, Summary>> pool = pool(in);
        List<String> cols = new ArrayList<>();
        cols.add("learner configuration");
        cols.add("ok runs");
        cols.addAll(headlineMetrics());
        Table.Builder t = Table.builder(cols);
        Map<String, Double> best = new LinkedHashMap<>();
        for (String m : headlineMetrics()) {
            Boolean higher = data.higherIsBetter(m);
            if (higher == null) {
                continue;
            }
            for (String c : configurations()) {
                Double mean = pool.get(c).get(m).mean();
                if (mean != null) {
                    best.merge(m, mean, (a, b) -> higher ? Math.max(a, b) : Math.min(a, b));
                }
            }
        }
        List<String> notRun = new ArrayList<>();
        for (String c : configurations()) {
            int ok = 0;
            String skipped = null;
            for (RunResult r : data.runs()) {
                if (r.configurationId().equals(c) && in.test(r)) {
                    ok += r.isOk() ? 1 : 0;
                    if (r.status() == RunStatus.SKIPPED && skipped == null) {
                        skipped = r.message();
                    }
                }
            }
            if (ok == 0 && skipped != null) {
                notRun.add(c + ": skipped (" + skipped + ")");
                continue;
            }
            List<Cell> row = new ArrayList<>();
            row.add(Cell.of(c));
            row.add(Cell.of(Integer.toString(ok)));
            for (String m : headlineMetrics()) {
                Summary s = pool.get(c).get(m);
                boolean isBest = s.mean() != null && best.containsKey(m) && s.mean().equals(best.get(m));
                row.add(new Cell(Numbers.withInterval(s.mean(), s.low(), s.high()), isBest));
            }
            t.row(row);
        }
        return new Headline(title, t.build(), notRun, scoredAgainst(in));
    }

    /**
     * The classes of truth the ok runs that {@code in} selects were scored against, with the
     * configurations of each ("Scored against the true CPDAG (pc, ges); the true DAG (lingam)."),
     * for a table or chart that shows several configurations side by side; empty when no run
     * records its class.
     */
    String scoredAgainst(Predicate<RunResult> in) {
        Map<String, Set<String>> byClass = new LinkedHashMap<>();
        for (RunResult r : data.runs()) {
            if (in.test(r) && r.isOk() && r.scoredAgainst() != null) {
                byClass.computeIfAbsent(r.scoredAgainst().word().toUpperCase(java.util.Locale.ROOT),
                        k -> new LinkedHashSet<>()).add(r.configurationId());
            }
        }
        List<String> parts = new ArrayList<>();
        byClass.forEach((cls, configs) -> parts.add("the true " + cls + " (" + String.join(", ", configs) + ")"));
        return parts.isEmpty() ? "" : "Scored against " + String.join("; ", parts) + ".";
    }

    /** The identity index of a configuration (its position in the study's learner order), for its colour and marker. */
    int identity(String config) {
        return configurations().indexOf(config);
    }

    /** Each configuration's swatch (inline SVG of its colour and marker), by label. */
    Map<String, String> swatches() {
        Map<String, String> m = new LinkedHashMap<>();
        for (String c : configurations()) {
            m.put(c, dev.touchstone.reports.charts.SeriesStyle.swatchSvg(identity(c)));
        }
        return m;
    }

    /** The classes of truth that ok runs were scored against, in first-appearance order (words: dag, cpdag, pag). */
    List<String> truthClasses() {
        Set<String> out = new LinkedHashSet<>();
        for (RunResult r : data.runs()) {
            if (r.isOk() && r.scoredAgainst() != null) {
                out.add(r.scoredAgainst().word());
            }
        }
        return new ArrayList<>(out);
    }

    /** The classes of truth one configuration's ok runs were scored against, upper case. */
    List<String> truthClassesOf(String config) {
        Set<String> out = new LinkedHashSet<>();
        for (RunResult r : data.runs()) {
            if (r.isOk() && r.scoredAgainst() != null && r.configurationId().equals(config)) {
                out.add(r.scoredAgainst().word().toUpperCase(java.util.Locale.ROOT));
            }
        }
        return new ArrayList<>(out);
    }

    /** The class of truth a configuration's ok runs on a setting were scored against (the first), or null. */
    String truthClassOf(Setting setting, String config) {
        for (RunResult r : data.runs()) {
            if (r.isOk() && r.scoredAgainst() != null && r.configurationId().equals(config)
                    && r.setting().equals(setting)) {
                return r.scoredAgainst().word();
            }
        }
        return null;
    }

    /** A setting's label without the coordinates that never vary (the full label when nothing is left). */
    String shortLabel(Setting s) {
        Set<String> constant = constantCoordinates();
        List<String> parts = new ArrayList<>();
        s.coordinates().forEach((k, v) -> {
            if (!constant.contains(k) && v != null && !v.isEmpty()) {
                parts.add(k + "=" + v);
            }
        });
        return parts.isEmpty() ? s.label() : String.join(", ", parts);
    }

    /**
     * The chosen metrics shown in the headline and the charts: all but the search-gap
     * measures, whose raw scores mean nothing pooled over settings; they get {@link #searchGap}.
     */
    List<String> headlineMetrics() {
        List<String> out = new ArrayList<>();
        for (String m : data.metrics()) {
            if (!SearchGapMeasure.isOne(m)) {
                out.add(m);
            }
        }
        return out;
    }

    /** Relative slack within which a run counts as having reached the optimum's score. */
    static final double AT_OPTIMUM = 1e-6;

    /** The two sentences saying how to read {@link #searchGap}. */
    static final String SEARCH_GAP_READING = "The score's own error (SHD optimum vs truth) is how far the best-scoring"
            + " equivalence class lies from the truth at this sample size: no search with this score can do better;"
            + " the search's error (score and SHD of the estimate against that optimum) is what the learner's search"
            + " left on the table. With the oracle the score's own error is zero by construction (at its 10⁹ rows the BIC ranks the"
            + " true class of a faithful truth first), so every error there is the search's.";

    /**
     * Per setting and configuration whose score is known: runs scored, runs with an exact
     * optimum, how many reached its score (within {@value #AT_OPTIMUM} relative), the mean
     * shortfall in score and SHD, the mean SHD of the optimum from the truth, and the mean of
     * estimate minus truth in score. Empty when the study asks for no search-gap measure.
     */
    Table searchGap() {
        Table.Builder t = Table.builder(List.of("setting", "learner configuration", "runs scored", "with optimum",
                "at optimum", "mean score gap (optimum − estimate)", "mean SHD estimate vs optimum",
                "mean SHD optimum vs truth", "mean score estimate − truth"));
        if (data.metrics().stream().noneMatch(SearchGapMeasure::isOne)) {
            return t.build();
        }
        for (Setting setting : settings()) {
            for (String c : configurations()) {
                int scored = 0;
                int withOptimum = 0;
                int atOptimum = 0;
                List<Double> gap = new ArrayList<>();
                List<Double> searchShd = new ArrayList<>();
                List<Double> scoreShd = new ArrayList<>();
                List<Double> overTruth = new ArrayList<>();
                for (RunResult r : data.runs()) {
                    if (!r.configurationId().equals(c) || !r.setting().equals(setting)) {
                        continue;
                    }
                    Double est = r.value(SearchGapMeasure.SCORE_OF_ESTIMATE.name());
                    if (est == null) {
                        continue;
                    }
                    scored++;
                    Double truth = r.value(SearchGapMeasure.SCORE_OF_TRUTH.name());
                    if (truth != null) {
                        overTruth.add(est - truth);
                    }
                    Double opt = r.value(SearchGapMeasure.SCORE_OF_OPTIMUM.name());
                    Double g = r.value(SearchGapMeasure.SEARCH_SCORE_GAP.name());
                    if (opt == null || g == null) {
                        continue;
                    }
                    withOptimum++;
                    atOptimum += g <= AT_OPTIMUM * Math.max(1, Math.abs(opt)) ? 1 : 0;
                    gap.add(g);
                    add(searchShd, r.value(SearchGapMeasure.SEARCH_SHD.name()));
                    add(scoreShd, r.value(SearchGapMeasure.SCORE_SHD.name()));
                }
                if (scored == 0) {
                    continue;
                }
                t.row(setting.label(), c, Integer.toString(scored), Integer.toString(withOptimum),
                        withOptimum == 0 ? Numbers.UNDEFINED : Integer.toString(atOptimum), Numbers.format(mean(gap)),
                        Numbers.format(mean(searchShd)), Numbers.format(mean(scoreShd)), Numbers.format(mean(overTruth)));
            }
        }
        return t.build();
    }

    private static void add(List<Double> values, Double v) {
        if (v != null) {
            values.add(v);
        }
    }

    private static Double mean(List<Double> values) {
        return values.isEmpty() ? null : values.stream().mapToDouble(Double::doubleValue).average().getAsDouble();
    }

    /** The paired comparisons as a table (differences are configuration − reference). */
    Table comparisons() {
        return comparisons(data.comparisons());
    }

    /** These paired comparisons as a table. */
    Table comparisons(List<dev.touchstone.metrics.results.ComparisonRow> rows) {
        Table.Builder t = Table.builder(List.of("setting", "metric", "learner configuration", "pairs",
                "mean difference [95% interval]", "Wilcoxon p", "Holm p", "wins / ties / losses"));
        for (var c : rows) {
            String wtl = c.wins() == null ? Numbers.UNDEFINED : c.wins() + " / " + c.ties() + " / " + c.losses();
            t.row(c.setting().label(), c.metric(), c.configurationId(), Integer.toString(c.pairs()),
                    Numbers.withInterval(c.meanDifference(), c.low(), c.high()), Numbers.format(c.pValue()),
                    Numbers.format(c.pHolm()), wtl);
        }
        return t.build();
    }
}
