package dev.touchstone.reports;

import dev.touchstone.reports.tables.LatexChecks;
import dev.touchstone.reports.tables.LatexTable;
import dev.touchstone.reports.tables.Table;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Every table the report writes as {@code tables/NAME.tex}, not only a hand-made one, passes the
 * compile-free LaTeX checks ({@link LatexChecks}: balanced braces and environments, every row
 * with the table's columns; common practice).
 */
class LatexFilesTest {

    @Test
    void everyTableOfTheReportIsBalancedLatex() {
        ReportData wide = ReportFixtures.study(true, true).metrics(List.of("shd", "adjacency_precision",
                "adjacency_recall", "adjacency_f1", "sid", "seconds")).build();
        Map<String, Table> tables = HtmlReport.build(wide).tables();
        assertTrue(tables.keySet().containsAll(List.of("configurations", "comparisons", "provenance")),
                "the fixture's tables: " + tables.keySet());
        for (Map.Entry<String, Table> e : tables.entrySet()) {
            Table t = e.getValue();
            assertEquals(t.rows().size() + 1, LatexChecks.assertBalanced(LatexTable.render(t), t.columns().size()),
                    e.getKey() + ": header and every row");
        }
    }
}
