package dev.touchstone.reports;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Renders report.html in headless {@link Chromium} and checks the screenshot is not blank and
 * has the requested size, and that laid out 1280 px wide the page does not overflow sideways.
 * (The bundled demo's page height is checked in the harness, which runs the demo.)
 */
class BrowserRenderTest {

    private static final int WIDTH = Chromium.WIDTH;
    private static final int HEIGHT = 1800;

    @Test
    void noHorizontalOverflowAt1280Pixels(@TempDir Path dir) throws IOException, InterruptedException {
        String browser = Chromium.require();
        // A wide headline: the fixture with ten metric columns (values the fixture lacks show n/a), the case
        // that used to need a sideways scroll.
        ReportData wide = ReportFixtures.study(true, true).metrics(List.of("shd", "adjacency_precision",
                "adjacency_recall", "adjacency_f1", "orientation_precision", "orientation_recall", "orientation_f1",
                "sid", "seconds", "cpu_seconds")).build();
        Chromium.PageSize size = Chromium.measure(browser, dir, HtmlReport.render(wide));
        assertEquals(WIDTH, size.width(), "the page is exactly as wide as the window: nothing overflows sideways");
        assertTrue(size.height() > 900, "the page was laid out (height " + size.height() + ")");
        assertEquals(0, size.wideTables(), "no table needs a sideways scroll inside the page either");
    }

    @Test
    void reportRendersInAHeadlessBrowser(@TempDir Path dir) throws IOException, InterruptedException {
        String browser = Chromium.require();
        Path html = dir.resolve("report.html");
        Files.writeString(html, HtmlReport.render(ReportFixtures.study(true, true).build()), StandardCharsets.UTF_8);
        Path png = dir.resolve("report.png");
        List<String> cmd = new ArrayList<>(List.of(browser, "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run",
                "--disable-quic", "--hide-scrollbars", "--user-data-dir=" + dir.resolve("profile"),
                "--window-size=" + WIDTH + "," + HEIGHT, "--screenshot=" + png, html.toUri().toString()));
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(dir.resolve("chromium.log").toFile())
                .start();
        Chromium.await(p);
        assertTrue(Files.exists(png), "no screenshot; Chromium said: " + Files.readString(dir.resolve("chromium.log")));
        String keep = System.getProperty("report.screenshot");
        if (keep != null) {
            Files.copy(png, Path.of(keep), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        }
        BufferedImage img = ImageIO.read(png.toFile());
        assertEquals(WIDTH, img.getWidth());
        assertEquals(HEIGHT, img.getHeight());
        Set<Integer> colours = new HashSet<>();
        for (int y = 0; y < img.getHeight(); y += 7) {
            for (int x = 0; x < img.getWidth(); x += 7) {
                colours.add(img.getRGB(x, y));
            }
        }
        assertTrue(colours.size() > 20, "the screenshot looks blank (" + colours.size() + " colours)");
    }
}
