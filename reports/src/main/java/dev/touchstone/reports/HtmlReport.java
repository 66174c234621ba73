package dev.touchstone.reports;

import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.RankingResult;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.reports.charts.AxisScale;
import dev.touchstone.reports.charts.ChartPoint;
import dev.touchstone.reports.charts.ChartSeries;
import dev.touchstone.reports.charts.CriticalDifferenceDiagram;
import dev.touchstone.reports.charts.GraphPicture;
import dev.touchstone.reports.charts.LineChart;
import dev.touchstone.reports.html.HtmlPage;
import dev.touchstone.reports.tables.Numbers;
import dev.touchstone.reports.tables.Table;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;

/**
 * {@code report.html}: one self-contained page (inline SVG charts drawn with JFreeChart and
 * JFreeSVG, no scripts, nothing fetched) with the overview and headline table, each metric
 * against sample size and graph size with interval bands, run time on log–log axes,
 * precision against recall, the paired comparison and critical difference diagrams, the
 * sortability audit, graph pictures, failures, provenance and the cautions.
 */
public final class HtmlReport {

    /** Panels drawn per metric and axis at most; the rest are named in a note. */
    static final int MAX_PANELS = 12;
    private static final int WIDTH = 760;
    private static final int HEIGHT = 340;

    private HtmlReport() {
    }

    public static String render(ReportData data) {
        StudyView view = new StudyView(data);
        HtmlPage page = new HtmlPage("Touchstone study: " + data.studyName() + (data.partial() ? " (partial)" : ""));
        overview(page, view);
        page.box(Cautions.HEADING, Cautions.LINES);
        metricCharts(page, view);
        runtime(page, view);
        precisionRecall(page, view);
        comparison(page, view);
        searchGap(page, view);
        audit(page, view);
        pictures(page, data);
        failures(page, data);
        provenance(page, data);
        return page.render();
    }

    private static void overview(HtmlPage page, StudyView view) {
        ReportData data = view.data();
        page.section("overview", "Overview");
        if (data.partial()) {
            page.warning("This study is not finished (still running or interrupted): the figures below cover only"
                    + " the runs recorded so far.");
        }
        if (!data.description().isBlank()) {
            page.paragraph(data.description().strip());
        }
        Map<RunStatus, Integer> counts = view.statusCounts();
        page.paragraph(view.settings().size() + " settings, " + view.configurations().size()
                + " learner configurations, " + data.runs().size() + " runs: " + counts.get(RunStatus.OK) + " ok, "
                + counts.get(RunStatus.FAILED) + " failed, " + counts.get(RunStatus.TIMEOUT) + " timed out, "
                + counts.get(RunStatus.SKIPPED) + " skipped.");
        Table.Builder configs = Table.builder(List.of("learner configuration", "learner", "parameters"));
        for (String c : view.configurations()) {
            configs.row(c, view.learnerOf(c), view.parametersOf(c).toString().replaceAll("[{}]", ""));
        }
        page.subheading("Learner configurations");
        page.table(configs.build());
        page.subheading("Settings");
        page.list(view.settings().stream().map(Setting::label).toList());
        page.subheading("Headline");
        page.note("Mean over all ok runs of each configuration (pooled over settings) with a 95% bootstrap interval;"
                + " the best value of each column is highlighted. n/a: undefined (for example a ratio with a zero"
                + " denominator)." + (data.groupCoordinates().isEmpty() ? "" : " One table per kind of truth, so"
                + " that every mean in a table comes from the same settings."));
        for (StudyView.Headline h : view.headlines()) {
            if (!h.title().isEmpty()) {
                page.subheading("Headline: " + h.title());
            }
            page.table(h.table());
            for (String line : h.notRun()) {
                page.note("Not run here: " + line);
            }
        }
    }

    private static void metricCharts(HtmlPage page, StudyView view) {
        ReportData data = view.data();
        page.section("metrics", "Metrics");
        boolean any = false;
        for (String metric : view.headlineMetrics()) {
            if (metric.equals("seconds")) {
                continue;
            }
            for (String axis : List.of(data.sampleCoordinate(), data.sizeCoordinate())) {
                any |= panels(page, view, metric, axis, AxisScale.LOG, AxisScale.LINEAR);
            }
        }
        if (!any) {
            page.note("No metric charts: the grid varies neither the sample size nor the graph size over numeric"
                    + " values, so the headline table says everything.");
        }
    }

