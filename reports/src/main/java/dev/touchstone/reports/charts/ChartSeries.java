package dev.touchstone.reports.charts;

import java.util.List;

/** A named line of a chart (one learner configuration), its points in drawing order. */
public record ChartSeries(String name, List<ChartPoint> points) {

    public ChartSeries {
        points = List.copyOf(points);
    }
}
