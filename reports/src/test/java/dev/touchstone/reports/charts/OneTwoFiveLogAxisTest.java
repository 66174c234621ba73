package dev.touchstone.reports.charts;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class OneTwoFiveLogAxisTest {

    @Test
    void ticksFollowTheOneTwoFiveSequence() {
        // The 1-2-5 sequence of preferred numbers on a decade scale (common practice).
        assertEquals(List.of(10.0, 20.0, 50.0, 100.0, 200.0, 500.0, 1000.0), OneTwoFiveLogAxis.ticks(10, 1000));
        assertEquals(List.of(0.002, 0.005, 0.01, 0.02), OneTwoFiveLogAxis.ticks(0.0015, 0.03));
        // beyond four decades, powers of ten only
        assertEquals(List.of(1.0, 10.0, 100.0, 1000.0, 10000.0, 100000.0), OneTwoFiveLogAxis.ticks(1, 1e5));
        // less than a decade (graph sizes 8 and 16 with the axis margins): evenly spaced at a 1-2-5 step
        assertEquals(List.of(8.0, 10.0, 12.0, 14.0, 16.0), OneTwoFiveLogAxis.ticks(7.7, 16.6));
        assertEquals("0.002", OneTwoFiveLogAxis.label(0.002));
        assertEquals("2000", OneTwoFiveLogAxis.label(2000));
    }

    @Test
    void aLogChartPrintsTheTicks() {
        List<ChartSeries> s = List.of(new ChartSeries("a", List.of(ChartPoint.of(100, 0.5), ChartPoint.of(2000, 0.9))));
        String svg = LineChart.of("t", "sample size", "y", s).withScales(AxisScale.LOG, AxisScale.LINEAR).toSvg(500, 300);
        for (String tick : List.of(">200<", ">500<", ">1000<")) {
            assertTrue(svg.contains(tick), "tick " + tick);
        }
    }
}