    private static void runtime(HtmlPage page, StudyView view) {
        ReportData data = view.data();
        page.section("runtime", "Run time");
        boolean drawn = panels(page, view, "seconds", data.sizeCoordinate(), AxisScale.LOG, AxisScale.LOG);
        if (!drawn) {
            drawn = panels(page, view, "seconds", data.sampleCoordinate(), AxisScale.LOG, AxisScale.LOG);
        }
        if (!drawn) {
            page.note("No run-time chart: it needs the graph size or sample size to take at least two values and"
                    + " the 'seconds' metric in the study.");
        }
    }

    /**
     * Draws the metric against one numeric coordinate, one panel per combination of the other
     * coordinates; returns whether anything was drawn.
     */
    private static boolean panels(HtmlPage page, StudyView view, String metric, String axis, AxisScale xScale,
                                  AxisScale yScale) {
        ReportData data = view.data();
        Map<String, Map<String, List<ChartPoint>>> byPanel = new LinkedHashMap<>();
        Set<Double> xs = new TreeSet<>();
        for (AggregateRow a : data.summary()) {
            Double x = number(a.setting().get(axis));
            Summary s = a.summary();
            if (!a.metric().equals(metric) || x == null || s.mean() == null) {
                continue;
            }
            xs.add(x);
            String panel = without(a.setting(), axis, view.constantCoordinates());
            byPanel.computeIfAbsent(panel, k -> new LinkedHashMap<>())
                    .computeIfAbsent(a.configurationId(), k -> new ArrayList<>())
                    .add(new ChartPoint(x, s.mean(), s.low() == null ? Double.NaN : s.low(),
                            s.high() == null ? Double.NaN : s.high()));
        }
        if (xs.size() < 2) {
            return false;
        }
        page.subheading(metric + " against " + axis);
        int drawn = 0;
        for (var panel : byPanel.entrySet()) {
            if (drawn == MAX_PANELS) {
                page.note((byPanel.size() - MAX_PANELS) + " more panels are not drawn; see summary.csv.");
                break;
            }
            List<ChartSeries> series = new ArrayList<>();
            for (String c : view.configurations()) {
                List<ChartPoint> pts = panel.getValue().get(c);
                if (pts != null) {
                    pts.sort((p, q) -> Double.compare(p.x(), q.x()));
                    series.add(new ChartSeries(c, pts));
                }
            }
            String title = panel.getKey().isEmpty() ? metric : panel.getKey();
            LineChart chart = LineChart.of(title, axisLabel(axis), metricLabel(metric), series)
                    .withScales(xScale, yScale);
            if (isUnitInterval(metric) && yScale == AxisScale.LINEAR) {
                chart = chart.withRange(0, 1.02);
            }
            page.figure(chart.toSvg(WIDTH, HEIGHT), metric + " against " + axis
                    + (panel.getKey().isEmpty() ? "" : " for " + panel.getKey())
                    + "; bands: 95% bootstrap interval of the mean over replicates.");
            drawn++;
        }
        return true;
    }

    private static void precisionRecall(HtmlPage page, StudyView view) {
        ReportData data = view.data();
        page.section("precision-recall", "Precision against recall");
        boolean any = false;
        for (String kind : List.of("adjacency", "orientation")) {
            String p = kind + "_precision";
            String r = kind + "_recall";
            Map<String, List<ChartPoint>> byLearner = new LinkedHashMap<>();
            for (String c : view.configurations()) {
                Double prec = mean(data, c, p);
                Double rec = mean(data, c, r);
                if (prec != null && rec != null) {
                    byLearner.computeIfAbsent(view.learnerOf(c), k -> new ArrayList<>()).add(ChartPoint.of(rec, prec));
                }
            }
            if (byLearner.isEmpty()) {
                continue;
            }
            any = true;
            List<ChartSeries> series = new ArrayList<>();
            byLearner.forEach((learner, pts) -> {
                pts.sort((a, b) -> Double.compare(a.x(), b.x()));
                series.add(new ChartSeries(learner, pts));
            });
            LineChart chart = LineChart.of(kind + " precision against recall", kind + " recall",
                    kind + " precision", series).pointsOnly().withRange(0, 1.02);
            page.figure(chart.toSvg(WIDTH, HEIGHT), "One point per learner configuration (pooled over settings),"
                    + " joined across each learner's parameter grid.");
        }
        if (!any) {
            page.note("No precision-recall chart: the runs carry no precision and recall values.");
        }
    }

