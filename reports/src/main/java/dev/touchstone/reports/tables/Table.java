package dev.touchstone.reports.tables;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/** A small immutable table of text cells with a header row, rendered as HTML or Markdown. */
public final class Table {

    private final List<String> columns;
    private final List<List<Cell>> rows;

    private Table(List<String> columns, List<List<Cell>> rows) {
        this.columns = List.copyOf(columns);
        List<List<Cell>> copy = new ArrayList<>();
        for (List<Cell> r : rows) {
            if (r.size() != columns.size()) {
                throw new IllegalArgumentException("a row has " + r.size() + " cells, the table " + columns.size()
                        + " columns");
            }
            copy.add(List.copyOf(r));
        }
        this.rows = List.copyOf(copy);
    }

    public static Builder builder(List<String> columns) {
        return new Builder(columns);
    }

    public List<String> columns() {
        return columns;
    }

    public List<List<Cell>> rows() {
        return rows;
    }

    public boolean isEmpty() {
        return rows.isEmpty();
    }

    /** Collects rows. */
    public static final class Builder {
        private final List<String> columns;
        private final List<List<Cell>> rows = new ArrayList<>();

        private Builder(List<String> columns) {
            this.columns = List.copyOf(Objects.requireNonNull(columns));
        }

        public Builder row(List<Cell> cells) {
            rows.add(cells);
            return this;
        }

        /** A row of plain cells. */
        public Builder row(String... cells) {
            List<Cell> r = new ArrayList<>();
            for (String c : cells) {
                r.add(Cell.of(c));
            }
            return row(r);
        }

        public Table build() {
            return new Table(columns, rows);
        }
    }
}
