package dev.touchstone.reports.calibration;

import java.util.List;

/**
 * Everything the calibration report shows, already summarised (numbers as {@code Double},
 * null = undefined). Immutable; built by the harness from a calibration's runs.
 *
 * @param title        the report's title
 * @param dataLines    what the data are: rows, columns, kinds (as inferred or declared), missing cells
 * @param truthLines   how the truth graph was obtained and which truths were simulated
 * @param assumptions  what the simulation assumes, in plain words
 * @param warnings     plain warnings from the checks of the fitted model
 * @param analystRows  the data's number of rows
 * @param expectedAt   the simulated size the expectations are given at (the data's rows when
 *                     simulated, otherwise the nearest size simulated)
 * @param learners     the learner ids, in order
 * @param expectations expected metric values at the analyst's number of rows
 * @param curve        metric values at every simulated size
 * @param target       the question answered from the curve
 * @param edges        per-edge recovery on the fitted truth next to bootstrap frequencies on the real data
 * @param checks       per-variable checks of the fitted model
 * @param settings     how the calibration was run (sizes, replicates, seed, threads), one line each
 */
public record CalibrationView(String title, List<String> dataLines, List<String> truthLines, List<String> assumptions,
                              List<String> warnings, int analystRows, int expectedAt, List<String> learners,
                              List<Expectation> expectations, List<SizePoint> curve, Target target,
                              List<EdgeRow> edges, List<Check> checks, List<String> settings) {

    public CalibrationView {
        dataLines = List.copyOf(dataLines);
        truthLines = List.copyOf(truthLines);
        assumptions = List.copyOf(assumptions);
        warnings = List.copyOf(warnings);
        learners = List.copyOf(learners);
        expectations = List.copyOf(expectations);
        curve = List.copyOf(curve);
        edges = List.copyOf(edges);
        checks = List.copyOf(checks);
        settings = List.copyOf(settings);
    }

    /**
     * Where single replicates fall: the 10th percentile, the median and the 90th percentile of a
     * metric over replicates. The median always lies in its own range, which the mean need not
     * (a metric that is 1 in 95% of replicates and 0 in the rest has mean 0.95 and range 1 – 1),
     * so the range is shown next to the median and the mean is labelled on its own.
     */
    public record Spread(Double p10, Double median, Double p90) {

        /** The spread of nothing: every part undefined. */
        public static final Spread UNDEFINED = new Spread(null, null, null);
    }

    /**
     * One learner's expected value of one metric on data like the analyst's.
     *
     * @param mean       the mean over all simulated replicates at the analyst's size (all truths)
     * @param spread     the median and the 10th–90th percentiles of those values
     * @param fittedMean the mean over replicates of the fitted truth alone
     * @param ok         replicates that finished
     * @param notOk      replicates that failed, timed out or were skipped
     */
    public record Expectation(String learner, String metric, Double mean, Spread spread, Double fittedMean,
                              int ok, int notOk) {
    }

    /** The mean of a metric and the spread of its replicates, for one learner at one simulated size. */
    public record SizePoint(String learner, String metric, int rows, Double mean, Spread spread) {
    }

    /** The question "how many rows would make {@code metric} reach {@code value}?". */
    public record Target(String metric, double value) {
    }

    /**
     * One edge for one learner.
     *
     * @param inTruth           whether the edge is in the fitted truth graph (from → to)
     * @param recovered         fraction of the fitted truth's replicates at the analyst's size where the
     *                          learner's estimate has the pair adjacent (null for edges not in the truth)
     * @param oriented          fraction where it has from → to
     * @param bootstrapAdjacent fraction of bootstrap resamples of the real data where the pair is adjacent
     * @param bootstrapDirected fraction where it is from → to
     */
    public record EdgeRow(String learner, String from, String to, boolean inTruth, Double recovered, Double oriented,
                          Double bootstrapAdjacent, Double bootstrapDirected) {
    }

    /**
     * The checks of one variable of the fitted model.
     *
     * @param kind          {@code continuous} or {@code discrete}
     * @param normalityP    Jarque–Bera p-value of the residuals (null: not applicable)
     * @param nonlinearityP RESET-type p-value (null: not applicable)
     */
    public record Check(String variable, String kind, int rows, double missingRate, Double skewness,
                        Double excessKurtosis, Double normalityP, Double nonlinearityP) {
    }
}
