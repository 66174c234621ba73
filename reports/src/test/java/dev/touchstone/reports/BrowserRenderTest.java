package dev.touchstone.reports;

import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Renders report.html in headless Chromium (Debian's package) and checks the screenshot is
 * not blank and has the requested size. Skipped with a message where Chromium is missing,
 * except in CI (environment CI=true), where .ci/run installs it and the test must run.
 */
class BrowserRenderTest {

    private static final int WIDTH = 1200;
    private static final int HEIGHT = 1800;

    private static String chromium() {
        for (String c : List.of("/usr/bin/chromium", "/usr/bin/chromium-browser", "/usr/bin/google-chrome")) {
            if (new File(c).canExecute()) {
                return c;
            }
        }
        return null;
    }

    @Test
    void reportRendersInAHeadlessBrowser(@TempDir Path dir) throws IOException, InterruptedException {
        String browser = chromium();
        if (browser == null) {
            if ("true".equals(System.getenv("CI"))) {
                fail("Chromium is not installed; .ci/run should have installed Debian's chromium package");
            }
            Assumptions.assumeTrue(false, "Chromium not found: skipping the browser test (it runs in CI)");
        }
        Path html = dir.resolve("report.html");
        Files.writeString(html, HtmlReport.render(ReportFixtures.study(true, true).build()), StandardCharsets.UTF_8);
        Path png = dir.resolve("report.png");
        List<String> cmd = new ArrayList<>(List.of(browser, "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run",
                "--disable-quic", "--hide-scrollbars", "--user-data-dir=" + dir.resolve("profile"),
                "--window-size=" + WIDTH + "," + HEIGHT, "--screenshot=" + png, html.toUri().toString()));
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(dir.resolve("chromium.log").toFile())
                .start();
        if (!p.waitFor(120, TimeUnit.SECONDS)) {
            p.descendants().forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            fail("Chromium did not finish within 120 s");
        }
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
