package dev.touchstone.reports.tables;

import java.util.List;

/**
 * Renders a {@link Table} as a GitHub-flavoured Markdown pipe table (the common form that
 * paper supplements and pull requests accept); best cells are set in bold.
 */
public final class MarkdownTable {

    private MarkdownTable() {
    }

    public static String render(Table t) {
        StringBuilder sb = new StringBuilder();
        line(sb, t.columns());
        sb.append('|');
        for (int i = 0; i < t.columns().size(); i++) {
            sb.append(" --- |");
        }
        sb.append('\n');
        for (List<Cell> row : t.rows()) {
            sb.append('|');
            for (Cell c : row) {
                String text = escape(c.text());
                sb.append(' ').append(c.best() && !text.isEmpty() ? "**" + text + "**" : text).append(" |");
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static void line(StringBuilder sb, List<String> cells) {
        sb.append('|');
        for (String c : cells) {
            sb.append(' ').append(escape(c)).append(" |");
        }
        sb.append('\n');
    }

    private static String escape(String s) {
        return s.replace("\\", "\\\\").replace("|", "\\|").replace("\n", " ");
    }
}