    private static Double mean(ReportData data, String config, String metric) {
        List<Double> values = new ArrayList<>();
        for (RunResult run : data.runs()) {
            Double v = run.configurationId().equals(config) ? run.value(metric) : null;
            if (v != null) {
                values.add(v);
            }
        }
        return values.isEmpty() ? null : values.stream().mapToDouble(Double::doubleValue).average().getAsDouble();
    }

    /** The search gap of the score-based learners, when the study asks for it. */
    private static void searchGap(HtmlPage page, StudyView view) {
        Table t = view.searchGap();
        if (t.isEmpty()) {
            return;
        }
        page.section("search-gap", "Search gap");
        page.paragraph(StudyView.SEARCH_GAP_READING);
        page.table(t);
    }

    private static void comparison(HtmlPage page, StudyView view) {
        ReportData data = view.data();
        page.section("comparison", "Paired comparison and ranking");
        if (data.comparisons().isEmpty()) {
            page.note("No paired comparison: the study names no reference learner (compare_to), or no pairs of ok"
                    + " runs exist yet.");
        } else {
            page.paragraph("Each configuration against the reference " + data.reference() + " on identical data sets."
                    + " Differences are configuration minus reference; p-values from the Wilcoxon signed-rank test,"
                    + " Holm-adjusted across configurations.");
            page.table(view.comparisons());
        }
        for (RankingResult r : data.rankings()) {
            if (r.configurations().size() < 2) {
                continue;
            }
            List<CriticalDifferenceDiagram.Entry> entries = new ArrayList<>();
            for (int i = 0; i < r.configurations().size(); i++) {
                Double rank = r.meanRanks().get(i);
                if (rank != null) {
                    entries.add(new CriticalDifferenceDiagram.Entry(r.configurations().get(i), rank));
                }
            }
            double cd = r.criticalDifference() == null ? Double.NaN : r.criticalDifference();
            page.figure(new CriticalDifferenceDiagram("Mean ranks on " + r.metric() + " over " + r.settingsUsed()
                    + " settings", entries, cd).toSvg(WIDTH), "Friedman χ² = " + Numbers.format(r.friedmanChiSquare())
                    + " on " + r.degreesOfFreedom() + " degrees of freedom, p = " + Numbers.format(r.friedmanPValue())
                    + "; thick lines join configurations whose mean ranks differ by less than the Nemenyi critical"
                    + " difference at α = " + r.alpha() + " (Demšar 2006)."
                    + (r.settingsDropped() > 0 ? " " + r.settingsDropped() + " settings lacked a value and were left out."
                    : ""));
        }
    }

    private static void audit(HtmlPage page, StudyView view) {
        ReportData data = view.data();
        page.section("audit", "Sortability audit");
        if (data.audits().isEmpty()) {
            page.note("No audit values were recorded for this study.");
            return;
        }
        page.paragraph("Varsortability (Reisach, Seiler and Weichwald 2021) and R²-sortability (Reisach et al. 2023):"
                + " the share of causal orderings that sorting by variance or by R² already gets right (0.5 is chance)."
                + " Values near 1 mean the simulated data leak the causal order through their scale.");
        Table.Builder t = Table.builder(List.of("setting", "varsortability", "R²-sortability"));
        for (ReportData.Audit a : data.audits()) {
            t.row(a.setting().label(), Numbers.format(a.varsortability()), Numbers.format(a.r2Sortability()));
        }
        page.table(t.build());
        String competitive = competitiveBaseline(view);
        if (competitive != null) {
            page.warning(competitive);
        }
    }

