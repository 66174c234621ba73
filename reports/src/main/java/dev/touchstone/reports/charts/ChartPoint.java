package dev.touchstone.reports.charts;

/**
 * One point of a chart series: the value at {@code x} and its interval (NaN bounds when
 * there is none, drawn as a point without a band).
 */
public record ChartPoint(double x, double y, double low, double high) {

    public static ChartPoint of(double x, double y) {
        return new ChartPoint(x, y, Double.NaN, Double.NaN);
    }

    public boolean hasInterval() {
        return !Double.isNaN(low) && !Double.isNaN(high);
    }
}
