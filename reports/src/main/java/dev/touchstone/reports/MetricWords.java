package dev.touchstone.reports;

import java.util.Locale;

/**
 * Metric and coordinate names in words with their units, for chart titles and axis labels
 * (a reader of a paper sees "structural Hamming distance (edges)", not {@code shd}).
 */
final class MetricWords {

    private MetricWords() {
    }

    /** The metric in words with its unit, e.g. "adjacency precision (0–1)". */
    static String of(String metric) {
        int vs = metric.indexOf("_vs_");
        if (vs > 0) {
            return of(metric.substring(0, vs)) + " against the true " + metric.substring(vs + 4).toUpperCase(Locale.ROOT);
        }
        switch (metric) {
            case "shd":
                return "structural Hamming distance (edges)";
            case "sid":
                return "structural intervention distance (pairs)";
            case "seconds":
                return "run time (s)";
            case "cpu_seconds":
                return "processor time (s)";
            case "allocated_mb":
                return "memory allocated (MB)";
            case "tests":
                return "independence tests (count)";
            case "scores":
                return "score evaluations (count)";
            case "edges":
                return "edges in the estimate (count)";
            case "exact":
                return "exact recovery (share of runs)";
            default:
                break;
        }
        String words = metric.replace('_', ' ');
        if (metric.endsWith("_f1")) {
            words = words.substring(0, words.length() - 2) + "F1";
        }
        if (metric.endsWith("_precision") || metric.endsWith("_recall") || metric.endsWith("_f1")) {
            return words + " (0–1)";
        }
        return words;
    }

    /** A setting coordinate in words with its unit. */
    static String axis(String coordinate, boolean log) {
        String scale = log ? ", log scale" : "";
        switch (coordinate) {
            case "samples":
                return "sample size (rows" + scale + ")";
            case "nodes":
                return "graph size (variables" + scale + ")";
            default:
                return coordinate.replace('_', ' ') + (log ? " (log scale)" : "");
        }
    }
}
