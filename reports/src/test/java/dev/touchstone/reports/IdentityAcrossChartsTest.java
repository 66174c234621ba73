package dev.touchstone.reports;

import dev.touchstone.reports.charts.SeriesStyle;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.parser.Parser;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Reads the charts' SVG back: each learner configuration has one colour in every chart and table. */
class IdentityAcrossChartsTest {

    private static final Pattern RGB = Pattern.compile("(?:fill|stroke):\\s*rgb\\((\\d+),(\\d+),(\\d+)\\)");

    /**
     * For each legend text naming a configuration, the first colour drawn after the text before it
     * (the legend graphic: its line or its box), as #rrggbb.
     */
    private static Map<String, String> legendColours(String svg, Set<String> labels) {
        Document d = Jsoup.parse(svg, "", Parser.xmlParser());
        Map<String, String> out = new LinkedHashMap<>();
        String first = null;
        for (Element e : d.getAllElements()) {
            if (e.tagName().equals("text")) {
                if (labels.contains(e.text()) && first != null) {
                    String before = out.put(e.text(), first);
                    assertTrue(before == null || before.equals(first), "one colour per label within a chart");
                }
                first = null;
                continue;
            }
            Matcher m = RGB.matcher(e.attr("style"));
            if (first == null && m.find()) {
                String c = String.format(Locale.ROOT, "#%02x%02x%02x", Integer.parseInt(m.group(1)),
                        Integer.parseInt(m.group(2)), Integer.parseInt(m.group(3)));
                // the white background of the legend is not a legend graphic
                first = c.equals("#ffffff") ? null : c;
            }
        }
        return out;
    }

    /**
     * The fixture with the first configuration, alpha, skipped on the 20-node settings, so charts of
     * those settings start with beta: a colour chosen by position in the chart would give beta alpha's.
     */
    private static ReportData firstConfigurationMissingSomewhere() {
        ReportData base = ReportFixtures.study(false, false).build();
        List<dev.touchstone.metrics.results.RunResult> runs = new ArrayList<>();
        for (var r : base.runs()) {
            boolean skip = r.configurationId().equals("alpha") && r.setting().get("nodes").equals("20");
            runs.add(!skip ? r : dev.touchstone.metrics.results.RunResult.builder().key(r.key())
                    .setting(r.setting()).replicate(r.replicate()).configurationId(r.configurationId())
                    .learnerId(r.learnerId()).parameters(r.parameters()).seed(r.seed())
                    .status(dev.touchstone.metrics.results.RunStatus.SKIPPED).message("does not accept this data")
                    .build());
        }
        List<dev.touchstone.metrics.results.AggregateRow> summary = base.summary().stream()
                .filter(a -> !(a.configurationId().equals("alpha") && a.setting().get("nodes").equals("20"))).toList();
        return ReportFixtures.study(false, false).runs(runs).summary(summary).build();
    }

    @Test
    void eachConfigurationHasOneColourInEveryChartAndTable() {
        ReportArtifacts a = HtmlReport.build(firstConfigurationMissingSomewhere());
        List<String> configs = List.of("alpha", "beta", "broken");
        Map<String, Set<String>> colours = new LinkedHashMap<>();
        Map<String, Integer> charts = new LinkedHashMap<>();
        for (var f : a.figures().entrySet()) {
            legendColours(f.getValue().svg(), Set.copyOf(configs)).forEach((label, colour) -> {
                colours.computeIfAbsent(label, k -> new LinkedHashSet<>()).add(colour);
                charts.merge(label, 1, Integer::sum);
            });
            for (String learner : List.of("learner-alpha", "learner-beta")) {
                assertFalse(f.getValue().svg().contains(">" + learner + "<"), "legends name configurations, not learners: "
                        + f.getKey());
            }
        }
        Document page = Jsoup.parse(a.html());
        for (int i = 0; i < configs.size(); i++) {
            String c = configs.get(i);
            assertTrue(charts.getOrDefault(c, 0) >= 3, c + " appears in the legends of several charts: " + charts);
            assertEquals(Set.of(SeriesStyle.css(i)), colours.get(c), c + " keeps the colour of its place in the study");
            Element swatch = page.select("td:has(svg.swatch)").stream().filter(td -> td.text().equals(c)).findFirst()
                    .orElseThrow().selectFirst("svg.swatch path");
            assertEquals(SeriesStyle.css(i), swatch.attr("fill"), "the tables show the same colour");
        }
        assertEquals(configs.size(), colours.values().stream().map(s -> s.iterator().next()).distinct().count(),
                "different configurations, different colours");
    }

    @Test
    void thePaletteIsOkabeAndItos() {
        // Okabe and Ito (2008), "Color universal design": the eight colours (from memory of the published values).
        List<String> published = List.of("#0072b2", "#d55e00", "#009e73", "#cc79a7", "#e69f00", "#56b4e9", "#000000",
                "#f0e442");
        List<String> ours = new ArrayList<>();
        for (int i = 0; i < 8; i++) {
            ours.add(SeriesStyle.css(i));
        }
        assertEquals(published, ours);
        // forty identities differ in (colour, marker): colours repeat every 8, markers every 5, and lcm(8, 5) = 40
        Set<String> pairs = new LinkedHashSet<>();
        for (int i = 0; i < 40; i++) {
            pairs.add(SeriesStyle.css(i) + "/" + SeriesStyle.shapeIndex(i));
        }
        assertEquals(40, pairs.size());
    }
}