    /**
     * A warning when a scale-artefact baseline does at least as well as the median of the other
     * configurations on the first chosen metric that has a direction; null otherwise. Everyone's
     * mean is pooled over the settings where the baseline has ok runs, so a baseline skipped on
     * some data (say, discrete) is not compared with means that include those settings.
     */
    static String competitiveBaseline(StudyView view) {
        ReportData data = view.data();
        String metric = null;
        for (String m : data.metrics()) {
            if (data.higherIsBetter(m) != null) {
                metric = m;
                break;
            }
        }
        if (metric == null) {
            return null;
        }
        boolean higher = data.higherIsBetter(metric);
        for (String b : view.configurations()) {
            if (!data.scaleBaselines().contains(view.learnerOf(b))) {
                continue;
            }
            Set<Setting> ran = new HashSet<>();
            for (RunResult r : data.runs()) {
                if (r.configurationId().equals(b) && r.isOk()) {
                    ran.add(r.setting());
                }
            }
            Map<String, Map<String, Summary>> pool = view.pool(r -> ran.contains(r.setting()));
            Double mine = pool.get(b).get(metric).mean();
            List<Double> others = new ArrayList<>();
            for (String c : view.configurations()) {
                Double mean = pool.get(c).get(metric).mean();
                if (mean != null && !data.scaleBaselines().contains(view.learnerOf(c))) {
                    others.add(mean);
                }
            }
            if (mine == null || others.isEmpty()) {
                continue;
            }
            others.sort(Double::compare);
            double median = others.size() % 2 == 1 ? others.get(others.size() / 2)
                    : (others.get(others.size() / 2 - 1) + others.get(others.size() / 2)) / 2;
            boolean asGood = higher ? mine >= median : mine <= median;
            if (asGood) {
                return "The scale-artefact baseline " + b + " reaches " + Numbers.format(mine)
                        + " on " + metric + ", at least as good as the median of the other learners ("
                        + Numbers.format(median) + ") on the same settings. The simulated data likely reward sorting"
                        + " by scale rather than causal discovery; consider standardised data before drawing"
                        + " conclusions.";
            }
        }
        return null;
    }

    private static void pictures(HtmlPage page, ReportData data) {
        page.section("pictures", "Graph pictures");
        if (data.examples().isEmpty()) {
            page.note("No runs were chosen for pictures.");
            return;
        }
        long seed = 1;
        for (ReportData.Example e : data.examples()) {
            page.subheading(e.title());
            page.figure(new GraphPicture(e.truth(), e.estimate(), seed++).toSvg(), "Truth (left, of the estimate's"
                    + " class) beside the estimate (right). Solid: correct; dashed: missing; dotted: extra;"
                    + " dash-dot: wrong marks.");
        }
    }

    private static void failures(HtmlPage page, ReportData data) {
        page.section("failures", "Failures");
        Table.Builder t = Table.builder(List.of("status", "setting", "replicate", "learner configuration", "message"));
        int n = 0;
        for (RunResult r : data.runs()) {
            if (r.status() != RunStatus.OK) {
                n++;
                if (n <= 200) {
                    t.row(r.status().word(), r.setting().label(), Integer.toString(r.replicate()), r.configurationId(),
                            r.message());
                }
            }
        }
        if (n == 0) {
            page.note("Every run finished ok.");
            return;
        }
        page.table(t.build());
        if (n > 200) {
            page.note((n - 200) + " more are listed in runs.csv.");
        }
    }

    private static void provenance(HtmlPage page, ReportData data) {
        page.section("provenance", "Provenance");
        Table.Builder t = Table.builder(List.of("item", "value"));
        data.provenance().forEach(t::row);
        page.table(t.build());
    }

    /** The setting's label without {@code coordinate} and without coordinates that never vary. */
    private static String without(Setting s, String coordinate, Set<String> constant) {
        StringBuilder sb = new StringBuilder();
        s.coordinates().forEach((k, v) -> {
            if (!k.equals(coordinate) && !constant.contains(k)) {
                if (sb.length() > 0) {
                    sb.append(", ");
                }
                sb.append(k).append('=').append(v);
            }
        });
        return sb.toString();
    }

    private static Double number(String s) {
        if (s == null) {
            return null;
        }
        try {
            double d = Double.parseDouble(s);
            return Double.isFinite(d) ? d : null;
        } catch (NumberFormatException e) {
            return null;
        }
    }

    private static boolean isUnitInterval(String metric) {
        return metric.endsWith("_precision") || metric.endsWith("_recall") || metric.endsWith("_f1")
                || metric.startsWith("directed_") || metric.equals("exact");
    }

    private static String axisLabel(String coordinate) {
        if (coordinate.equals("samples")) {
            return "sample size (rows, log scale)";
        }
        if (coordinate.equals("nodes")) {
            return "graph size (variables, log scale)";
        }
        return coordinate;
    }

    private static String metricLabel(String metric) {
        return metric.equals("seconds") ? "run time (seconds, log scale)" : metric;
    }
}
