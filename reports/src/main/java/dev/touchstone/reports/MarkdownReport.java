package dev.touchstone.reports;

import dev.touchstone.reports.tables.MarkdownTable;

/**
 * {@code report.md}: the headline and comparison tables in Markdown, for pasting into a
 * paper's supplement or a pull request, with the cautions.
 */
public final class MarkdownReport {

    private MarkdownReport() {
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
                .append(" interval; the best value of each column is in bold. n/a: undefined.\n\n");
        sb.append(MarkdownTable.render(view.headline())).append('\n');
        if (!data.comparisons().isEmpty()) {
            sb.append("## Paired comparison with ").append(data.reference()).append("\n\n");
            sb.append("Differences are configuration minus reference on identical data sets; Wilcoxon signed-rank")
                    .append(" p-values, Holm-adjusted across configurations.\n\n");
            sb.append(MarkdownTable.render(view.comparisons())).append('\n');
        }
        sb.append("## ").append(Cautions.HEADING).append("\n\n");
        for (String line : Cautions.LINES) {
            sb.append("- ").append(line).append('\n');
        }
        return sb.toString();
    }
}
