package dev.touchstone.reports.charts;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.CategoryLabelPositions;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.renderer.category.BoxAndWhiskerRenderer;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.statistics.DefaultBoxAndWhiskerCategoryDataset;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Box plots of a metric's values across replicates, one group of boxes per setting and one
 * box per learner configuration (coloured by its identity). Boxes span the quartiles with the
 * median as a line and the mean as a dot; whiskers reach the most extreme values within 1.5
 * interquartile ranges of the box and points beyond are drawn as outliers (Tukey 1977,
 * "Exploratory Data Analysis"; computed by JFreeChart's {@code BoxAndWhiskerCalculator}).
 */
public final class BoxPlot {

    /** The values of one configuration (by label and identity) on one setting. */
    public record Group(String setting, String configuration, int identity, List<Double> values) {
        public Group {
            values = List.copyOf(values);
        }
    }

    private final String title;
    private final String valueLabel;
    private final List<Group> groups;
    private final Double min;
    private final Double max;

    private BoxPlot(String title, String valueLabel, List<Group> groups, Double min, Double max) {
        this.title = Objects.requireNonNull(title);
        this.valueLabel = valueLabel;
        this.groups = List.copyOf(groups);
        this.min = min;
        this.max = max;
    }

    public static BoxPlot of(String title, String valueLabel, List<Group> groups) {
        return new BoxPlot(title, valueLabel, groups, null, null);
    }

    /** The same chart with a fixed value range. */
    public BoxPlot withRange(double lo, double hi) {
        return new BoxPlot(title, valueLabel, groups, lo, hi);
    }

    public String title() {
        return title;
    }

    /** The chart as an {@code <svg>} element of this size. */
    public String toSvg(int width, int height) {
        return figure(width, height).toSvg();
    }

    /** The chart as a figure of this size (for SVG and PDF). */
    public Figure figure(int width, int height) {
        DefaultBoxAndWhiskerCategoryDataset data = new DefaultBoxAndWhiskerCategoryDataset();
        Map<String, Integer> identities = new LinkedHashMap<>();
        for (Group g : groups) {
            if (!g.values().isEmpty()) {
                data.add(new ArrayList<>(g.values()), g.configuration(), g.setting());
                identities.putIfAbsent(g.configuration(), g.identity());
            }
        }
        BoxAndWhiskerRenderer r = new BoxAndWhiskerRenderer();
        r.setMeanVisible(true);
        r.setMaximumBarWidth(0.06);
        r.setItemMargin(0.1);
        r.setUseOutlinePaintForWhiskers(false);
        r.setDefaultOutlinePaint(Color.DARK_GRAY);
        r.setDefaultOutlineStroke(new BasicStroke(0.8f));
        for (Map.Entry<String, Integer> e : identities.entrySet()) {
            int row = data.getRowIndex(e.getKey());
            r.setSeriesPaint(row, SeriesStyle.colour(e.getValue()));
            r.setSeriesOutlinePaint(row, Color.DARK_GRAY);
        }
        CategoryAxis x = new CategoryAxis(null);
        x.setTickLabelFont(new Font("SansSerif", Font.PLAIN, 10));
        x.setMaximumCategoryLabelLines(3);
        x.setCategoryLabelPositions(CategoryLabelPositions.STANDARD);
        NumberAxis y = new NumberAxis(valueLabel);
        y.setAutoRangeIncludesZero(false);
        y.setLabelFont(new Font("SansSerif", Font.PLAIN, 12));
        y.setTickLabelFont(new Font("SansSerif", Font.PLAIN, 10));
        if (min != null && max != null) {
            y.setRange(min, max);
        }
        CategoryPlot plot = new CategoryPlot(data, x, y, r);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(new Color(0xDD, 0xDD, 0xDD));
        plot.setOutlinePaint(new Color(0x99, 0x99, 0x99));
        JFreeChart chart = new JFreeChart(title, new Font("SansSerif", Font.BOLD, 14), plot, true);
        chart.setBackgroundPaint(Color.WHITE);
        LegendTitle legend = chart.getLegend();
        legend.setPosition(RectangleEdge.BOTTOM);
        legend.setFrame(BlockBorder.NONE);
        legend.setItemFont(new Font("SansSerif", Font.PLAIN, 11));
        return Figure.of(chart, width, height);
    }
}
