package dev.touchstone.reports;

import dev.touchstone.reports.tables.Table;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * The HTML page of a study report with every chart (as a standalone SVG document's element)
 * and every table it shows, keyed by a file-name stem, so the harness can write each as a
 * file a paper can include as it is.
 *
 * @param html    the page
 * @param figures chart SVG elements by file-name stem, in page order
 * @param tables  tables by file-name stem, in page order
 */
public record ReportArtifacts(String html, Map<String, String> figures, Map<String, Table> tables) {

    public ReportArtifacts {
        figures = Collections.unmodifiableMap(new LinkedHashMap<>(figures));
        tables = Collections.unmodifiableMap(new LinkedHashMap<>(tables));
    }

    /** Collects figures and tables under unique, file-safe names. */
    static final class Collector {
        private final Map<String, String> figures = new LinkedHashMap<>();
        private final Map<String, Table> tables = new LinkedHashMap<>();

        void figure(String name, String svg) {
            figures.put(unique(figures, stem(name)), svg);
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
