package dev.touchstone.reports.calibration;

import dev.touchstone.reports.Cautions;
import dev.touchstone.reports.charts.AxisScale;
import dev.touchstone.reports.charts.ChartPoint;
import dev.touchstone.reports.charts.ChartSeries;
import dev.touchstone.reports.charts.LineChart;
import dev.touchstone.reports.html.HtmlPage;
import dev.touchstone.reports.tables.MarkdownTable;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The calibration report in HTML (self-contained, charts as inline SVG from the same chart
 * code as the study report) and in Markdown. The cautions ({@link dev.touchstone.reports.Cautions}) come first, with
 * one more line, because this report is the one most likely to be read as a verdict on
 * real data. Cost: linear in the view, plus one chart per metric.
 */
public final class CalibrationReport {

    /** The extra caution of this report. */
    public static final String NOT_A_VERDICT = "These figures describe how the learners behave on data simulated to"
            + " resemble yours, under the stated assumptions; they are not a verdict on the graph learned from"
            + " your data.";

    /** The metrics drawn as charts, when present, in this order (the question's metric first). */
    static final List<String> CHARTED = List.of("orientation_precision", "orientation_recall", "adjacency_precision",
            "adjacency_recall", "shd");

    private CalibrationReport() {
    }

    /** The answer to the size question ({@link SizeAnswer}), one sentence per learner, as the report gives it. */
    public static List<String> answers(CalibrationView v) {
        return CalibrationTables.answers(v);
    }

    /** The HTML page. */
    public static String html(CalibrationView v) {
        HtmlPage page = new HtmlPage(v.title());
        List<String> cautions = new ArrayList<>(Cautions.LINES);
        cautions.add(NOT_A_VERDICT);
        page.box(Cautions.HEADING, cautions);
        for (String w : v.warnings()) {
            page.warning(w);
        }
        page.section("data", "Your data");
        page.list(v.dataLines());
        page.section("expected", String.format(Locale.ROOT, "What to expect at %,d rows", v.expectedAt()));
        if (v.expectedAt() != v.analystRows()) {
            page.note(nearest(v));
        }
        page.paragraph("Each learner was run on data sets simulated from truths fitted to your data (and perturbed"
                + " variants), of your size and shape. The median is the value of a typical single data set and"
                + " the 10%–90% range, which always contains it, is where most single data sets fall; the mean is"
                + " the long-run average, which a few bad data sets can pull outside that range.");
        page.table(CalibrationTables.expectations(v));
        page.section("rows", "With more (or fewer) rows");
        page.list(CalibrationTables.answers(v));
        for (String metric : CHARTED) {
            if (CalibrationTables.metrics(v).contains(metric)) {
                page.figure(chart(v, metric).toSvg(720, 340), metric + " against rows: median over replicates, band"
                        + " from the 10th to the 90th percentile; log scale of rows. "
                        + String.format(Locale.ROOT, "Your data have %,d rows.", v.analystRows()));
            }
        }
        for (String metric : CalibrationTables.metrics(v)) {
            page.subheading(metric);
            page.table(CalibrationTables.curve(v, metric));
        }
        page.section("edges", "Edges");
        page.paragraph("For each edge of the fitted truth: how often each learner found it on data simulated from"
                + " that truth at your size, next to how often it appears when the learner runs on bootstrap"
                + " resamples of your real data. Edges that are not in the fitted truth but appear in at least 20%"
                + " of bootstrap resamples are listed too. A high bootstrap frequency means stability, not truth.");
        page.table(CalibrationTables.edges(v));
        page.section("checks", "Checks of the fitted model");
        page.list(v.assumptions());
        page.table(CalibrationTables.checks(v));
        page.section("how", "How this was made");
        page.list(v.truthLines());
        page.list(v.settings());
        return page.render();
    }

    /** The Markdown document. */
    public static String markdown(CalibrationView v) {
        StringBuilder sb = new StringBuilder();
        sb.append("# ").append(v.title()).append("\n\n");
        sb.append("## ").append(Cautions.HEADING).append("\n\n");
        for (String line : Cautions.LINES) {
            sb.append("- ").append(line).append('\n');
        }
        sb.append("- ").append(NOT_A_VERDICT).append("\n\n");
        for (String w : v.warnings()) {
            sb.append("> **Warning:** ").append(w).append("\n\n");
        }
        sb.append("## Your data\n\n");
        bullets(sb, v.dataLines());
        sb.append(String.format(Locale.ROOT, "## What to expect at %,d rows%n%n", v.expectedAt()));
        if (v.expectedAt() != v.analystRows()) {
            sb.append(nearest(v)).append("\n\n");
        }
        sb.append(MarkdownTable.render(CalibrationTables.expectations(v))).append('\n');
        sb.append("## With more (or fewer) rows\n\n");
        bullets(sb, CalibrationTables.answers(v));
        for (String metric : CalibrationTables.metrics(v)) {
            sb.append("### ").append(metric).append("\n\n");
            sb.append(MarkdownTable.render(CalibrationTables.curve(v, metric))).append('\n');
        }
        sb.append("## Edges\n\n");
        sb.append(MarkdownTable.render(CalibrationTables.edges(v))).append('\n');
        sb.append("## Checks of the fitted model\n\n");
        bullets(sb, v.assumptions());
        sb.append(MarkdownTable.render(CalibrationTables.checks(v))).append('\n');
        sb.append("## How this was made\n\n");
        bullets(sb, v.truthLines());
        bullets(sb, v.settings());
        return sb.toString();
    }

    private static String nearest(CalibrationView v) {
        return String.format(Locale.ROOT, "Your data have %,d rows, a size not simulated; %,d is the nearest size"
                + " simulated.", v.analystRows(), v.expectedAt());
    }

    private static void bullets(StringBuilder sb, List<String> lines) {
        for (String l : lines) {
            sb.append("- ").append(l).append('\n');
        }
        sb.append('\n');
    }

    static LineChart chart(CalibrationView v, String metric) {
        List<ChartSeries> series = new ArrayList<>();
        for (String learner : v.learners()) {
            List<ChartPoint> pts = new ArrayList<>();
            for (CalibrationView.SizePoint p : CalibrationTables.points(v, learner, metric)) {
                CalibrationView.Spread s = p.spread();
                if (s.median() != null) {
                    pts.add(new ChartPoint(p.rows(), s.median(), s.p10() == null ? Double.NaN : s.p10(),
                            s.p90() == null ? Double.NaN : s.p90()));
                }
            }
            series.add(new ChartSeries(learner, pts));
        }
        LineChart c = LineChart.of(metric + " against rows", "rows", metric, series)
                .withScales(AxisScale.LOG, AxisScale.LINEAR);
        return metric.equals("shd") ? c : c.withRange(0, 1);
    }
}
