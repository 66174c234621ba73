package dev.touchstone.reports.charts;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.util.List;
import java.util.Objects;

/**
 * A chart of a value against a numeric axis, one line per series with its interval drawn
 * as a translucent band (JFreeChart's {@link DeviationRenderer}), or, with
 * {@link #pointsOnly()}, markers joined by thin lines (for precision against recall).
 * Drawn as a {@link Figure}.
 */
public final class LineChart {

    private final String title;
    private final String xLabel;
    private final String yLabel;
    private final AxisScale xScale;
    private final AxisScale yScale;
    private final List<ChartSeries> series;
    private final boolean bands;
    private final Double yMin;
    private final Double yMax;
    private Double xMin;
    private Double xMax;

    private LineChart(String title, String xLabel, String yLabel, AxisScale xScale, AxisScale yScale,
                      List<ChartSeries> series, boolean bands, Double yMin, Double yMax) {
        this.title = Objects.requireNonNull(title);
        this.xLabel = xLabel;
        this.yLabel = yLabel;
        this.xScale = xScale;
        this.yScale = yScale;
        this.series = List.copyOf(series);
        this.bands = bands;
        this.yMin = yMin;
        this.yMax = yMax;
    }

    /** A chart with linear axes and interval bands. */
    public static LineChart of(String title, String xLabel, String yLabel, List<ChartSeries> series) {
        return new LineChart(title, xLabel, yLabel, AxisScale.LINEAR, AxisScale.LINEAR, series, true, null, null);
    }

    public LineChart withScales(AxisScale x, AxisScale y) {
        return sameDomain(new LineChart(title, xLabel, yLabel, x, y, series, bands, yMin, yMax));
    }

    /** The same chart with a fixed value range (e.g. [0, 1] for precision). */
    public LineChart withRange(double min, double max) {
        return sameDomain(new LineChart(title, xLabel, yLabel, xScale, yScale, series, bands, min, max));
    }

    /** A fresh copy (set only here, before it is handed out) keeps this chart's horizontal range. */
    private LineChart sameDomain(LineChart c) {
        c.xMin = xMin;
        c.xMax = xMax;
        return c;
    }

    /** The same chart with a fixed range of the horizontal axis. */
    public LineChart withDomain(double min, double max) {
        LineChart c = new LineChart(title, xLabel, yLabel, xScale, yScale, series, bands, yMin, yMax);
        c.xMin = min;
        c.xMax = max;
        return c;
    }

    /** Markers joined by thin lines, no bands. */
    public LineChart pointsOnly() {
        return sameDomain(new LineChart(title, xLabel, yLabel, xScale, yScale, series, false, yMin, yMax));
    }

    public String title() {
        return title;
    }

    public List<ChartSeries> series() {
        return series;
    }

    /** The chart as an {@code <svg>} element of this size. */
    public String toSvg(int width, int height) {
        return figure(width, height).toSvg();
    }

    /** The chart as a figure of this size (for SVG and PDF). */
    public Figure figure(int width, int height) {
        return Figure.of(build(), width, height);
    }

    JFreeChart build() {
        YIntervalSeriesCollection data = new YIntervalSeriesCollection();
        for (ChartSeries s : series) {
            YIntervalSeries ys = new YIntervalSeries(s.name(), false, true);
            for (ChartPoint p : s.points()) {
                if (!finite(p.x(), xScale) || !finite(p.y(), yScale)) {
                    continue;
                }
                double lo = p.hasInterval() ? p.low() : p.y();
                double hi = p.hasInterval() ? p.high() : p.y();
                if (yScale == AxisScale.LOG) {
                    lo = lo > 0 ? lo : p.y();
                }
                ys.add(p.x(), p.y(), lo, hi);
            }
            data.addSeries(ys);
        }
        XYLineAndShapeRenderer renderer;
        if (bands) {
            DeviationRenderer d = new DeviationRenderer(true, true);
            d.setAlpha(0.18f);
            renderer = d;
        } else {
            renderer = new XYLineAndShapeRenderer(true, true);
        }
        for (int i = 0; i < series.size(); i++) {
            int id = series.get(i).identity() < 0 ? i : series.get(i).identity();
            renderer.setSeriesPaint(i, SeriesStyle.colour(id));
            renderer.setSeriesFillPaint(i, SeriesStyle.colour(id));
            renderer.setSeriesStroke(i, bands ? SeriesStyle.stroke(id) : new BasicStroke(1f));
            renderer.setSeriesShape(i, SeriesStyle.shape(id));
        }
        renderer.setUseFillPaint(false);
        XYPlot plot = new XYPlot(data, axis(xLabel, xScale, xMin, xMax), axis(yLabel, yScale, yMin, yMax), renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xDD, 0xDD, 0xDD));
        plot.setRangeGridlinePaint(new Color(0xDD, 0xDD, 0xDD));
        plot.setOutlinePaint(new Color(0x99, 0x99, 0x99));
        JFreeChart chart = new JFreeChart(title, new Font("SansSerif", Font.BOLD, 14), plot, true);
        chart.setBackgroundPaint(Color.WHITE);
        LegendTitle legend = chart.getLegend();
        legend.setPosition(RectangleEdge.BOTTOM);
        legend.setFrame(BlockBorder.NONE);
        legend.setItemFont(new Font("SansSerif", Font.PLAIN, 11));
        return chart;
    }

    private static boolean finite(double v, AxisScale scale) {
        return !Double.isNaN(v) && !Double.isInfinite(v) && (scale == AxisScale.LINEAR || v > 0);
    }

    private static ValueAxis axis(String label, AxisScale scale, Double min, Double max) {
        ValueAxis a;
        if (scale == AxisScale.LOG) {
            a = new OneTwoFiveLogAxis(label);
        } else {
            NumberAxis n = new NumberAxis(label);
            n.setAutoRangeIncludesZero(false);
            a = n;
        }
        a.setLabelFont(new Font("SansSerif", Font.PLAIN, 12));
        a.setTickLabelFont(new Font("SansSerif", Font.PLAIN, 10));
        if (min != null && max != null) {
            a.setRange(min, max);
        }
        return a;
    }
}
