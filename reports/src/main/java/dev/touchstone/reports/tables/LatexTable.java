package dev.touchstone.reports.tables;

import java.util.List;

/**
 * Renders a {@link Table} as a LaTeX {@code tabular} with the rules of the booktabs package
 * (Fear 2005, "Publication quality tables in LaTeX": \toprule, \midrule, \bottomrule, no
 * vertical rules), ready for {@code \input} in a paper that loads booktabs; best cells in bold.
 * Text is escaped for LaTeX's ten special characters, so braces always balance.
 */
public final class LatexTable {

    private LatexTable() {
    }

    public static String render(Table t) {
        StringBuilder sb = new StringBuilder();
        sb.append("% needs \\usepackage{booktabs}; text is UTF-8 (R², χ²): use a UTF-8 engine or inputenc\n");
        sb.append("\\begin{tabular}{").append("l".repeat(t.columns().size())).append("}\n\\toprule\n");
        row(sb, t.columns().stream().map(Cell::of).toList());
        sb.append("\\midrule\n");
        for (List<Cell> r : t.rows()) {
            row(sb, r);
        }
        sb.append("\\bottomrule\n\\end{tabular}\n");
        return sb.toString();
    }

    private static void row(StringBuilder sb, List<Cell> cells) {
        for (int i = 0; i < cells.size(); i++) {
            Cell c = cells.get(i);
            String text = escape(c.text());
            sb.append(i == 0 ? "" : " & ").append(c.best() && !text.isEmpty() ? "\\textbf{" + text + "}" : text);
        }
        sb.append(" \\\\\n");
    }

    /** Escapes LaTeX's special characters (# $ % & ~ _ ^ \ { }) and turns line breaks into spaces. */
    public static String escape(String s) {
        StringBuilder sb = new StringBuilder(s.length() + 8);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '\\': sb.append("\\textbackslash{}"); break;
                case '{': sb.append("\\{"); break;
                case '}': sb.append("\\}"); break;
                case '#': sb.append("\\#"); break;
                case '$': sb.append("\\$"); break;
                case '%': sb.append("\\%"); break;
                case '&': sb.append("\\&"); break;
                case '_': sb.append("\\_"); break;
                case '~': sb.append("\\textasciitilde{}"); break;
                case '^': sb.append("\\textasciicircum{}"); break;
                case '\n': case '\r': sb.append(' '); break;
                default: sb.append(c);
            }
        }
        return sb.toString();
    }
}
