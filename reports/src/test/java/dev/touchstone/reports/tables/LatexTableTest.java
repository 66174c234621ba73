package dev.touchstone.reports.tables;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class LatexTableTest {

    @Test
    void bracesBalanceAndEveryRowHasTheTablesColumns() {
        // Special characters in every cell, braces among them (LatexChecks: common practice).
        Table t = Table.builder(List.of("learner configuration", "shd", "adjacency_f1 {50%}"))
                .row(List.of(Cell.of("pc_a&b #1 ~x^2 $5 \\ {odd"), new Cell("3.50 [3.10, 3.90]", true), Cell.of("n/a")))
                .row("ges}", "4", "100%")
                .build();
        String tex = LatexTable.render(t);
        assertEquals(3, LatexChecks.assertBalanced(tex, 3), "header and two rows");
        assertTrue(tex.contains("\\toprule") && tex.contains("\\midrule") && tex.contains("\\bottomrule"), "booktabs rules");
        assertTrue(tex.contains("\\begin{tabular}{lll}"), tex);
        assertTrue(tex.contains("\\textbf{3.50 [3.10, 3.90]}"), "best cell in bold");
        assertTrue(tex.contains("pc\\_a\\&b \\#1"), tex);
    }
}
