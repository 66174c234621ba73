package dev.touchstone.reports;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.results.RunResult;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class HtmlReportTest {

    private static Document render(ReportData d) {
        return Jsoup.parse(HtmlReport.render(d));
    }

    private static void selfContained(Document d) {
        assertTrue(d.select("script, link, img, iframe, object, embed").isEmpty(), "nothing loaded from outside");
        assertTrue(d.select("[src]").isEmpty(), "no src attributes");
        for (Element a : d.select("[href], [xlink:href]")) {
            String ref = a.hasAttr("href") ? a.attr("href") : a.attr("xlink:href");
            assertTrue(ref.startsWith("#"), "only in-page references, got " + ref);
        }
        assertFalse(d.html().contains("url(http"), "no outside URLs in styles");
    }

    @Test
    void completeStudyHasEveryExpectedChart() {
        Document d = render(ReportFixtures.study(false, false).build());
        selfContained(d);
        // shd and adjacency_f1 against samples and nodes: 2 metrics × (1 panel vs samples per nodes value = 2,
        // + 1 panel vs nodes per samples value = 2) = 8 panels (adjacency_f1 has no summary rows: 4);
        // distributions: one box chart per metric with values other than seconds (shd, adjacency_f1): 2;
        // run time vs nodes: 2 panels; precision-recall (adjacency, all scored against the CPDAG): 1; one heat map
        // of paired differences (the fixture compares shd only): 1; no CD diagram: 4 settings are fewer than the 6
        // that Friedman's test of 2 configurations needs ((1/2)^5 = 0.031 <= 0.05 < (1/2)^4); one graph picture.
        int expected = 4 + 2 + 2 + 1 + 1 + 1;
        assertEquals(expected, d.select("figure > svg").size(), "one SVG per expected chart");
        assertEquals(1, d.select("div.caution").size(), "the cautions are there");
        assertTrue(d.text().contains("0 failed"), d.text());
    }

    @Test
    void chartsThatSetConfigurationsScoredAgainstDifferentClassesSideBySideNameTheClasses() {
        // beta scored against the true DAG, alpha against the true CPDAG: the box plots and the paired comparison
        // put them side by side, so their captions say which configuration was scored against which class.
        ReportData base = ReportFixtures.study(true, false).build();
        List<RunResult> runs = new ArrayList<>();
        for (RunResult r : base.runs()) {
            runs.add(!r.configurationId().equals("beta") ? r : r.toBuilder().estimateClass(GraphClass.DAG)
                    .scoredAgainst(GraphClass.DAG).build());
        }
        Document d = render(ReportFixtures.study(true, false).runs(runs).build());
        String classes = "Scored against the true CPDAG (alpha); the true DAG (beta).";
        assertEquals(2, d.select("figcaption").stream()
                .filter(c -> c.text().equals(classes)).count(), "both box plots name the classes: " + d.text());
        assertTrue(d.text().contains("(Holm across configurations). " + classes), "so does the paired comparison");
        assertFalse(render(base).select("figcaption").text().contains("Scored against"),
                "one class only: the headline says it, the charts need not");
    }

    @Test
    void bestValueIsMarkedInTheHeadline() {
        Document d = render(ReportFixtures.study(false, false).build());
        // alpha has the lowest shd (pooled mean 3.0 vs 5.0 and 5.0), so its shd cell is marked best.
        Element best = d.select("table td.best").first();
        assertTrue(best.parent().child(0).text().equals("alpha"), best.parent().text());
    }

    @Test
    void partialStudyIsMarked() {
        Document d = render(ReportFixtures.study(false, false).partial(true).build());
        assertTrue(d.title().endsWith("(partial)"));
        assertEquals(1, d.select("div.warning").stream().filter(e -> e.text().contains("not finished")).count());
    }

    @Test
    void aLearnerWhoseRunsAllFailedIsListedWithItsMessages() {
        Document d = render(ReportFixtures.study(true, false).build());
        selfContained(d);
        assertTrue(d.text().contains("boom: singular matrix"));
        assertTrue(d.text().contains("8 failed"), "8 failed runs of 'broken'");
        Element brokenRow = d.select("table tr").stream().filter(r -> r.childrenSize() == 5 && r.child(0).text().equals("broken"))
                .findFirst().orElseThrow();
        assertTrue(brokenRow.text().contains("n/a"), "its values are undefined, shown n/a: " + brokenRow.text());
    }

    @Test
    void undefinedValuesShowAsNotAvailable() {
        Document d = render(ReportFixtures.study(false, true).build());
        Element betaRow = d.select("table tr").stream().filter(r -> r.childrenSize() == 5 && r.child(0).text().equals("beta"))
                .findFirst().orElseThrow();
        assertEquals("n/a", betaRow.child(3).text(), "adjacency_f1 of beta is undefined everywhere");
    }

    @Test
    void scaleBaselineCompetitiveWarns() {
        // 'broken' uses learner 'empty', declared a scale baseline; its shd (5.0) equals the median of the others
        // (3.0 and 5.0 → 4.0)? No: others are alpha 3.0 and beta 5.0, median 4.0; 5.0 is worse, so no warning.
        Document d = render(ReportFixtures.study(false, false).build());
        assertTrue(d.select("div.warning").stream().noneMatch(e -> e.text().contains("scale-artefact")));
        Document w = render(ReportFixtures.study(false, false).scaleBaselines(java.util.Set.of("learner-alpha")).build());
        assertTrue(w.select("div.warning").stream().anyMatch(e -> e.text().contains("scale-artefact baseline alpha")));
    }

    /** The fixture with configuration 'broken' skipped (not failed) on every setting with 20 nodes. */
    private static ReportData brokenSkippedOnLargeGraphs() {
        ReportData base = ReportFixtures.study(false, false).build();
        java.util.List<dev.touchstone.metrics.results.RunResult> runs = new java.util.ArrayList<>();
        for (var r : base.runs()) {
            boolean skip = r.configurationId().equals("broken") && r.setting().get("nodes").equals("20");
            runs.add(!skip ? r : dev.touchstone.metrics.results.RunResult.builder().key(r.key())
                    .setting(r.setting()).replicate(r.replicate()).configurationId(r.configurationId())
                    .learnerId(r.learnerId()).parameters(r.parameters()).seed(r.seed())
                    .status(dev.touchstone.metrics.results.RunStatus.SKIPPED)
                    .message("does not accept discrete data")
                    .timings(new dev.touchstone.metrics.results.Timings(null, null, null, null, null)).build());
        }
        return ReportFixtures.study(false, false).runs(runs).groupBy(java.util.List.of("nodes")).build();
    }

    @Test
    @org.junit.jupiter.api.DisplayName("grouped headline: one table per group, means pooled within it, skipped configurations named with the reason")
    void groupedHeadline() {
        ReportData data = brokenSkippedOnLargeGraphs();
        String md = MarkdownReport.headline(data);
        int small = md.indexOf("### nodes 10");
        int large = md.indexOf("### nodes 20");
        assertTrue(small >= 0 && large > small, md);
        // alpha's shd is 2 + replicate + nodes/10: mean 3.5 over the 10-node settings, 4.5 over the 20-node ones
        // (worked by hand from the fixture), instead of 4.0 pooled over both.
        assertTrue(md.substring(small, large).contains("| alpha | 4 | **3.50"), md);
        assertTrue(md.substring(large).contains("| alpha | 4 | **4.50"), md);
        assertTrue(md.substring(small, large).contains("| broken |"), "broken ran on the small graphs: " + md);
        assertFalse(md.substring(large).contains("| broken |"), "no row of undefined means for a skipped learner");
        assertTrue(md.substring(large).contains("Not run here: broken: skipped (does not accept discrete data)"), md);
        Document d = render(data);
        selfContained(d);
        assertEquals(2, d.select("h3").stream().filter(h -> h.text().startsWith("Headline: nodes")).count());
    }

    @Test
    @org.junit.jupiter.api.DisplayName("a wide headline scrolls in its own box instead of overflowing the page")
    void wideTablesScroll() {
        Document d = render(ReportFixtures.study(false, false).build());
        for (Element table : d.select("table")) {
            assertTrue(table.parent().hasClass("table-wrap"), "every table sits in a scroll box");
        }
        String style = d.select("style").html();
        assertTrue(style.contains(".table-wrap{max-width:100%;overflow-x:auto}"), style);
    }

    @Test
    @org.junit.jupiter.api.DisplayName("the scale-baseline warning compares on the settings where the baseline ran")
    void scaleBaselineJudgedOnItsOwnSettings() {
        // Worked by hand: 'sorter' (a scale baseline) ran on the continuous setting only, with shd 3; the others
        // scored 2 and 2.5 there (median 2.25, so the baseline is worse: no warning), but 10 and 12 on the discrete
        // setting, where pooling over both would give them 6 and 7.25 and wrongly make 3 look competitive.
        java.util.List<dev.touchstone.metrics.results.RunResult> runs = java.util.List.of(
                shdRun("1", "continuous", "sorter", 3.0), shdRun("2", "continuous", "a", 2.0),
                shdRun("3", "continuous", "b", 2.5), shdRun("4", "discrete", "sorter", null),
                shdRun("5", "discrete", "a", 10.0), shdRun("6", "discrete", "b", 12.0));
        ReportData.Builder b = ReportData.builder("baseline").metrics(java.util.List.of("shd"))
                .direction("shd", false).runs(runs).summarizer(ReportFixtures::meanOnly)
                .scaleBaselines(java.util.Set.of("sorter"));
        assertEquals(null, HtmlReport.competitiveBaseline(new StudyView(b.build())));
        java.util.List<dev.touchstone.metrics.results.RunResult> better = new java.util.ArrayList<>(runs);
        better.set(0, shdRun("1", "continuous", "sorter", 2.0));
        String w = HtmlReport.competitiveBaseline(new StudyView(b.runs(better).build()));
        assertTrue(w != null && w.contains("reaches 2") && w.contains("(2.25) on the same settings"), w);
    }

    private static dev.touchstone.metrics.results.RunResult shdRun(String key, String setting, String config,
                                                                 Double shd) {
        boolean ok = shd != null;
        dev.touchstone.core.graph.GraphClass cpdag = dev.touchstone.core.graph.GraphClass.CPDAG;
        return dev.touchstone.metrics.results.RunResult.builder().key(key)
                .setting(dev.touchstone.metrics.results.Setting.of("data", setting)).replicate(0)
                .configurationId(config).learnerId(config).seed(1)
                .status(ok ? dev.touchstone.metrics.results.RunStatus.OK : dev.touchstone.metrics.results.RunStatus.SKIPPED)
                .message(ok ? null : "does not accept discrete data").estimateClass(ok ? cpdag : null)
                .scoredAgainst(ok ? cpdag : null).metrics(ok ? java.util.Map.of("shd", shd) : java.util.Map.of())
                .timings(new dev.touchstone.metrics.results.Timings(null, null, null, null, null)).build();
    }
}
