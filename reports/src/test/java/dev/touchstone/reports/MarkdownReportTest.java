package dev.touchstone.reports;

import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Locks the layout of report.md with a golden file (regenerate with -Dgolden.update=true). */
class MarkdownReportTest {

    @Test
    void matchesTheGoldenFile() throws IOException {
        String actual = MarkdownReport.render(ReportFixtures.study(true, true).build());
        if (Boolean.getBoolean("golden.update")) {
            Files.writeString(Path.of("src/test/resources/golden/report.md"), actual, StandardCharsets.UTF_8);
        }
        try (InputStream in = getClass().getResourceAsStream("/golden/report.md")) {
            assertEquals(new String(in.readAllBytes(), StandardCharsets.UTF_8), actual);
        }
    }
}
