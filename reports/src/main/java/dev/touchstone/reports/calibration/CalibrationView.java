package dev.touchstone.reports.calibration;

import java.util.List;
import java.util.Objects;

/**
 * Everything the calibration report shows, already summarised (numbers as {@code Double},
 * null = undefined). Immutable; built by the harness from a calibration's runs with
 * {@link #builder()}, since fourteen values, ten of them lists, are easy to swap by position.
 */
public final class CalibrationView {

    private final String title;
    private final List<String> dataLines;
    private final List<String> truthLines;
    private final List<String> assumptions;
    private final List<String> warnings;
    private final int analystRows;
    private final int expectedAt;
    private final List<String> learners;
    private final List<Expectation> expectations;
    private final List<SizePoint> curve;
    private final Target target;
    private final List<EdgeRow> edges;
    private final List<Check> checks;
    private final List<String> settings;

    private CalibrationView(Builder b) {
        title = Objects.requireNonNull(b.title, "title");
        dataLines = List.copyOf(b.dataLines);
        truthLines = List.copyOf(b.truthLines);
        assumptions = List.copyOf(b.assumptions);
        warnings = List.copyOf(b.warnings);
        analystRows = b.analystRows;
        expectedAt = b.expectedAt;
        learners = List.copyOf(b.learners);
        expectations = List.copyOf(b.expectations);
        curve = List.copyOf(b.curve);
        target = Objects.requireNonNull(b.target, "target");
        edges = List.copyOf(b.edges);
        checks = List.copyOf(b.checks);
        settings = List.copyOf(b.settings);
    }

    /** A builder with every list empty; the title and the target must be set. */
    public static Builder builder() {
        return new Builder();
    }

    /** The report's title. */
    public String title() {
        return title;
    }

    /** What the data are: rows, columns, kinds (as inferred or declared), missing cells. */
    public List<String> dataLines() {
        return dataLines;
    }

    /** How the truth graph was obtained and which truths were simulated. */
    public List<String> truthLines() {
        return truthLines;
    }

    /** What the simulation assumes, in plain words. */
    public List<String> assumptions() {
        return assumptions;
    }

    /** Plain warnings from the checks of the fitted model. */
    public List<String> warnings() {
        return warnings;
    }

    /** The data's number of rows. */
    public int analystRows() {
        return analystRows;
    }

    /**
     * The simulated size the expectations are given at (the data's rows when simulated, otherwise
     * the nearest size simulated).
     */
    public int expectedAt() {
        return expectedAt;
    }

    /** The learner ids, in order. */
    public List<String> learners() {
        return learners;
    }

    /** Expected metric values at the analyst's number of rows. */
    public List<Expectation> expectations() {
        return expectations;
    }

    /** Metric values at every simulated size. */
    public List<SizePoint> curve() {
        return curve;
    }

    /** The question answered from the curve. */
    public Target target() {
        return target;
    }

    /** Per-edge recovery on the fitted truth next to bootstrap frequencies on the real data. */
    public List<EdgeRow> edges() {
        return edges;
    }

    /** Per-variable checks of the fitted model. */
    public List<Check> checks() {
        return checks;
    }

    /** How the calibration was run (sizes, replicates, seed, threads), one line each. */
    public List<String> settings() {
        return settings;
    }

    /** Collects the parts of a {@link CalibrationView}. */
    public static final class Builder {
        private String title;
        private List<String> dataLines = List.of();
        private List<String> truthLines = List.of();
        private List<String> assumptions = List.of();
        private List<String> warnings = List.of();
        private int analystRows;
        private int expectedAt;
        private List<String> learners = List.of();
        private List<Expectation> expectations = List.of();
        private List<SizePoint> curve = List.of();
        private Target target;
        private List<EdgeRow> edges = List.of();
        private List<Check> checks = List.of();
        private List<String> settings = List.of();

        private Builder() {
        }

        /** The report's title. */
        public Builder title(String t) {
            title = t;
            return this;
        }

        /** What the data are, one line each. */
        public Builder dataLines(List<String> lines) {
            dataLines = lines;
            return this;
        }

        /** How the truth graph was obtained and which truths were simulated, one line each. */
        public Builder truthLines(List<String> lines) {
            truthLines = lines;
            return this;
        }

