package dev.touchstone.reports.tables;

/** One table cell: its text and whether it is marked as the best of its column. */
public record Cell(String text, boolean best) {

    public static Cell of(String text) {
        return new Cell(text, false);
    }
}
