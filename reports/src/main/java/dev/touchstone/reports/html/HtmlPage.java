package dev.touchstone.reports.html;

import dev.touchstone.reports.tables.Cell;
import dev.touchstone.reports.tables.Table;

import java.util.ArrayList;
import java.util.List;

/**
 * A self-contained HTML5 page: styles inline, pictures as inline SVG, no scripts, fonts,
 * images or links to anything outside the file, so it opens from disk in any browser with
 * no network. All text is escaped; only SVG produced by this module's charts is inserted
 * as markup.
 */
public final class HtmlPage {

    private static final String STYLE = String.join("\n",
            "body{font-family:'DejaVu Sans',Helvetica,Arial,sans-serif;margin:0;color:#222;background:#fff}",
            "main{max-width:1100px;margin:0 auto;padding:16px 24px 48px}",
            "h1{font-size:1.6em;margin:.6em 0 .2em}h2{font-size:1.25em;margin-top:1.8em;border-bottom:1px solid #ccc}",
            "h3{font-size:1.05em;margin-top:1.2em}",
            "table{border-collapse:collapse;margin:.6em 0;font-size:.88em}",
            // A table wider than the page (many metrics) scrolls inside its own box instead of
            // widening the page; the first column (the learner) stays in view while it scrolls.
            ".table-wrap{max-width:100%;overflow-x:auto}",
            ".table-wrap td:first-child,.table-wrap th:first-child{position:sticky;left:0;background:#fff}",
            ".table-wrap th:first-child{background:#f0f0f0}",
            // Headline cells may wrap between a mean and its interval, so a table of many metrics
            // fits the page at 1280 px instead of scrolling.
            "table.wrap td.num{white-space:normal;min-width:4.5em}table.wrap th{font-size:.92em}",
            ".grid{display:flex;flex-wrap:wrap;gap:4px 12px}.grid figure{margin:.4em 0;flex:0 1 auto;max-width:520px}",
            "svg{max-width:100%;height:auto}svg.swatch{vertical-align:middle;margin-right:4px}",
            "details{margin:.8em 0}summary{cursor:pointer;color:#135}",
            "th,td{border:1px solid #ccc;padding:3px 7px;text-align:left;vertical-align:top}",
            "th{background:#f0f0f0}td.best{font-weight:bold;background:#eef5ee}td.num{white-space:nowrap}",
            ".note{color:#555;font-size:.9em}",
            ".warning{border-left:4px solid #c60;background:#fff6ec;padding:6px 10px;margin:.8em 0}",
            ".caution{border:1px solid #999;background:#f7f7f7;padding:6px 14px;margin:1em 0}",
            "figure{margin:1em 0}figcaption{font-size:.85em;color:#555}",
            "nav a{margin-right:1em;font-size:.9em}",
            "pre{background:#f6f6f6;padding:6px;overflow-x:auto;font-size:.85em}");

    private final String title;
    private final StringBuilder body = new StringBuilder();
    private final List<String[]> sections = new ArrayList<>();

    public HtmlPage(String title) {
        this.title = title;
    }

    /** Starts a section with a level-2 heading, listed in the page's navigation. */
    public HtmlPage section(String id, String heading) {
        sections.add(new String[] {id, heading});
        body.append("<h2 id=\"").append(escape(id)).append("\">").append(escape(heading)).append("</h2>\n");
        return this;
    }

    public HtmlPage subheading(String text) {
        body.append("<h3>").append(escape(text)).append("</h3>\n");
        return this;
    }

    public HtmlPage paragraph(String text) {
        body.append("<p>").append(escape(text)).append("</p>\n");
        return this;
    }

    public HtmlPage note(String text) {
        body.append("<p class=\"note\">").append(escape(text)).append("</p>\n");
        return this;
    }

    public HtmlPage warning(String text) {
        body.append("<div class=\"warning\">").append(escape(text)).append("</div>\n");
        return this;
    }

    /** A boxed list (used for the cautions). */
    public HtmlPage box(String heading, List<String> lines) {
        body.append("<div class=\"caution\"><strong>").append(escape(heading)).append("</strong><ul>\n");
        for (String l : lines) {
            body.append("<li>").append(escape(l)).append("</li>\n");
        }
        body.append("</ul></div>\n");
        return this;
    }

    public HtmlPage list(List<String> items) {
        body.append("<ul>\n");
        for (String i : items) {
            body.append("<li>").append(escape(i)).append("</li>\n");
        }
        body.append("</ul>\n");
        return this;
    }

