package dev.touchstone.reports.tables;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class LatexTableTest {

    /** Ampersands that separate columns (not escaped as \&). */
    private static int separators(String line) {
        int n = 0;
        for (int i = 0; i < line.length(); i++) {
            if (line.charAt(i) == '&' && (i == 0 || line.charAt(i - 1) != '\\')) {
                n++;
            }
        }
        return n;
    }

    @Test
    void bracesBalanceAndEveryRowHasTheTablesColumns() {
        // Common practice for a compile-free check of generated LaTeX: balanced braces, equal column counts.
        Table t = Table.builder(List.of("learner configuration", "shd", "adjacency_f1 {50%}"))
                .row(List.of(Cell.of("pc_a&b #1 ~x^2 $5 \\ {odd"), new Cell("3.50 [3.10, 3.90]", true), Cell.of("n/a")))
                .row("ges}", "4", "100%")
                .build();
        String tex = LatexTable.render(t);
        int depth = 0;
        for (int i = 0; i < tex.length(); i++) {
            char c = tex.charAt(i);
            boolean escaped = i > 0 && tex.charAt(i - 1) == '\\' && (i < 2 || tex.charAt(i - 2) != '\\');
            if (!escaped && c == '{') {
                depth++;
            } else if (!escaped && c == '}') {
                depth--;
            }
            assertTrue(depth >= 0, "a closing brace without an opening one at " + i + ":\n" + tex);
        }
        assertEquals(0, depth, tex);
        int rows = 0;
        for (String line : tex.split("\n")) {
            if (line.endsWith("\\\\")) {
                rows++;
                assertEquals(2, separators(line), "three columns: " + line);
            }
        }
        assertEquals(3, rows, "header and two rows");
        assertTrue(tex.contains("\\toprule") && tex.contains("\\midrule") && tex.contains("\\bottomrule"), "booktabs rules");
        assertTrue(tex.contains("\\begin{tabular}{lll}"), tex);
        assertTrue(tex.contains("\\textbf{3.50 [3.10, 3.90]}"), "best cell in bold");
        assertTrue(tex.contains("pc\\_a\\&b \\#1"), tex);
    }
}
