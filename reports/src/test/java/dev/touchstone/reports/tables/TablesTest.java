package dev.touchstone.reports.tables;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class TablesTest {

    @Test
    void undefinedValuesPrintAsNotAvailable() {
        assertEquals("n/a", Numbers.format(null));
        assertEquals("n/a", Numbers.format(Double.NaN));
        assertEquals("n/a", Numbers.withInterval(null, 0.1, 0.2));
        assertEquals("0.500 [0.400, 0.600]", Numbers.withInterval(0.5, 0.4, 0.6));
        assertEquals("0.123", Numbers.format(0.12345));
        assertEquals("12.3", Numbers.format(12.345));
        assertEquals("3", Numbers.format(3.0));
        assertEquals("1.23e-04", Numbers.format(0.000123));
    }

    @Test
    void markdownPipeTableMarksBestAndEscapesPipes() {
        Table t = Table.builder(List.of("learner", "shd")).row(List.of(Cell.of("a|b"), new Cell("2", true)))
                .row("c", "n/a").build();
        assertEquals("| learner | shd |\n| --- | --- |\n| a\\|b | **2** |\n| c | n/a |\n", MarkdownTable.render(t));
    }

    @Test
    void raggedRowsAreRefused() {
        Table.Builder b = Table.builder(List.of("a", "b")).row("only one");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, b::build);
        assertEquals("a row has 1 cells, the table 2 columns", e.getMessage());
    }
}
