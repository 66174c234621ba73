package dev.touchstone.reports.html;

import dev.touchstone.reports.Cautions;
import dev.touchstone.reports.tables.Cell;
import dev.touchstone.reports.tables.Table;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class HtmlPageTest {

    @Test
    void textIsEscapedAndNothingOutsideIsReferenced() {
        HtmlPage p = new HtmlPage("study <x> & y");
        p.section("overview", "Overview").paragraph("a < b & \"c\"")
                .table(Table.builder(List.of("m")).row(List.of(new Cell("<1>", true))).build())
                .box(Cautions.HEADING, Cautions.LINES)
                .figure("<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"10\" height=\"10\"></svg>", "empty");
        String html = p.render();
        Document d = Jsoup.parse(html);
        assertEquals("study <x> & y", d.title());
        assertEquals("a < b & \"c\"", d.select("p").first().text());
        assertEquals("<1>", d.select("td.best").text());
        assertEquals(1, d.select("svg").size());
        assertTrue(d.select("script, link, img, iframe").isEmpty(), "no scripts, links or images");
        assertTrue(d.select("[src]").isEmpty(), "no src attributes");
        d.select("a[href]").forEach(a -> assertTrue(a.attr("href").startsWith("#"), "only in-page links"));
        assertEquals(Cautions.LINES.size(), d.select(".caution li").size());
    }

    @Test
    void valuesWithIntervalsDoNotWrapButWordsDo() {
        String html = new HtmlPage("t").table(Table.builder(List.of("learner", "shd", "ratio"))
                .row(List.of(Cell.of("pc"), new Cell("3.67 [2.67, 4.70]", true), Cell.of("n/a"))).build()).render();
        Document d = Jsoup.parse(html);
        assertEquals(List.of("3.67 [2.67, 4.70]", "n/a"), d.select("td.num").eachText());
        assertEquals("3.67 [2.67, 4.70]", d.select("td.best.num").text());
        assertTrue(html.contains("td.num{white-space:nowrap}"));
    }

    @Test
    void onlySvgMayBeInsertedAsMarkup() {
        assertThrows(IllegalArgumentException.class, () -> new HtmlPage("t").figure("<script>x</script>", "bad"));
    }
}
