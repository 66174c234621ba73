package dev.touchstone.reports;

import dev.touchstone.reports.charts.CriticalDifferenceDiagram;
import dev.touchstone.reports.charts.Figure;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.rendering.ImageType;
import org.apache.pdfbox.rendering.PDFRenderer;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Element;
import org.jsoup.parser.Parser;
import org.junit.jupiter.api.Test;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Every chart of the report as a standalone PDF, read back with Apache PDFBox (an independent
 * PDF reader and renderer, test scope only): it opens, has exactly one page of the chart's
 * size, embeds no fonts (text is drawn as outlines), and PDFBox's rendering of the page shows
 * the same picture as the figure drawn directly onto a Java2D image.
 */
class PdfExportTest {

    /**
     * Every chart of a report on the shared fixture, and a critical difference diagram (the
     * fixture has too few settings for the report to draw one).
     */
    private static Map<String, ReportArtifacts.Chart> charts() {
        Map<String, ReportArtifacts.Chart> charts = new LinkedHashMap<>(
                HtmlReport.build(ReportFixtures.study(true, false).build()).figures());
        CriticalDifferenceDiagram cd = new CriticalDifferenceDiagram("ranks", List.of(
                new CriticalDifferenceDiagram.Entry("a", 1.2), new CriticalDifferenceDiagram.Entry("b", 1.9),
                new CriticalDifferenceDiagram.Entry("c", 2.9)), 1.0);
        charts.put("ranks", new ReportArtifacts.Chart(cd.toSvg(600), cd.figure(600)));
        return charts;
    }

    @Test
    void theChecksCoverEveryKindOfChart() {
        Set<String> kinds = new TreeSet<>();
        for (String name : charts().keySet()) {
            kinds.add(name.contains("-against-") ? "line" : name.split("-")[0]);
        }
        assertEquals(new TreeSet<>(Set.of("line", "distribution", "adjacency", "comparison", "ranks", "picture")),
                kinds, "line charts, box plots, precision against recall, heat map, ranks, graph pictures");
    }

    @Test
    void everyChartIsAOnePagePdfOfItsOwnSize() throws IOException {
        for (Map.Entry<String, ReportArtifacts.Chart> e : charts().entrySet()) {
            Figure f = e.getValue().figure();
            Element svg = Jsoup.parse(e.getValue().svg(), "", Parser.xmlParser()).selectFirst("svg");
            assertEquals(f.width(), Double.parseDouble(svg.attr("width")), 1e-9, e.getKey() + ": the SVG's width");
            assertEquals(f.height(), Double.parseDouble(svg.attr("height")), 1e-9, e.getKey() + ": the SVG's height");
            byte[] bytes = e.getValue().pdfFile();
            assertEquals("%PDF-", new String(bytes, 0, 5, StandardCharsets.US_ASCII), e.getKey());
            try (PDDocument pdf = Loader.loadPDF(bytes)) {
                assertEquals(1, pdf.getNumberOfPages(), e.getKey());
                PDPage page = pdf.getPage(0);
                PDRectangle box = page.getMediaBox();
                assertEquals(f.width(), box.getWidth(), 1e-3, e.getKey() + ": page width in points");
                assertEquals(f.height(), box.getHeight(), 1e-3, e.getKey() + ": page height in points");
                assertFalse(page.getResources().getFontNames().iterator().hasNext(),
                        e.getKey() + ": text is drawn as outlines, no font is embedded");
            }
        }
    }

    /**
     * PDFBox renders each page at 72 dpi (one pixel per point, so one per figure pixel) and the
     * figure is drawn straight onto an image of its size, anti-aliased with fractional font
     * metrics as the PDF's outlines of text are; the two must ink the same pixels (a pixel is
     * ink when darker than light grey), allowing an edge to move by one pixel. A blank page, a
     * page drawn upside down or shifted, or text left out would fail.
     */
    @Test
    void thePdfShowsTheSamePictureAsTheFigure() throws IOException {
        for (Map.Entry<String, ReportArtifacts.Chart> e : charts().entrySet()) {
            Figure f = e.getValue().figure();
            BufferedImage direct = new BufferedImage(f.width(), f.height(), BufferedImage.TYPE_INT_RGB);
            Graphics2D g = direct.createGraphics();
            g.setColor(Color.WHITE);
            g.fillRect(0, 0, f.width(), f.height());
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_FRACTIONALMETRICS, RenderingHints.VALUE_FRACTIONALMETRICS_ON);
            f.draw(g);
            g.dispose();
            BufferedImage rendered;
            try (PDDocument pdf = Loader.loadPDF(e.getValue().pdfFile())) {
                rendered = new PDFRenderer(pdf).renderImage(0, 1f, ImageType.RGB);
            }
            assertEquals(f.width(), rendered.getWidth(), e.getKey());
            assertEquals(f.height(), rendered.getHeight(), e.getKey());
            boolean[][] a = ink(direct);
            boolean[][] b = ink(rendered);
            int ink = 0;
            int differ = 0;
            for (int y = 0; y < f.height(); y++) {
                for (int x = 0; x < f.width(); x++) {
                    ink += a[y][x] ? 1 : 0;
                    differ += (a[y][x] && !near(b, x, y)) || (b[y][x] && !near(a, x, y)) ? 1 : 0;
                }
            }
            assertTrue(ink > f.width() * f.height() / 200, e.getKey() + ": the figure draws something (" + ink + ")");
            assertTrue(differ <= 0.01 * ink, e.getKey() + ": " + differ + " of " + ink + " inked pixels differ");
        }
    }

    /** Pixels darker than light grey. */
    private static boolean[][] ink(BufferedImage image) {
        boolean[][] out = new boolean[image.getHeight()][image.getWidth()];
        for (int y = 0; y < image.getHeight(); y++) {
            for (int x = 0; x < image.getWidth(); x++) {
                int rgb = image.getRGB(x, y);
                out[y][x] = 0.299 * ((rgb >> 16) & 0xFF) + 0.587 * ((rgb >> 8) & 0xFF) + 0.114 * (rgb & 0xFF) < 200;
            }
        }
        return out;
    }

    /** Whether the other picture inks this pixel or one next to it (anti-aliasing moves edges by a pixel). */
    private static boolean near(boolean[][] ink, int x, int y) {
        for (int dy = -1; dy <= 1; dy++) {
            for (int dx = -1; dx <= 1; dx++) {
                int yy = y + dy;
                int xx = x + dx;
                if (yy >= 0 && yy < ink.length && xx >= 0 && xx < ink[yy].length && ink[yy][xx]) {
                    return true;
                }
            }
        }
        return false;
    }
}
