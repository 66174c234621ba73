package dev.touchstone.harness.report;

import dev.touchstone.harness.cli.Main;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class PictureHeadingTest {

    @TempDir
    Path tmp;

    @Test
    @DisplayName("with a hidden variable, picture headings name the class runs.csv says the runs were scored against")
    void headingsNameTheRecordedTruthClass() throws IOException {
        Path study = tmp.resolve("hidden.yaml");
        Files.writeString(study, "name: hidden\nseed: 5\nreplicates: 1\ntruth:\n"
                + "  graph: {family: erdos-renyi, nodes: 6, mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
                + "  hidden: 1\nsamples: [300]\nlearners: [pc, fci]\nmetrics: [shd]\n");
        Path out = tmp.resolve("out");
        StringWriter err = new StringWriter();
        int status = Main.execute(new String[] {"run", study.toString(), "--out", out.toString(), "--quiet", "--threads",
                "1"}, new PrintWriter(new StringWriter(), true), new PrintWriter(err, true));
        assertEquals(0, status, err.toString());
        List<String> runs = Files.readAllLines(out.resolve("runs.csv"));
        List<String> header = List.of(runs.get(0).split(","));
        int config = header.indexOf("configuration");
        int scored = header.indexOf("scored_against");
        assertTrue(config >= 0 && scored >= 0, runs.get(0));
        String html = Files.readString(out.resolve("report.html"));
        int pictured = 0;
        for (String line : runs.subList(1, runs.size())) {
            String[] cells = line.split(",", -1);
            String heading = cells[config] + " on ";
            int at = html.indexOf("<figcaption>" + heading);
            if (at < 0 || cells[scored].isEmpty()) {
                continue;
            }
            pictured++;
            String caption = html.substring(at, html.indexOf("</figcaption>", at));
            assertTrue(caption.contains("(scored against the true " + cells[scored].toUpperCase() + ")"),
                    "runs.csv says " + cells[scored] + ": " + caption);
        }
        assertTrue(pictured >= 1, "at least one run was pictured: " + html.contains("Graph pictures"));
    }
}
