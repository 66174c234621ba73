package dev.touchstone.reports;

import org.junit.jupiter.api.Assumptions;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Headless Chromium (Debian's package) for the tests that lay a report out as a browser does;
 * shared with the harness's tests through this module's test jar. Where Chromium is missing a
 * test using it is skipped with a message, except in CI (environment CI=true), where .ci/run
 * installs it and the test must run.
 */
public final class Chromium {

    /** The window width the report is checked at. */
    public static final int WIDTH = 1280;

    private Chromium() {
    }

    /** The page's laid-out size at {@link #WIDTH} px and the number of tables wider than their box. */
    public record PageSize(int width, int height, int wideTables) {
    }

    /** The browser's path; skips the calling test (fails it in CI) when there is none. */
    public static String require() {
        for (String c : List.of("/usr/bin/chromium", "/usr/bin/chromium-browser", "/usr/bin/google-chrome")) {
            if (new File(c).canExecute()) {
                return c;
            }
        }
        if ("true".equals(System.getenv("CI"))) {
            fail("Chromium is not installed; .ci/run should have installed Debian's chromium package");
        }
        Assumptions.assumeTrue(false, "Chromium not found: skipping the browser test (it runs in CI)");
        return null;
    }

    /**
     * Lays the page out {@link #WIDTH} px wide and reads back {@code document.documentElement}'s
     * scroll width and height and the tables wider than their box, from the DOM Chromium dumps
     * of a copy of the page with a measuring script added (the report itself has none).
     */
    public static PageSize measure(String browser, Path dir, String html) throws IOException, InterruptedException {
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
        await(p);
        Matcher m = Pattern.compile("data-size=\"(\\d+)x(\\d+)x(\\d+)\"").matcher(Files.readString(dom));
        assertTrue(m.find(), "no size in the dumped page; Chromium said: " + Files.readString(dir.resolve("probe.log")));
        return new PageSize(Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)), Integer.parseInt(m.group(3)));
    }

    /** Waits for a browser process, at most 120 s. */
    static void await(Process p) throws InterruptedException {
        if (!p.waitFor(120, TimeUnit.SECONDS)) {
            p.descendants().forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            fail("Chromium did not finish within 120 s");
        }
    }
}
