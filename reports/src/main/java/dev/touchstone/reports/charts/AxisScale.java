package dev.touchstone.reports.charts;

/** Linear or logarithmic (base 10) axis. */
public enum AxisScale {
    LINEAR,
    LOG
}
