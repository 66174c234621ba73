package dev.touchstone.reports.charts;

import java.util.List;

/**
 * A named line of a chart (one learner configuration), its points in drawing order, and its
 * identity index in {@link SeriesStyle} (the configuration's position in the study's learner
 * order; negative: take the series' position in the chart).
 */
public record ChartSeries(String name, List<ChartPoint> points, int identity) {

    public ChartSeries {
        points = List.copyOf(points);
    }

    /** A series styled by its position in the chart. */
    public ChartSeries(String name, List<ChartPoint> points) {
        this(name, points, -1);
    }
}
