package dev.touchstone.reports.calibration;

import dev.touchstone.reports.tables.Numbers;
import dev.touchstone.reports.tables.Table;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** The tables of the calibration report, shared by its HTML and Markdown forms. */
final class CalibrationTables {

    private CalibrationTables() {
    }

    static Table expectations(CalibrationView v) {
        Table.Builder t = Table.builder(List.of("learner", "metric", "median of replicates", "10%–90% of replicates",
                "mean", "mean, fitted truth only", "replicates ok", "not ok"));
        for (CalibrationView.Expectation e : v.expectations()) {
            t.row(e.learner(), e.metric(), Numbers.format(e.spread().median()), range(e.spread()),
                    Numbers.format(e.means().allTruths()), Numbers.format(e.means().fittedTruth()),
                    Integer.toString(e.replicates().ok()), Integer.toString(e.replicates().notOk()));
        }
        return t.build();
    }

    static Table curve(CalibrationView v, String metric) {
        List<Integer> sizes = sizes(v);
        List<String> columns = new ArrayList<>();
        columns.add("learner");
        for (int n : sizes) {
            columns.add(String.format(Locale.ROOT, "%,d rows", n) + (n == v.analystRows() ? " (your size)"
                    : n == v.expectedAt() ? " (nearest to yours)" : ""));
        }
        Table.Builder t = Table.builder(columns);
        for (String learner : v.learners()) {
            List<String> row = new ArrayList<>();
            row.add(learner);
            for (int n : sizes) {
                CalibrationView.SizePoint p = point(v, learner, metric, n);
                row.add(p == null ? Numbers.UNDEFINED
                        : Numbers.withInterval(p.spread().median(), p.spread().p10(), p.spread().p90()));
            }
            t.row(row.toArray(new String[0]));
        }
        return t.build();
    }

    static List<String> answers(CalibrationView v) {
        List<String> out = new ArrayList<>();
        for (String learner : v.learners()) {
            out.add(SizeAnswer.sentence(learner, points(v, learner, v.target().metric()), v.target(),
                    v.analystRows()));
        }
        return out;
    }

    static Table edges(CalibrationView v) {
        Table.Builder t = Table.builder(List.of("learner", "edge", "in fitted truth", "adjacent (simulated)",
                "oriented so (simulated)", "adjacent (bootstrap)", "oriented so (bootstrap)"));
        for (CalibrationView.EdgeRow e : v.edges()) {
            // an edge not in the fitted truth has nothing to recover: its simulated cells are undefined
            CalibrationView.Frequencies simulated = e.inTruth() ? e.simulated() : CalibrationView.Frequencies.UNDEFINED;
            t.row(e.learner(), e.from() + " → " + e.to(), e.inTruth() ? "yes" : "no",
                    Numbers.format(simulated.adjacent()), Numbers.format(simulated.oriented()),
                    Numbers.format(e.bootstrap().adjacent()), Numbers.format(e.bootstrap().oriented()));
        }
        return t.build();
    }

    static Table checks(CalibrationView v) {
        Table.Builder t = Table.builder(List.of("variable", "kind", "rows fitted", "missing", "residual skewness",
                "residual excess kurtosis", "normality p (Jarque–Bera)", "nonlinearity p (RESET)"));
        for (CalibrationView.Check c : v.checks()) {
            CalibrationView.Residuals r = c.residuals();
            t.row(c.variable(), c.kind(), Integer.toString(c.rows()),
                    String.format(Locale.ROOT, "%.1f%%", 100 * c.missingRate()), Numbers.format(r.skewness()),
                    Numbers.format(r.excessKurtosis()), Numbers.format(r.normalityP()),
                    Numbers.format(r.nonlinearityP()));
        }
        return t.build();
    }

    static List<Integer> sizes(CalibrationView v) {
        List<Integer> out = new ArrayList<>();
        for (CalibrationView.SizePoint p : v.curve()) {
            if (!out.contains(p.rows())) {
                out.add(p.rows());
            }
        }
        out.sort(Integer::compare);
        return out;
    }

    static List<String> metrics(CalibrationView v) {
        List<String> out = new ArrayList<>();
        for (CalibrationView.SizePoint p : v.curve()) {
            if (!out.contains(p.metric())) {
                out.add(p.metric());
            }
        }
        return out;
    }

    static List<CalibrationView.SizePoint> points(CalibrationView v, String learner, String metric) {
        List<CalibrationView.SizePoint> out = new ArrayList<>();
        for (CalibrationView.SizePoint p : v.curve()) {
            if (p.learner().equals(learner) && p.metric().equals(metric)) {
                out.add(p);
            }
        }
        return out;
    }

    private static CalibrationView.SizePoint point(CalibrationView v, String learner, String metric, int n) {
        for (CalibrationView.SizePoint p : points(v, learner, metric)) {
            if (p.rows() == n) {
                return p;
            }
        }
        return null;
    }

    private static String range(CalibrationView.Spread s) {
        if (s.p10() == null || s.p90() == null) {
            return Numbers.UNDEFINED;
        }
        return Numbers.format(s.p10()) + " – " + Numbers.format(s.p90());
    }
}
