package dev.touchstone.harness.cli;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The demo end to end, on the bundled study with a reduced grid (same learners and metrics). */
class DemoCommandTest {

    @TempDir
    Path dir;

    private String bundledStudy() throws IOException {
        try (InputStream in = DemoCommand.class.getResourceAsStream(DemoCommand.STUDY)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    private String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.execute(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(status), out.toString(), err.toString()};
    }

    @Test
    @DisplayName("demo runs the bundled study end to end: headline table printed, report and tables written")
    void demoRunsEndToEnd() throws IOException {
        String reduced = bundledStudy().replace("replicates: 5", "replicates: 2")
                .replace("nodes: [8, 16]", "nodes: [6]").replace("samples: [100, 500, 2000]", "samples: [100, 400]");
        assertTrue(reduced.contains("replicates: 2") && reduced.contains("nodes: [6]"), "the bundled study changed shape");
        Path study = dir.resolve("demo-reduced.yaml");
        Files.writeString(study, reduced);
        Path out = dir.resolve("out");
        String[] r = run("demo", "--study", study.toString(), "--out", out.toString(), "--threads", "2", "--quiet");
        assertEquals("0", r[0], r[2]);
        assertTrue(r[1].contains("| learner configuration | ok runs | shd |"), r[1]);
        assertTrue(r[1].contains("| pc |") && r[1].contains("| ges |") && r[1].contains("| empty |"), r[1]);
        int garden = r[1].indexOf("### network community-garden");
        assertTrue(r[1].indexOf("### graph erdos-renyi") >= 0 && garden > 0, "one headline per kind of truth: " + r[1]);
        String gardenTable = r[1].substring(garden);
        assertTrue(gardenTable.contains("| pc |") && gardenTable.contains("| ges |"),
                "PC and GES pick a discrete test and score on the garden: " + r[1]);
        assertTrue(gardenTable.contains("Not run here: lingam: skipped")
                && gardenTable.contains("does not accept discrete data"), "continuous-only learners are skipped, with the"
                + " reason: " + r[1]);
        assertTrue(r[1].contains(" skipped)"), r[1]);
        assertTrue(r[1].contains("report: "), r[1]);
        for (String f : new String[] {"report.html", "report.md", "runs.csv", "summary.csv", "comparisons.csv",
                "journal.jsonl", "provenance.json", "study.yaml"}) {
            assertTrue(Files.isRegularFile(out.resolve(f)), f + " is written");
        }
        String html = Files.readString(out.resolve("report.html"));
        assertTrue(html.contains("<svg"), "the report has charts");
        assertTrue(html.contains("Read these results with care"), "the report carries the cautions");
        assertTrue(!html.contains("(partial)"), "a finished study is not marked partial");
        String md = Files.readString(out.resolve("report.md"));
        int gap = md.indexOf("## Search gap");
        assertTrue(gap > 0 && md.indexOf("| ges |", gap) > 0 && md.indexOf("| pc |", gap) < 0,
                "the search gap of the score-based learner, and only of it: " + md);
        assertTrue(Files.readString(out.resolve("runs.csv")).lines().findFirst().orElseThrow()
                .contains(",search_score_gap,search_shd,score_shd,"), "search-gap columns in runs.csv");
        // Every chart of the page is also a standalone SVG file and a PDF, every table a Markdown and a LaTeX file.
        long figures = html.split("<figure><svg", -1).length - 1;
        List<Path> svgs;
        try (var files = Files.list(out.resolve("figures"))) {
            svgs = files.filter(f -> f.toString().endsWith(".svg")).toList();
        }
        assertEquals(figures, svgs.size(), "one SVG file per chart");
        for (Path svg : svgs) {
            String text = Files.readString(svg);
            assertTrue(text.startsWith("<?xml") && text.contains("http://www.w3.org/2000/svg"), svg.toString());
            try {
                // well-formed XML whose root is an svg element (the JDK's own parser)
                var doc = javax.xml.parsers.DocumentBuilderFactory.newInstance().newDocumentBuilder().parse(svg.toFile());
                assertEquals("svg", doc.getDocumentElement().getTagName(), svg.toString());
            } catch (javax.xml.parsers.ParserConfigurationException | org.xml.sax.SAXException e) {
                throw new AssertionError(svg + " is not well-formed XML: " + e.getMessage(), e);
            }
        }
        for (Path svg : svgs) {
            // the same chart as a PDF beside it (read back with PDFBox in the reports module's PdfExportTest)
            Path pdf = svg.resolveSibling(svg.getFileName().toString().replaceFirst("\\.svg$", ".pdf"));
            byte[] head = Files.readAllBytes(pdf);
            assertEquals("%PDF-", new String(head, 0, 5, java.nio.charset.StandardCharsets.US_ASCII), pdf.toString());
        }
        for (String t : new String[] {"configurations", "comparisons", "provenance"}) {
            assertTrue(Files.isRegularFile(out.resolve("tables/" + t + ".md")), t + ".md");
            assertTrue(Files.readString(out.resolve("tables/" + t + ".tex")).contains("\\toprule"), t + ".tex");
        }

        String[] again = run("report", out.toString(), "--out", dir.resolve("again").toString());
        assertEquals("0", again[0], again[2]);
        assertEquals(Files.readString(out.resolve("report.md")), Files.readString(dir.resolve("again/report.md")),
                "re-rendering from the journal gives the same tables");
    }

    @Test
    @DisplayName("report on a folder that is not a study's output: exit 2 and one line naming it")
    void reportRefusesAForeignFolder() {
        String[] r = run("report", dir.toString());
        assertEquals("2", r[0]);
        assertTrue(r[2].startsWith("error: ") && r[2].contains("not a study's output folder"), r[2]);
    }
}
