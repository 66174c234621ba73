package dev.touchstone.reports;

import dev.touchstone.reports.charts.Figure;
import dev.touchstone.reports.charts.Svg;
import dev.touchstone.reports.tables.Table;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * The HTML page of a study report with every chart and every table it shows, keyed by a
 * file-name stem, so the harness can write each as a file a paper can include as it is: a
 * chart as SVG and PDF, a table as Markdown and LaTeX.
 *
 * @param html    the page
 * @param figures charts by file-name stem, in page order
 * @param tables  tables by file-name stem, in page order
 */
public record ReportArtifacts(String html, Map<String, Chart> figures, Map<String, Table> tables) {

    /**
     * A chart of the page: the {@code <svg>} element the page shows and the figure it was drawn
     * from, which renders the same picture to PDF.
     */
    public record Chart(String svg, Figure figure) {

        /** The page's SVG element as a standalone SVG file. */
        public String svgFile() {
            return Svg.standalone(svg);
        }

        /** The figure as a one-page PDF of its own size. */
        public byte[] pdfFile() {
            return figure.toPdf();
        }
    }

    public ReportArtifacts {
        figures = Collections.unmodifiableMap(new LinkedHashMap<>(figures));
        tables = Collections.unmodifiableMap(new LinkedHashMap<>(tables));
    }

    /** Collects figures and tables under unique, file-safe names. */
    static final class Collector {
        private final Map<String, Chart> figures = new LinkedHashMap<>();
        private final Map<String, Table> tables = new LinkedHashMap<>();

        void figure(String name, Chart chart) {
            figures.put(unique(figures, stem(name)), chart);
        }

        void table(String name, Table t) {
            tables.put(unique(tables, stem(name)), t);
        }

        ReportArtifacts build(String html) {
            return new ReportArtifacts(html, figures, tables);
        }

        /** Lower-case letters, digits and single dashes only: safe on every file system. */
        static String stem(String name) {
            String s = name.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]+", "-").replaceAll("(^-+)|(-+$)", "");
            if (s.length() > 80) {
                s = s.substring(0, 80).replaceAll("-+$", "");
            }
            return s.isEmpty() ? "item" : s;
        }

        private static String unique(Map<String, ?> taken, String stem) {
            String s = stem;
            for (int i = 2; taken.containsKey(s); i++) {
                s = stem + "-" + i;
            }
            return s;
        }
    }
}
