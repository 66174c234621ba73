package dev.touchstone.reports;

import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RankingResult;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Summary;
import dev.touchstone.reports.charts.AxisScale;
import dev.touchstone.reports.charts.BoxPlot;
import dev.touchstone.reports.charts.DifferenceHeatMap;
import dev.touchstone.reports.charts.Figure;
import dev.touchstone.reports.charts.GraphLayout;
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
import java.util.LinkedHashSet;
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
    /** Chart size: two charts sit side by side on a page 1100 px wide. */
    private static final int WIDTH = 340;
    private static final int HEIGHT = 270;
    /** Wider charts (many boxes, the heat map): two side by side, or one across the page. */
    private static final int WIDE = 520;
    private static final int WIDE_HEIGHT = 320;
    private static final int FULL_WIDTH = 1050;

    private HtmlReport() {
    }

    public static String render(ReportData data) {
        return build(data).html();
    }

    /** The page and, beside it, every chart and table it shows, for export as separate files. */
    public static ReportArtifacts build(ReportData data) {
        StudyView view = new StudyView(data);
        Page page = new Page(new HtmlPage("Touchstone study: " + data.studyName()
                + (data.partial() ? " (partial)" : "")), new ReportArtifacts.Collector());
        overview(page, view);
        page.html.box(Cautions.HEADING, Cautions.LINES);
        metricCharts(page, view);
        distributions(page, view);
        runtime(page, view);
        precisionRecall(page, view);
        comparison(page, view);
        searchGap(page, view);
        audit(page, view);
        pictures(page, view);
        failures(page, data);
        provenance(page, data);
        return page.files.build(page.html.render());
    }

    /** The page being written and the files collected beside it. */
    private record Page(HtmlPage html, ReportArtifacts.Collector files) {
        void figure(String name, Figure figure, String caption) {
            String svg = figure.toSvg();
            html.figure(svg, caption);
            files.figure(name, new ReportArtifacts.Chart(svg, figure));
        }

        void table(String name, Table t) {
            html.table(t);
            files.table(name, t);
        }
    }

    private static void overview(Page page, StudyView view) {
        ReportData data = view.data();
        HtmlPage html = page.html();
        html.section("overview", "Overview");
        if (data.partial()) {
            html.warning("This study is not finished (still running or interrupted): the figures below cover only"
                    + " the runs recorded so far.");
        }
        if (!data.description().isBlank()) {
            html.paragraph(data.description().strip());
        }
        Map<RunStatus, Integer> counts = view.statusCounts();
        html.paragraph(view.settings().size() + " settings, " + view.configurations().size()
                + " learner configurations, " + data.runs().size() + " runs: " + counts.get(RunStatus.OK) + " ok, "
                + counts.get(RunStatus.FAILED) + " failed, " + counts.get(RunStatus.TIMEOUT) + " timed out, "
                + counts.get(RunStatus.SKIPPED) + " skipped.");
        Table.Builder configs = Table.builder(List.of("learner configuration", "learner", "parameters",
                "scored against"));
        for (String c : view.configurations()) {
            configs.row(c, view.learnerOf(c), view.parametersOf(c).toString().replaceAll("[{}]", ""),
                    String.join(", ", view.truthClassesOf(c)));
        }
        html.subheading("Learner configurations");
        html.note("Each configuration keeps its colour and marker in every chart of this report.");
        Table configTable = configs.build();
        html.table(configTable, view.swatches(), false);
        page.files().table("configurations", configTable);
        html.subheading("Settings");
        html.list(view.settings().stream().map(Setting::label).toList());
        html.subheading("Headline");
        html.note("Mean over all ok runs of each configuration (pooled over settings) with a 95% bootstrap interval;"
                + " the best value of each column is highlighted. n/a: undefined (for example a ratio with a zero"
                + " denominator)." + (data.groupCoordinates().isEmpty() ? "" : " One table per kind of truth, so"
                + " that every mean in a table comes from the same settings."));
        for (StudyView.Headline h : view.headlines()) {
            if (!h.title().isEmpty()) {
                html.subheading("Headline: " + h.title());
            }
            if (!h.scoredAgainst().isEmpty()) {
                html.note(h.scoredAgainst());
            }
            html.table(h.table(), view.swatches(), true);
            page.files().table("headline" + (h.title().isEmpty() ? "" : " " + h.title()), h.table());
            for (String line : h.notRun()) {
                html.note("Not run here: " + line);
            }
        }
    }

    private static void metricCharts(Page page, StudyView view) {
        ReportData data = view.data();
        page.html().section("metrics", "Metrics");
        page.html().note("Means over replicates with their 95% bootstrap interval as a band; one panel per"
                + " combination of the other settings and per class of truth scored against, never pooled.");
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
            page.html().note("No metric charts: the grid varies neither the sample size nor the graph size over"
                    + " numeric values, so the headline table and the distributions say everything.");
        }
    }

    private static void runtime(Page page, StudyView view) {
        ReportData data = view.data();
        page.html().section("runtime", "Run time");
        boolean drawn = panels(page, view, "seconds", data.sizeCoordinate(), AxisScale.LOG, AxisScale.LOG);
        if (!drawn) {
            drawn = panels(page, view, "seconds", data.sampleCoordinate(), AxisScale.LOG, AxisScale.LOG);
        }
        if (!drawn) {
            page.html().note("No run-time chart: it needs the graph size or sample size to take at least two values"
                    + " and the 'seconds' metric in the study.");
        }
    }

    /**
     * Draws the metric against one numeric coordinate, one panel per combination of the other
     * coordinates and per class of truth the runs were scored against; returns whether
     * anything was drawn.
     */
    private static boolean panels(Page page, StudyView view, String metric, String axis, AxisScale xScale,
                                  AxisScale yScale) {
        ReportData data = view.data();
        Map<String, Map<String, List<ChartPoint>>> byPanel = new LinkedHashMap<>();
        Set<Double> xs = new TreeSet<>();
        boolean severalClasses = view.truthClasses().size() > 1;
        for (AggregateRow a : data.summary()) {
            Double x = number(a.setting().get(axis));
            Summary s = a.summary();
            if (!a.metric().equals(metric) || x == null || s.mean() == null) {
                continue;
            }
            xs.add(x);
            String panel = without(a.setting(), axis, view.constantCoordinates());
            String truth = view.truthClassOf(a.setting(), a.configurationId());
            if (severalClasses && truth != null) {
                panel = (panel.isEmpty() ? "" : panel + "; ") + "vs true " + truth.toUpperCase(java.util.Locale.ROOT);
            }
            byPanel.computeIfAbsent(panel, k -> new LinkedHashMap<>())
                    .computeIfAbsent(a.configurationId(), k -> new ArrayList<>())
                    .add(new ChartPoint(x, s.mean(), s.low() == null ? Double.NaN : s.low(),
                            s.high() == null ? Double.NaN : s.high()));
        }
        if (xs.size() < 2) {
            return false;
        }
        String heading = MetricWords.of(metric) + " against " + MetricWords.axis(axis, false);
        page.html().subheading(capitalised(heading));
        page.html().beginGrid();
        int drawn = 0;
        for (var panel : byPanel.entrySet()) {
            if (drawn == MAX_PANELS) {
                page.html().endGrid();
                page.html().note((byPanel.size() - MAX_PANELS) + " more panels are not drawn; see summary.csv.");
                page.html().beginGrid();
                break;
            }
            List<ChartSeries> series = new ArrayList<>();
            for (String c : view.configurations()) {
                List<ChartPoint> pts = panel.getValue().get(c);
                if (pts != null) {
                    pts.sort((p, q) -> Double.compare(p.x(), q.x()));
                    series.add(new ChartSeries(c, pts, view.identity(c)));
                }
            }
            String title = panel.getKey().isEmpty() ? capitalised(heading) : panel.getKey();
            LineChart chart = LineChart.of(title, MetricWords.axis(axis, xScale == AxisScale.LOG),
                    MetricWords.of(metric) + (yScale == AxisScale.LOG ? ", log scale" : ""), series)
                    .withScales(xScale, yScale);
            if (isUnitInterval(metric) && yScale == AxisScale.LINEAR) {
                chart = chart.withRange(0, 1.02);
            }
            page.figure(metric + " against " + axis + " " + panel.getKey(), chart.figure(WIDTH, HEIGHT), "");
            drawn++;
        }
        page.html().endGrid();
        return true;
    }

    /** Box plots of each chosen metric across replicates, per setting, one box per configuration. */
    private static void distributions(Page page, StudyView view) {
        ReportData data = view.data();
        page.html().section("distributions", "Distributions over replicates");
        List<Setting> settings = view.settings();
        boolean any = false;
        for (String metric : data.metrics()) {
            if (metric.equals("seconds")) {
                continue;
            }
            List<BoxPlot.Group> groups = new ArrayList<>();
            for (Setting s : settings) {
                for (String c : view.configurations()) {
                    List<Double> values = new ArrayList<>();
                    for (RunResult r : data.runs()) {
                        Double v = r.setting().equals(s) && r.configurationId().equals(c) ? r.value(metric) : null;
                        if (v != null && Double.isFinite(v)) {
                            values.add(v);
                        }
                    }
                    if (!values.isEmpty()) {
                        groups.add(new BoxPlot.Group(view.shortLabel(s), c, view.identity(c), values));
                    }
                }
            }
            if (groups.isEmpty()) {
                continue;
            }
            if (!any) {
                page.html().note("Per setting, the values of each configuration across replicates: box from the"
                        + " lower to the upper quartile, line at the median, dot at the mean, whiskers to the most"
                        + " extreme values within 1.5 interquartile ranges (Tukey 1977), rings beyond.");
            }
            any = true;
            BoxPlot chart = BoxPlot.of(capitalised(MetricWords.of(metric)) + " per setting",
                    MetricWords.of(metric), groups);
            if (isUnitInterval(metric)) {
                chart = chart.withRange(0, 1.02);
            }
            // Boxes of configurations scored against different classes of truth stand side by side: say which is which.
            page.figure("distribution " + metric, chart.figure(FULL_WIDTH, WIDE_HEIGHT),
                    view.truthClasses().size() > 1 ? view.scoredAgainst(r -> r.value(metric) != null) : "");
        }
        if (!any) {
            page.html().note("No distributions: no ok run carries a value of the chosen metrics.");
        }
    }

    private static void precisionRecall(Page page, StudyView view) {
        ReportData data = view.data();
        page.html().section("precision-recall", "Precision against recall");
        page.html().note("One point per learner configuration: its mean over its ok runs scored against the class of"
                + " truth the chart names; runs scored against another class are in their own chart.");
        boolean any = false;
        page.html().beginGrid();
        for (String truth : view.truthClasses()) {
            for (String kind : List.of("adjacency", "orientation")) {
                List<ChartSeries> series = new ArrayList<>();
                for (String c : view.configurations()) {
                    Double prec = mean(data, c, kind + "_precision", truth);
                    Double rec = mean(data, c, kind + "_recall", truth);
                    if (prec != null && rec != null) {
                        series.add(new ChartSeries(c, List.of(ChartPoint.of(rec, prec)), view.identity(c)));
                    }
                }
                if (series.isEmpty()) {
                    continue;
                }
                any = true;
                String title = capitalised(kind) + " precision against recall, against the true "
                        + truth.toUpperCase(java.util.Locale.ROOT);
                LineChart chart = LineChart.of(title, kind + " recall (0–1)", kind + " precision (0–1)", series)
                        .pointsOnly().withRange(0, 1.02).withDomain(0, 1.02);
                page.figure(kind + " precision recall " + truth, chart.figure(WIDTH, HEIGHT), "");
            }
        }
        page.html().endGrid();
        if (!any) {
            page.html().note("No precision-recall chart: the runs carry no precision and recall values.");
        }
    }

    private static Double mean(ReportData data, String config, String metric, String truth) {
        List<Double> values = new ArrayList<>();
        for (RunResult run : data.runs()) {
            boolean in = run.configurationId().equals(config) && run.scoredAgainst() != null
                    && run.scoredAgainst().word().equals(truth);
            Double v = in ? run.value(metric) : null;
            if (v != null) {
                values.add(v);
            }
        }
        return values.isEmpty() ? null : values.stream().mapToDouble(Double::doubleValue).average().getAsDouble();
    }

    /** The search gap of the score-based learners, when the study asks for it. */
    private static void searchGap(Page page, StudyView view) {
        Table t = view.searchGap();
        if (t.isEmpty()) {
            return;
        }
        page.html().section("search-gap", "Search gap");
        page.html().paragraph(StudyView.SEARCH_GAP_READING);
        page.table("search-gap", t);
    }

    private static void comparison(Page page, StudyView view) {
        ReportData data = view.data();
        HtmlPage html = page.html();
        html.section("comparison", "Paired comparison and ranking");
        if (data.comparisons().isEmpty()) {
            html.note("No paired comparison: the study names no reference learner (compare_to), or no pairs of ok"
                    + " runs exist yet.");
        } else {
            List<ComparisonRow> rows = new ArrayList<>();
            int empty = 0;
            for (ComparisonRow c : data.comparisons()) {
                if (c.pairs() > 0 && c.meanDifference() != null) {
                    rows.add(c);
                } else {
                    empty++;
                }
            }
            html.paragraph("Each configuration against the reference " + data.reference() + " on identical data"
                    + " sets: the mean of the paired differences (configuration minus reference) per setting,"
                    + " coloured blue where the configuration is better and red where it is worse; a ring marks a"
                    + " Holm-adjusted Wilcoxon signed-rank p-value below 0.05 (Holm across configurations)."
                    + (empty == 0 ? "" : " " + empty + " comparisons without any pair of ok runs are left out.")
                    + (view.truthClasses().size() > 1 ? " " + view.scoredAgainst(r -> true) : ""));
            List<DifferenceHeatMap.Cell> cells = new ArrayList<>();
            List<DifferenceHeatMap.Block> blocks = new ArrayList<>();
            Set<String> settings = new LinkedHashSet<>();
            for (ComparisonRow c : rows) {
                settings.add(view.shortLabel(c.setting()));
            }
            for (String metric : data.metrics()) {
                Set<String> configs = new LinkedHashSet<>();
                for (ComparisonRow c : rows) {
                    if (c.metric().equals(metric)) {
                        configs.add(c.configurationId());
                        cells.add(new DifferenceHeatMap.Cell(metric, c.configurationId(), view.shortLabel(c.setting()),
                                c.meanDifference(), c.pHolm()));
                    }
                }
                List<String> ordered = new ArrayList<>();
                for (String c : view.configurations()) {
                    if (configs.contains(c)) {
                        ordered.add(c);
                    }
                }
                if (!ordered.isEmpty()) {
                    blocks.add(new DifferenceHeatMap.Block(metric, capitalised(MetricWords.of(metric)),
                            data.higherIsBetter(metric), ordered));
                }
            }
            String title = "Mean paired difference from " + data.reference() + " per setting";
            page.figure("comparison heat map", new DifferenceHeatMap(title, blocks, new ArrayList<>(settings), cells)
                    .figure(FULL_WIDTH), title + ", one block of rows per metric, each with its own colour scale.");
            Table full = view.comparisons(rows);
            html.beginDetails("The full table of paired comparisons (" + rows.size() + " rows; also in"
                    + " comparisons.csv)");
            page.table("comparisons", full);
            html.endDetails();
        }
        List<String> notDrawn = new ArrayList<>();
        html.beginGrid();
        for (RankingResult r : data.rankings()) {
            String why = rankingFigure(page, r);
            if (why != null) {
                notDrawn.add(why);
            }
        }
        html.endGrid();
        if (!notDrawn.isEmpty()) {
            html.note("No critical-difference diagram for " + String.join("; ", notDrawn) + ". A diagram ranks the"
                    + " configurations over settings, and below that many settings the Friedman test cannot reach"
                    + " p < 0.05 with any outcome: the most extreme one, every setting ranking alike, has exact"
                    + " probability (k!)^-(N-1) for k configurations and N settings.");
        }
    }

    /** Draws the ranking's diagram, or returns why not (null when drawn or nothing to rank). */
    private static String rankingFigure(Page page, RankingResult r) {
        int k = 0;
        for (Double rank : r.meanRanks()) {
            k += rank == null ? 0 : 1;
        }
        if (k < 2) {
            return null;
        }
        int needed = CriticalDifferenceDiagram.minimumSettings(k, r.alpha());
        String words = MetricWords.of(r.metric());
        if (r.settingsUsed() < needed) {
            return words + " (" + r.settingsUsed() + (r.settingsUsed() == 1 ? " setting" : " settings")
                    + " with a value for every configuration; " + k
                    + " configurations need at least " + needed + ")";
        }
        List<CriticalDifferenceDiagram.Entry> entries = new ArrayList<>();
        for (int i = 0; i < r.configurations().size(); i++) {
            Double rank = r.meanRanks().get(i);
            if (rank != null) {
                entries.add(new CriticalDifferenceDiagram.Entry(r.configurations().get(i), rank));
            }
        }
        double cd = r.criticalDifference() == null ? Double.NaN : r.criticalDifference();
        page.figure("ranks " + r.metric(), new CriticalDifferenceDiagram(capitalised(words) + ": mean ranks over "
                + r.settingsUsed() + " settings", entries, cd).figure(WIDE), "Friedman χ² = "
                + Numbers.format(r.friedmanChiSquare()) + " on " + r.degreesOfFreedom() + " degrees of freedom, p = "
                + Numbers.format(r.friedmanPValue()) + "; thick lines join configurations whose mean ranks differ by"
                + " less than the Nemenyi critical difference at α = " + r.alpha() + " (Demšar 2006)."
                + (r.settingsUsed() <= 10 ? " With 10 settings or fewer the χ² approximation is rough (Demšar 2006"
                + " suggests more than 10)." : "")
                + (r.settingsDropped() > 0 ? " " + r.settingsDropped() + " settings lacked a value and were left out."
                : ""));
        return null;
    }

    private static void audit(Page p, StudyView view) {
        HtmlPage page = p.html();
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
        p.table("sortability audit", t.build());
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

    private static void pictures(Page page, StudyView view) {
        ReportData data = view.data();
        page.html().section("pictures", "Graph pictures");
        if (!data.pictureRule().isEmpty()) {
            page.html().paragraph(data.pictureRule());
        }
        if (data.examples().isEmpty()) {
            page.html().note("No runs are pictured: no run met the rule above (or the study records no data to"
                    + " draw them from).");
            return;
        }
        page.html().note("One layout per truth, shared by every estimate of it. Truth panel: solid black, edges the"
                + " estimate has with the same marks; dashed grey, edges it misses; dash-dot orange, edges it"
                + " has with other marks. Estimate panel: the same, and dotted red for edges the truth lacks.");
        GraphLayout.Cache layouts = new GraphLayout.Cache();
        page.html().beginGrid();
        for (ReportData.Example e : data.examples()) {
            page.figure("picture " + e.title(), new GraphPicture(e.truth(), e.estimate(), layouts.of(e.truth()))
                    .figure(), e.title() + ": truth (left) beside the estimate (right).");
        }
        page.html().endGrid();
    }

    /**
     * Failed and timed-out runs one per line; skipped runs (expected: a learner that does not
     * accept the data) grouped by configuration and reason with their count.
     */
    private static void failures(Page page, ReportData data) {
        HtmlPage html = page.html();
        html.section("failures", "Failures and skipped runs");
        Table.Builder t = Table.builder(List.of("status", "setting", "replicate", "learner configuration", "message"));
        Map<String, Integer> skipped = new LinkedHashMap<>();
        int n = 0;
        for (RunResult r : data.runs()) {
            if (r.status() == RunStatus.SKIPPED) {
                skipped.merge(r.configurationId() + "\u0000" + r.message(), 1, Integer::sum);
            } else if (r.status() != RunStatus.OK) {
                n++;
                if (n <= 200) {
                    t.row(r.status().word(), r.setting().label(), Integer.toString(r.replicate()), r.configurationId(),
                            r.message());
                }
            }
        }
        if (n == 0) {
            html.note("No run failed or timed out.");
        } else {
            html.subheading("Failed and timed-out runs (" + n + ")");
            page.table("failures", t.build());
            if (n > 200) {
                html.note((n - 200) + " more are listed in runs.csv.");
            }
        }
        if (!skipped.isEmpty()) {
            html.subheading("Skipped runs, expected (" + skipped.values().stream().mapToInt(Integer::intValue).sum()
                    + ")");
            Table.Builder s = Table.builder(List.of("learner configuration", "reason", "runs"));
            skipped.forEach((key, count) -> {
                String[] parts = key.split("\u0000", 2);
                s.row(parts[0], parts[1], Integer.toString(count));
            });
            page.table("skipped", s.build());
        }
    }

    private static void provenance(Page page, ReportData data) {
        page.html().section("provenance", "Provenance");
        Table.Builder t = Table.builder(List.of("item", "value"));
        data.provenance().forEach(t::row);
        page.table("provenance", t.build());
    }

    private static String capitalised(String s) {
        return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
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

}
