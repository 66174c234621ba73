package dev.touchstone.reports;

import dev.touchstone.reports.tables.MarkdownTable;

/**
 * {@code report.md}: the headline and comparison tables in Markdown, for pasting into a
 * paper's supplement or a pull request, with the cautions.
 */
public final class MarkdownReport {

    private MarkdownReport() {
    }

    /** The headline tables alone (each configuration's pooled mean of each metric), in Markdown. */
    public static String headline(ReportData data) {
        return headlines(new StudyView(data));
    }

    private static String headlines(StudyView view) {
        StringBuilder sb = new StringBuilder();
        for (StudyView.Headline h : view.headlines()) {
            if (!h.title().isEmpty()) {
                sb.append(sb.length() == 0 ? "" : "\n").append("### ").append(h.title()).append("\n\n");
            }
            sb.append(MarkdownTable.render(h.table()));
            if (!h.notRun().isEmpty()) {
                sb.append('\n');
                for (String line : h.notRun()) {
                    sb.append("Not run here: ").append(line).append("\n");
                }
            }
        }
        return sb.toString();
    }

    public static String render(ReportData data) {
        StudyView view = new StudyView(data);
        StringBuilder sb = new StringBuilder();
        sb.append("# ").append(data.studyName()).append(data.partial() ? " (partial)" : "").append("\n\n");
        if (!data.description().isBlank()) {
            sb.append(data.description().strip()).append("\n\n");
        }
        sb.append("## Headline\n\n");
        sb.append("Mean of each metric over all ok runs of each learner configuration, with a 95% bootstrap")
                .append(" interval; the best value of each column is in bold. n/a: undefined.")
                .append(view.data().groupCoordinates().isEmpty() ? "" : " One table per kind of truth, so that every"
                        + " mean in a table comes from the same settings.")
                .append("\n\n");
        sb.append(headlines(view)).append('\n');
        if (!data.comparisons().isEmpty()) {
            sb.append("## Paired comparison with ").append(data.reference()).append("\n\n");
            sb.append("Differences are configuration minus reference on identical data sets; Wilcoxon signed-rank")
                    .append(" p-values, Holm-adjusted across configurations.\n\n");
            sb.append(MarkdownTable.render(view.comparisons())).append('\n');
        }
        if (!view.searchGap().isEmpty()) {
            sb.append("## Search gap\n\n").append(StudyView.SEARCH_GAP_READING).append("\n\n");
            sb.append(MarkdownTable.render(view.searchGap())).append('\n');
        }
        sb.append("## ").append(Cautions.HEADING).append("\n\n");
        for (String line : Cautions.LINES) {
            sb.append("- ").append(line).append('\n');
        }
        return sb.toString();
    }
}
