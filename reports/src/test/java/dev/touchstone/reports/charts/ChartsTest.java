package dev.touchstone.reports.charts;

import dev.touchstone.core.graph.Graph;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.parser.Parser;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ChartsTest {

    private static Document xml(String svg) {
        return Jsoup.parse(svg, "", Parser.xmlParser());
    }

    @Test
    void lineChartIsWellFormedSvgWithItsLabels() {
        List<ChartSeries> series = List.of(
                new ChartSeries("pc alpha=0.01", List.of(new ChartPoint(100, 0.5, 0.4, 0.6), new ChartPoint(1000, 0.8, 0.7, 0.9))),
                new ChartSeries("ges", List.of(ChartPoint.of(100, 0.6), ChartPoint.of(1000, Double.NaN))));
        String svg = LineChart.of("adjacency_f1 against sample size", "sample size (rows)", "adjacency_f1", series)
                .withScales(AxisScale.LOG, AxisScale.LINEAR).withRange(0, 1).toSvg(640, 360);
        Document d = xml(svg);
        assertEquals(1, d.select("svg").size());
        assertTrue(svg.contains("sample size (rows)"), "x label");
        assertTrue(svg.contains("pc alpha=0.01"), "legend entry");
        assertFalse(svg.contains("xlink:href=\"http"), "no outside references");
    }

    @Test
    void twoChartsDoNotShareDefinitionIds() {
        List<ChartSeries> s = List.of(new ChartSeries("a", List.of(ChartPoint.of(1, 1), ChartPoint.of(2, 2))));
        String one = LineChart.of("one", "x", "y", s).toSvg(300, 200);
        String two = LineChart.of("two", "x", "y", s).toSvg(300, 200);
        String idOne = xml(one).select("clipPath").attr("id");
        String idTwo = xml(two).select("clipPath").attr("id");
        assertFalse(idOne.isEmpty());
        assertNotEquals(idOne, idTwo, "clip-path ids must differ so both charts can be inlined in one page");
    }

    @Test
    void criticalDifferenceGroupsJoinOnlyRanksCloserThanTheCd() {
        // Ranks 1.0, 1.5, 3.2, 3.9 with CD 1.0: {1.0, 1.5} differ by 0.5 < 1 (joined), 1.5 to 3.2 is 1.7 (not),
        // {3.2, 3.9} differ by 0.7 (joined). Worked by hand after Demšar (2006), Fig. 1.
        CriticalDifferenceDiagram cd = new CriticalDifferenceDiagram("ranks", List.of(
                new CriticalDifferenceDiagram.Entry("c", 3.2), new CriticalDifferenceDiagram.Entry("a", 1.0),
                new CriticalDifferenceDiagram.Entry("d", 3.9), new CriticalDifferenceDiagram.Entry("b", 1.5)), 1.0);
        List<int[]> g = cd.groups();
        assertEquals(2, g.size());
        assertEquals(List.of(0, 1), List.of(g.get(0)[0], g.get(0)[1]));
        assertEquals(List.of(2, 3), List.of(g.get(1)[0], g.get(1)[1]));
        String svg = cd.toSvg(600);
        assertTrue(svg.contains("CD = 1.00"));
        assertTrue(svg.contains("a (1.00)"));
    }

    @Test
    void aGroupInsideALongerOneIsNotDrawnTwice() {
        CriticalDifferenceDiagram cd = new CriticalDifferenceDiagram("ranks", List.of(
                new CriticalDifferenceDiagram.Entry("a", 1.0), new CriticalDifferenceDiagram.Entry("b", 1.2),
                new CriticalDifferenceDiagram.Entry("c", 1.4)), 2.0);
        assertEquals(1, cd.groups().size());
    }

    @Test
    void edgesAreClassifiedAgainstTheOtherGraph() {
        List<String> names = List.of("A", "B", "C", "D");
        Graph truth = Graph.builder(names).addDirected(0, 1).addDirected(1, 2).addDirected(2, 3).freeze();
        Graph estimate = Graph.builder(names).addDirected(0, 1).addDirected(2, 1).addDirected(0, 3).freeze();
        assertEquals(EdgeVerdict.CORRECT, GraphPicture.verdict(estimate, truth, 0, 1, false));
        assertEquals(EdgeVerdict.WRONG_MARKS, GraphPicture.verdict(estimate, truth, 1, 2, false));
        assertEquals(EdgeVerdict.EXTRA, GraphPicture.verdict(estimate, truth, 0, 3, false));
        assertEquals(EdgeVerdict.MISSING, GraphPicture.verdict(truth, estimate, 2, 3, true));
        String svg = new GraphPicture(truth, estimate, GraphLayout.of(truth)).toSvg();
        Document d = xml(svg);
        assertEquals(1, d.select("svg").size());
        assertTrue(svg.contains("wrong marks") && svg.contains("missing") && svg.contains("extra"), "legend");
        String again = new GraphPicture(truth, estimate, GraphLayout.of(truth)).toSvg();
        assertEquals(svg.replaceAll("c\\d+_", "c_"), again.replaceAll("c\\d+_", "c_"), "the layout is a function of the truth");
    }
}
