package dev.touchstone.harness.calibrate;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.fit.FitDiagnostics;
import dev.touchstone.generators.fit.FittedTruth;
import dev.touchstone.harness.version.VersionInfo;
import dev.touchstone.metrics.aggregate.Quantiles;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.reports.calibration.CalibrationView;
import dev.touchstone.reports.tables.Numbers;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Turns a calibration's runs into the report's view: means, medians and 10th–90th percentiles of
 * each metric per learner and size (over all truths; over the fitted truth alone at the
 * analyst's size), per-edge rates, and plain warnings from the fit's checks. A check warns
 * when its p-value is below 0.01 divided by the number of such checks (Bonferroni), and
 * missingness warns above {@value #HEAVY_MISSING} of a variable's cells. Cost linear in
 * the runs, plus O(p²) per estimate for the edge rates.
 */
public final class CalibrationSummary {

    /** The question the report answers from the curve of sizes. */
    public static final CalibrationView.Target TARGET = new CalibrationView.Target("orientation_precision", 0.8);
    /** A variable missing in more than this fraction of rows gets a warning. */
    public static final double HEAVY_MISSING = 0.2;
    /** An edge outside the truth is listed when it appears in at least this fraction of bootstrap resamples. */
    public static final double LISTED_FREQUENCY = 0.2;
    private static final double FAMILY_ALPHA = 0.01;

    private CalibrationSummary() {
    }

    /** The size the expectations are given at: the data's rows when simulated, otherwise the nearest size. */
    public static int analystSize(CalibrationOutcome o) {
        int n = o.data().rows();
        int best = o.settings().samples().get(0);
        for (int s : o.settings().samples()) {
            if (Math.abs(s - n) < Math.abs(best - n)) {
                best = s;
            }
        }
        return best;
    }

    /**
     * The view of the report.
     *
     * @param title      the report's title
     * @param dataLines  what the data are (kinds as inferred or declared, …)
     * @param truthLines how the truth graph was obtained
     * @param learnedBy  the id of the learner that learned the truth graph from these data, or null if it was given
     */
    public static CalibrationView view(CalibrationOutcome o, String title, List<String> dataLines,
                                       List<String> truthLines, String learnedBy) {
        int at = analystSize(o);
        List<String> learners = new ArrayList<>();
        for (CalibrationSettings.Choice c : o.settings().learners()) {
            learners.add(c.id());
        }
        List<CalibrationView.Expectation> expectations = new ArrayList<>();
        List<CalibrationView.SizePoint> curve = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        for (String learner : learners) {
            for (String metric : CalibrationSettings.METRICS) {
                double[] all = values(o, learner, metric, at, false);
                double[] fitted = values(o, learner, metric, at, true);
                int notOk = count(o, learner, at, false);
                expectations.add(new CalibrationView.Expectation(learner, metric,
                        new CalibrationView.Means(mean(all), mean(fitted)), spread(all),
                        new CalibrationView.Replicates(count(o, learner, at, true), notOk)));
                for (int n : sorted(o.settings().samples())) {
                    double[] v = values(o, learner, metric, n, false);
                    curve.add(new CalibrationView.SizePoint(learner, metric, n, mean(v), spread(v)));
                }
            }
            int bad = count(o, learner, at, false);
            if (bad > 0) {
                warnings.add(String.format(Locale.ROOT, "%s did not finish on %d of the simulated data sets of %,d"
                        + " rows (failed, timed out or skipped); its expectations cover only the others.", learner,
                        bad, at));
            }
        }
        warnings.addAll(checkWarnings(o.diagnostics()));
        if (learnedBy != null) {
            warnings.add("The truth graph was learned from these same data by " + learnedBy + ". Data simulated"
                    + " from it favour " + learnedBy + " (it is judged partly on its own guess); give a graph from"
                    + " domain knowledge with --graph where you can.");
        }
        List<String> truths = new ArrayList<>(truthLines);
        for (FittedTruth t : o.truths()) {
            truths.add(t.name() + ": " + t.dag().edgeCount() + " edges; " + t.description());
        }
        return CalibrationView.builder().title(title).dataLines(dataLines).truthLines(truths)
                .assumptions(assumptions(o)).warnings(warnings).analystRows(o.data().rows()).expectedAt(at)
                .learners(learners).expectations(expectations).curve(curve).target(TARGET)
                .edges(edges(o, learners, at)).checks(checks(o.diagnostics())).settings(settingsLines(o)).build();
    }

    private static List<String> assumptions(CalibrationOutcome o) {
        List<String> out = new ArrayList<>();
        out.add("Continuous variables: linear in their continuous parents, shifted by each category of their"
                + " discrete parents, with Gaussian noise of one variance (least squares; conditional Gaussian when"
                + " some parents are discrete).");
        out.add("Discrete variables: conditional tables by maximum likelihood with one pseudo-count per cell; with"
                + " continuous parents, a multinomial logistic link on the standardised parents.");
        out.add("Each variable was fitted on the rows complete for it and its parents.");
        out.add("Missing cells are simulated completely at random (MCAR) at each variable's observed rate. This is"
                + " an assumption: the data cannot show whether cells are missing at random or for a reason.");
        out.add("No hidden common causes, no cycles, no selection: the simulated truths have none, real data may.");
        out.add(String.format(Locale.ROOT, "Variants: %d perturbed truths (edges dropped and added, density and"
                + " effect sizes varied), so the answer does not rest on the fitted graph alone.", o.truths().size() - 1));
        return out;
    }

    private static List<String> checkWarnings(List<FitDiagnostics.Check> checks) {
        int normalTests = 0;
        int linearTests = 0;
        for (FitDiagnostics.Check c : checks) {
            normalTests += c.residuals().normalityP() != null ? 1 : 0;
            linearTests += c.residuals().nonlinearityP() != null ? 1 : 0;
        }
        List<String> out = new ArrayList<>();
        for (FitDiagnostics.Check c : checks) {
            FitDiagnostics.Residuals r = c.residuals();
            if (r.normalityP() != null && r.normalityP() < FAMILY_ALPHA / normalTests) {
                out.add(String.format(Locale.ROOT, "The residuals of %s do not look Gaussian (Jarque–Bera p = %s,"
                        + " skewness %s, excess kurtosis %s). The simulation draws Gaussian noise, so expectations for"
                        + " learners that rely on or exploit the noise distribution may be off.", c.name(),
                        Numbers.format(r.normalityP()), Numbers.format(r.skewness()),
                        Numbers.format(r.excessKurtosis())));
            }
            if (r.nonlinearityP() != null && r.nonlinearityP() < FAMILY_ALPHA / linearTests) {
                out.add(String.format(Locale.ROOT, "%s may depend nonlinearly on its parents (RESET-type p = %s)."
                        + " The simulation is linear; learners may do worse on your data than shown here.", c.name(),
                        Numbers.format(r.nonlinearityP())));
            }
            if (c.missingRate() > HEAVY_MISSING) {
                out.add(String.format(Locale.ROOT, "%s is missing in %.0f%% of rows. Heavy missingness weakens"
                        + " every learner, and if cells are not missing at random the figures here are optimistic.",
                        c.name(), 100 * c.missingRate()));
            }
        }
        return out;
    }

    private static List<CalibrationView.Check> checks(List<FitDiagnostics.Check> checks) {
        List<CalibrationView.Check> out = new ArrayList<>();
        for (FitDiagnostics.Check c : checks) {
            FitDiagnostics.Residuals r = c.residuals();
            out.add(new CalibrationView.Check(c.name(), c.continuous() ? "continuous" : "discrete", c.rows(),
                    c.missingRate(), new CalibrationView.Residuals(r.skewness(), r.excessKurtosis(), r.normalityP(),
                    r.nonlinearityP())));
        }
        return out;
    }

    private static List<String> settingsLines(CalibrationOutcome o) {
        CalibrationSettings s = o.settings();
        List<String> out = new ArrayList<>();
        out.add("Sizes simulated: " + sorted(s.samples()) + " rows; " + s.replicates() + " replicates per size,"
                + " taken in turn from the " + o.truths().size() + " truths; smaller sizes are prefixes of the"
                + " largest draw.");
        out.add(s.bootstrap() + " bootstrap resamples of the real data (rows drawn with replacement).");
        out.add("Seed " + s.seed() + "; " + s.threads() + " threads (results do not depend on the number of threads);"
                + " time limit per run: " + (s.limit() == null ? "none" : s.limit().toMillis() / 1000.0 + " s") + ".");
        int runs = o.runs().size();
        long ok = o.runs().stream().filter(r -> r.result() != null && r.result().status() == RunStatus.OK).count();
        out.add(String.format(Locale.ROOT, "%,d runs, %,d ok.", runs, ok));
        out.add("Made by " + VersionInfo.current() + " on Java " + System.getProperty("java.version") + ".");
        return out;
    }

    private static List<CalibrationView.EdgeRow> edges(CalibrationOutcome o, List<String> learners, int at) {
        Graph truth = o.fitted().dag();
        DataSet data = o.data();
        int p = truth.size();
        List<CalibrationView.EdgeRow> out = new ArrayList<>();
        for (String learner : learners) {
            List<Graph> simulated = new ArrayList<>();
            List<Graph> boot = new ArrayList<>();
            for (CalibrationOutcome.Run r : o.runs()) {
                if (!r.learner().equals(learner) || r.estimate() == null || r.result() == null
                        || r.result().status() != RunStatus.OK) {
                    continue;
                }
                if (r.isBootstrap()) {
                    boot.add(r.estimate());
                } else if (r.truth().name().equals(Calibration.FITTED) && r.rows() == at) {
                    simulated.add(r.estimate());
                }
            }
            for (Edge e : truth.edges()) {
                int from = e.tail();
                int to = e.other(from);
                out.add(new CalibrationView.EdgeRow(learner, truth.name(from), truth.name(to),
                        frequencies(simulated, from, to), frequencies(boot, from, to)));
            }
            for (int a = 0; a < p; a++) {
                for (int b = a + 1; b < p; b++) {
                    if (truth.adjacent(a, b)) {
                        continue;
                    }
                    Double f = adjacent(boot, a, b);
                    if (f != null && f >= LISTED_FREQUENCY) {
                        Double ab = directed(boot, a, b);
                        Double ba = directed(boot, b, a);
                        int from = ba != null && ab != null && ba > ab ? b : a;
                        int to = from == a ? b : a;
                        out.add(new CalibrationView.EdgeRow(learner, data.variable(from).name(),
                                data.variable(to).name(), null, frequencies(boot, from, to)));
                    }
                }
            }
        }
        return out;
    }

    private static CalibrationView.Frequencies frequencies(List<Graph> graphs, int from, int to) {
        return new CalibrationView.Frequencies(adjacent(graphs, from, to), directed(graphs, from, to));
    }

    private static Double adjacent(List<Graph> graphs, int a, int b) {
        return share(graphs, g -> g.adjacent(a, b));
    }

    private static Double directed(List<Graph> graphs, int from, int to) {
        return share(graphs, g -> g.hasDirected(from, to));
    }

    /** The fraction of graphs with the property, null when there are none. */
    private static Double share(List<Graph> graphs, java.util.function.Predicate<Graph> property) {
        if (graphs.isEmpty()) {
            return null;
        }
        return graphs.stream().filter(property).count() / (double) graphs.size();
    }

    /** Values of a metric over ok simulated runs of a learner at a size (fitted truth only, or all truths). */
    static double[] values(CalibrationOutcome o, String learner, String metric, int rows, boolean fittedOnly) {
        List<Double> out = new ArrayList<>();
        for (CalibrationOutcome.Run r : o.runs()) {
            if (r.isBootstrap() || r.rows() != rows || !r.learner().equals(learner) || r.result() == null
                    || r.result().status() != RunStatus.OK) {
                continue;
            }
            if (fittedOnly && !r.truth().name().equals(Calibration.FITTED)) {
                continue;
            }
            Double v = r.result().metrics().get(metric);
            if (v != null && Double.isFinite(v)) {
                out.add(v);
            }
        }
        double[] a = out.stream().mapToDouble(Double::doubleValue).toArray();
        Arrays.sort(a);
        return a;
    }

    /** Simulated runs of a learner at a size that finished ok ({@code ok}) or did not. */
    private static int count(CalibrationOutcome o, String learner, int rows, boolean ok) {
        int n = 0;
        for (CalibrationOutcome.Run r : o.runs()) {
            if (!r.isBootstrap() && r.rows() == rows && r.learner().equals(learner)
                    && (r.result() != null && r.result().status() == RunStatus.OK) == ok) {
                n++;
            }
        }
        return n;
    }

    private static List<Integer> sorted(List<Integer> sizes) {
        List<Integer> s = new ArrayList<>(sizes);
        s.sort(Integer::compare);
        return s;
    }

    private static Double mean(double[] v) {
        if (v.length == 0) {
            return null;
        }
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }

    private static CalibrationView.Spread spread(double[] sorted) {
        if (sorted.length == 0) {
            return CalibrationView.Spread.UNDEFINED;
        }
        return new CalibrationView.Spread(Quantiles.ofSorted(sorted, 0.1), Quantiles.ofSorted(sorted, 0.5),
                Quantiles.ofSorted(sorted, 0.9));
    }
}
