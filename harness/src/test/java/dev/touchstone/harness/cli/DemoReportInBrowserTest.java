package dev.touchstone.harness.cli;

import dev.touchstone.reports.Chromium;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The page of the bundled demo, as {@code touchstone demo} writes it, laid out 1280 px wide in
 * headless Chromium: at most half as tall as before the report was reorganised into small
 * multiples and collapsed tables (45,205 px then, so at most 22,600 px), and nothing wider than
 * the window. Skipped with a message where Chromium is missing, required in CI.
 */
class DemoReportInBrowserTest {

    /** Half of the 45,205 px the demo's page measured before (same probe, same window width). */
    static final int MOST_HEIGHT = 22_600;

    @TempDir
    Path dir;

    @Test
    void theDemoPageIsAtMostHalfItsEarlierHeightAndFitsTheWindow() throws IOException, InterruptedException {
        String browser = Chromium.require();
        Path out = dir.resolve("demo");
        StringWriter err = new StringWriter();
        int status = Main.execute(new String[] {"demo", "--out", out.toString(), "--threads", "2", "--quiet"},
                new PrintWriter(new StringWriter()), new PrintWriter(err));
        assertEquals(0, status, err.toString());
        Chromium.PageSize size = Chromium.measure(browser, dir, Files.readString(out.resolve("report.html")));
        System.out.println("demo report laid out at " + Chromium.WIDTH + " px: " + size.width() + " × " + size.height()
                + " px");
        assertTrue(size.height() <= MOST_HEIGHT, "the demo page is " + size.height() + " px tall, more than "
                + MOST_HEIGHT);
        assertTrue(size.height() > 2_000, "the page was laid out (height " + size.height() + ")");
        assertEquals(Chromium.WIDTH, size.width(), "nothing overflows sideways");
        assertEquals(0, size.wideTables(), "no table needs a sideways scroll inside the page");
    }
}
