package dev.touchstone.reports.calibration;

import dev.touchstone.reports.Cautions;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CalibrationReportTest {

    static CalibrationView.SizePoint p(int rows, double mean) {
        return new CalibrationView.SizePoint("pc", "orientation_precision", rows, mean,
                new CalibrationView.Spread(mean - 0.1, mean, mean + 0.1));
    }

    @Test
    @DisplayName("rows to reach a target: linear interpolation in log(rows), worked by hand")
    void interpolation() {
        // Between 400 (0.7) and 1600 (0.9), 0.8 lies half-way in log scale: √(400·1600) = 800.
        assertEquals(800.0, SizeAnswer.rowsToReach(List.of(p(200, 0.6), p(400, 0.7), p(1600, 0.9)), 0.8));
        // A quarter of the way from 0.7 to 0.9 in log(rows) from 400 to 1600: 400 · 4^0.25 ≈ 565.7 → 566.
        assertEquals(566.0, SizeAnswer.rowsToReach(List.of(p(400, 0.7), p(1600, 0.9)), 0.75));
        assertNull(SizeAnswer.rowsToReach(List.of(p(400, 0.5), p(800, 0.6)), 0.8));
        assertEquals(400.0, SizeAnswer.rowsToReach(List.of(p(800, 0.95), p(400, 0.85)), 0.8));
        CalibrationView.Target t = new CalibrationView.Target("orientation_precision", 0.8);
        assertTrue(SizeAnswer.sentence("pc", List.of(p(400, 0.5), p(800, 0.6)), t, 400)
                .contains("does not reach a mean orientation_precision 0.800 within the sizes tried (up to 800 rows)"));
        assertTrue(SizeAnswer.sentence("pc", List.of(p(200, 0.6), p(400, 0.7), p(1600, 0.9)), t, 400)
                .contains("about 800 rows (about 2.0 times your 400 rows"));
        assertTrue(SizeAnswer.sentence("pc", List.of(p(200, 0.9), p(400, 0.95)), t, 400)
                .contains("already at the smallest size tried (200 rows)"));
    }

    @Test
    @DisplayName("a curve that dips below the target again: the answer is where the means stay at or above it")
    void nonMonotoneCurve() {
        // Means 0.85, 0.75, 0.9 at 150, 300, 600 rows (noise of a few replicates): the size 150 reaches 0.8 but 300
        // does not, so the rows needed are read between 300 and 600: 300 · 2^((0.8 − 0.75)/(0.9 − 0.75)) = 300 · 2^⅓
        // ≈ 378 (by hand).
        List<CalibrationView.SizePoint> dip = List.of(p(150, 0.85), p(300, 0.75), p(600, 0.9));
        assertEquals(378.0, SizeAnswer.rowsToReach(dip, 0.8));
        // Reached early but not at the largest size: not reached.
        assertNull(SizeAnswer.rowsToReach(List.of(p(150, 0.85), p(300, 0.75)), 0.8));
        assertTrue(SizeAnswer.sentence("pc", List.of(p(150, 0.85), p(300, 0.75)),
                new CalibrationView.Target("orientation_precision", 0.8), 300).contains("falls below it again"));
    }

    @Test
    @DisplayName("the report opens with the cautions and states warnings before any figure")
    void cautionsFirst() {
        CalibrationView v = CalibrationView.builder().title("Calibration").dataLines(List.of("data.csv: 400 rows"))
                .truthLines(List.of("truth given")).assumptions(List.of("MCAR"))
                .warnings(List.of("x is missing in 30% of rows.")).analystRows(400).expectedAt(400)
                .learners(List.of("pc"))
                .expectations(List.of(new CalibrationView.Expectation("pc", "orientation_precision",
                        new CalibrationView.Means(0.7, 0.72), new CalibrationView.Spread(0.5, 0.75, 0.9),
                        new CalibrationView.Replicates(10, 0))))
                .curve(List.of(p(200, 0.6), p(400, 0.7), p(1600, 0.9)))
                .target(new CalibrationView.Target("orientation_precision", 0.8))
                .edges(List.of(new CalibrationView.EdgeRow("pc", "a", "b", new CalibrationView.Frequencies(0.9, 0.5),
                        new CalibrationView.Frequencies(0.8, 0.4))))
                .checks(List.of(new CalibrationView.Check("a", "continuous", 400, 0.0,
                        new CalibrationView.Residuals(0.1, 0.2, 0.5, null))))
                .settings(List.of("seed 1")).build();
        String html = CalibrationReport.html(v);
        String md = CalibrationReport.markdown(v);
        for (String line : Cautions.LINES) {
            String escaped = dev.touchstone.reports.html.HtmlPage.escape(line);
            assertTrue(html.indexOf(escaped) > 0 && html.indexOf(escaped) < html.indexOf("x is missing"), line);
            assertTrue(md.indexOf(line) > 0 && md.indexOf(line) < md.indexOf("x is missing"), line);
        }
        assertTrue(md.indexOf("x is missing") < md.indexOf("## What to expect at 400 rows"));
        assertTrue(md.contains("| pc | orientation_precision | 0.750 | 0.500 – 0.900 | 0.700 | 0.720 | 10 | 0 |"), md);
        assertTrue(md.contains("| pc | a → b | yes | 0.900 | 0.500 | 0.800 | 0.400 |"), md);
        assertTrue(md.contains("about 800 rows"), md);
        assertTrue(html.contains("<svg"), "chart of orientation precision against rows");
    }
}
