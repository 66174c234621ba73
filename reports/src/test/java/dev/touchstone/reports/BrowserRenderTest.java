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
 * not blank and has the requested size, and that laid out 1280 px wide the page does not
 * overflow sideways (measured by a script added to a copy of the page: the report itself has
 * none). Skipped with a message where Chromium is missing,
 * except in CI (environment CI=true), where .ci/run installs it and the test must run.
 */
class BrowserRenderTest {

    private static final int WIDTH = 1280;
    private static final int HEIGHT = 1800;

    private static String chromium() {
        for (String c : List.of("/usr/bin/chromium", "/usr/bin/chromium-browser", "/usr/bin/google-chrome")) {
            if (new File(c).canExecute()) {
                return c;
            }
        }
        return null;
    }

    private static String requireBrowser() {
        String browser = chromium();
        if (browser == null) {
            if ("true".equals(System.getenv("CI"))) {
                fail("Chromium is not installed; .ci/run should have installed Debian's chromium package");
            }
            Assumptions.assumeTrue(false, "Chromium not found: skipping the browser test (it runs in CI)");
        }
        return browser;
    }

    /**
     * The page's laid-out width and height at 1280 px and the number of tables wider than their
     * box, read back from the DOM Chromium dumps.
     */
    private static int[] pageSize(String browser, Path dir, String html) throws IOException, InterruptedException {
        String probe = html.replace("</body>", "<script>var n = 0; document.querySelectorAll('.table-wrap')"
                + ".forEach(function (w) { if (w.scrollWidth > w.clientWidth + 1) n++; });"
                + " document.body.setAttribute('data-size', document.documentElement.scrollWidth + 'x'"
                + " + document.documentElement.scrollHeight + 'x' + n)</script></body>");
        Path page = dir.resolve("probe.html");
        Files.writeString(page, probe, StandardCharsets.UTF_8);
        Path dom = dir.resolve("dom.html");
        Process p = new ProcessBuilder(browser, "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run",
                "--hide-scrollbars", "--user-data-dir=" + dir.resolve("profile-probe"), "--window-size=" + WIDTH + ",900",
                "--virtual-time-budget=3000", "--dump-dom", page.toUri().toString())
                .redirectError(dir.resolve("probe.log").toFile()).redirectOutput(dom.toFile()).start();
        if (!p.waitFor(120, TimeUnit.SECONDS)) {
            p.descendants().forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            fail("Chromium did not finish within 120 s");
        }
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("data-size=\"(\\d+)x(\\d+)x(\\d+)\"")
                .matcher(Files.readString(dom));
        assertTrue(m.find(), "no size in the dumped page; Chromium said: " + Files.readString(dir.resolve("probe.log")));
        return new int[] {Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)), Integer.parseInt(m.group(3))};
    }

    @Test
    void noHorizontalOverflowAt1280Pixels(@TempDir Path dir) throws IOException, InterruptedException {
        String browser = requireBrowser();
        // A wide headline: the fixture with ten metric columns (values the fixture lacks show n/a), the case
        // that used to need a sideways scroll.
        ReportData wide = ReportFixtures.study(true, true).metrics(List.of("shd", "adjacency_precision",
                "adjacency_recall", "adjacency_f1", "orientation_precision", "orientation_recall", "orientation_f1",
                "sid", "seconds", "cpu_seconds")).build();
        int[] size = pageSize(browser, dir, HtmlReport.render(wide));
        assertEquals(WIDTH, size[0], "the page is exactly as wide as the window: nothing overflows sideways");
        assertTrue(size[1] > 900, "the page was laid out (height " + size[1] + ")");
        assertEquals(0, size[2], "no table needs a sideways scroll inside the page either");
    }

    @Test
    void reportRendersInAHeadlessBrowser(@TempDir Path dir) throws IOException, InterruptedException {
        String browser = requireBrowser();
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