    public HtmlPage preformatted(String text) {
        body.append("<pre>").append(escape(text)).append("</pre>\n");
        return this;
    }

    public HtmlPage table(Table t) {
        return table(t, java.util.Map.of(), false);
    }

    /**
     * A table whose first-column cells found in {@code swatches} get that inline SVG swatch
     * (a configuration's colour and marker) before their text; {@code wrap} lets number cells
     * wrap (a wide headline).
     */
    public HtmlPage table(Table t, java.util.Map<String, String> swatches, boolean wrap) {
        body.append("<div class=\"table-wrap\"><table").append(wrap ? " class=\"wrap\"" : "")
                .append(">\n<thead><tr>");
        for (String c : t.columns()) {
            // metric names (orientation_precision) may break after an underscore in a narrow column
            body.append("<th>").append(escape(c).replace("_", "_<wbr>")).append("</th>");
        }
        body.append("</tr></thead>\n<tbody>\n");
        for (List<Cell> row : t.rows()) {
            body.append("<tr>");
            boolean first = true;
            for (Cell c : row) {
                String swatch = first ? swatches.get(c.text()) : null;
                first = false;
                if (swatch != null) {
                    requireSvg(swatch);
                    body.append(c.best() ? "<td class=\"best\">" : "<td>").append(swatch).append(escape(c.text()))
                            .append("</td>");
                    continue;
                }
                String classes = (c.best() ? "best " : "") + (numeric(c.text()) ? "num" : "");
                body.append(classes.isEmpty() ? "<td>" : "<td class=\"" + classes.trim() + "\">")
                        .append(escape(c.text())).append("</td>");
            }
            body.append("</tr>\n");
        }
        body.append("</tbody></table></div>\n");
        return this;
    }

    /** A value, or a value with its interval, which reads badly when wrapped inside a narrow column. */
    private static boolean numeric(String text) {
        if (text.isEmpty()) {
            return false;
        }
        char c = text.charAt(0);
        return Character.isDigit(c) || c == '-' || c == '\u2212' || text.startsWith("n/a");
    }

    /** An inline SVG picture (as produced by this module's charts) with a caption. */
    public HtmlPage figure(String svgElement, String caption) {
        requireSvg(svgElement);
        body.append("<figure>").append(svgElement);
        if (!caption.isEmpty()) {
            body.append("<figcaption>").append(escape(caption)).append("</figcaption>");
        }
        body.append("</figure>\n");
        return this;
    }

    private static void requireSvg(String svgElement) {
        if (!svgElement.startsWith("<svg")) {
            throw new IllegalArgumentException("a figure must be an <svg> element");
        }
    }

    /** Starts a block where figures sit side by side as wide as the page allows. */
    public HtmlPage beginGrid() {
        body.append("<div class=\"grid\">\n");
        return this;
    }

    public HtmlPage endGrid() {
        body.append("</div>\n");
        return this;
    }

    /** Starts a collapsible block, closed at first, opened by its summary line. */
    public HtmlPage beginDetails(String summary) {
        body.append("<details><summary>").append(escape(summary)).append("</summary>\n");
        return this;
    }

    public HtmlPage endDetails() {
        body.append("</details>\n");
        return this;
    }

    /** The whole page. */
    public String render() {
        StringBuilder sb = new StringBuilder(body.length() + 4096);
        sb.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(escape(title)).append("</title>\n<style>\n").append(STYLE)
                .append("\n</style>\n</head>\n<body>\n<main>\n<h1>").append(escape(title)).append("</h1>\n");
        if (!sections.isEmpty()) {
            sb.append("<nav>");
            for (String[] s : sections) {
                sb.append("<a href=\"#").append(escape(s[0])).append("\">").append(escape(s[1])).append("</a>");
            }
            sb.append("</nav>\n");
        }
        sb.append(body).append("</main>\n</body>\n</html>\n");
        return sb.toString();
    }

    /** Escapes text for HTML element content and attribute values. */
    public static String escape(String s) {
        StringBuilder sb = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '<': sb.append("&lt;"); break;
                case '>': sb.append("&gt;"); break;
                case '&': sb.append("&amp;"); break;
                case '"': sb.append("&quot;"); break;
                case '\'': sb.append("&#39;"); break;
                default: sb.append(c);
            }
        }
        return sb.toString();
    }
}