        /** What the simulation assumes, one line each. */
        public Builder assumptions(List<String> lines) {
            assumptions = lines;
            return this;
        }

        /** Plain warnings, one each. */
        public Builder warnings(List<String> lines) {
            warnings = lines;
            return this;
        }

        /** The data's number of rows. */
        public Builder analystRows(int rows) {
            analystRows = rows;
            return this;
        }

        /** The simulated size the expectations are given at. */
        public Builder expectedAt(int rows) {
            expectedAt = rows;
            return this;
        }

        /** The learner ids, in order. */
        public Builder learners(List<String> ids) {
            learners = ids;
            return this;
        }

        /** Expected metric values at the analyst's number of rows. */
        public Builder expectations(List<Expectation> e) {
            expectations = e;
            return this;
        }

        /** Metric values at every simulated size. */
        public Builder curve(List<SizePoint> points) {
            curve = points;
            return this;
        }

        /** The question answered from the curve. */
        public Builder target(Target t) {
            target = t;
            return this;
        }

        /** Per-edge recovery and bootstrap frequencies. */
        public Builder edges(List<EdgeRow> rows) {
            edges = rows;
            return this;
        }

        /** Per-variable checks of the fitted model. */
        public Builder checks(List<Check> c) {
            checks = c;
            return this;
        }

        /** How the calibration was run, one line each. */
        public Builder settings(List<String> lines) {
            settings = lines;
            return this;
        }

        /** The view (the lists are copied). */
        public CalibrationView build() {
            return new CalibrationView(this);
        }
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
     * @param means      the means over the simulated replicates at the analyst's size
     * @param spread     the median and the 10th–90th percentiles of the values of all truths
     * @param replicates how many of those replicates finished
     */
    public record Expectation(String learner, String metric, Means means, Spread spread, Replicates replicates) {
    }

    /**
     * The mean of a metric over all simulated truths and over the fitted truth alone, side by side
     * so a reader sees how much the perturbed variants move the answer.
     *
     * @param allTruths   the mean over all simulated replicates (all truths)
     * @param fittedTruth the mean over the replicates of the fitted truth alone
     */
    public record Means(Double allTruths, Double fittedTruth) {
    }

    /**
     * How many replicates an expectation rests on.
     *
     * @param ok    replicates that finished
     * @param notOk replicates that failed, timed out or were skipped
     */
    public record Replicates(int ok, int notOk) {
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
     * @param simulated how the learner did on the fitted truth's replicates at the analyst's size;
     *                  null for an edge not in the fitted truth (there is nothing to recover)
     * @param bootstrap how often it found the edge on bootstrap resamples of the real data
     */
    public record EdgeRow(String learner, String from, String to, Frequencies simulated, Frequencies bootstrap) {

        public EdgeRow {
            Objects.requireNonNull(bootstrap, "bootstrap");
        }

        /** Whether the edge is in the fitted truth graph (from → to). */
        public boolean inTruth() {
            return simulated != null;
        }

        /** Fraction of resamples of the real data where the pair is adjacent. */
        public Double bootstrapAdjacent() {
            return bootstrap.adjacent();
        }
    }

    /**
     * How often a learner's estimates have an edge, over a set of data sets; each null when there
     * are no estimates.
     *
     * @param adjacent fraction of estimates where the pair is adjacent
     * @param oriented fraction where it is directed from → to
     */
    public record Frequencies(Double adjacent, Double oriented) {

        /** No estimates to count: both fractions undefined. */
        public static final Frequencies UNDEFINED = new Frequencies(null, null);
    }

    /**
     * The checks of one variable of the fitted model.
     *
     * @param kind      {@code continuous} or {@code discrete}
     * @param residuals the shape of its residuals and the tests on them
     */
    public record Check(String variable, String kind, int rows, double missingRate, Residuals residuals) {
    }

    /**
     * The residuals of one fitted variable: their shape and the tests of the model's assumptions
     * on them; each null where not applicable (a discrete variable).
     *
     * @param skewness       sample skewness
     * @param excessKurtosis sample excess kurtosis
     * @param normalityP     Jarque–Bera p-value
     * @param nonlinearityP  RESET-type p-value
     */
    public record Residuals(Double skewness, Double excessKurtosis, Double normalityP, Double nonlinearityP) {
    }
}
