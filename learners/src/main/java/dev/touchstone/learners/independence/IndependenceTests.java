package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;

import java.util.List;

/**
 * Chooses and builds the independence test for a learner's input: the d-separation oracle
 * for an oracle input, otherwise the test named by the {@code test} parameter, with the
 * missing-value policy applied. Also holds the parameter declarations every
 * constraint-based learner shares, so that they are spelled the same everywhere.
 */
public final class IndependenceTests {

    /** Picks Fisher z for continuous data, G² for discrete and the conditional Gaussian test for mixed. */
    public static final String AUTO = "auto";
    public static final String FISHER_Z = "fisher-z";
    public static final String G_SQUARE = "g-square";
    public static final String CHI_SQUARE = "chi-square";
    public static final String CONDITIONAL_GAUSSIAN = "conditional-gaussian";
    /** The kernel conditional independence test of Zhang, Peters, Janzing and Schölkopf (2011), {@link KciTest}. */
    public static final String KCI = "kci";
    /** The randomized conditional independence test of Strobl, Zhang and Visweswaran (2019), {@link RcitTest}. */
    public static final String RCIT = "rcit";

    /** The {@code test} parameter. */
    public static final Parameter<String> TEST = Parameter.oneOf("test", AUTO,
            List.of(AUTO, FISHER_Z, G_SQUARE, CHI_SQUARE, CONDITIONAL_GAUSSIAN, KCI, RCIT),
            "independence test: auto picks fisher-z (continuous), g-square (discrete) or conditional-gaussian (mixed; Andrews, Ramsey and Cooper 2018); "
                    + "kci (Zhang et al. 2011) and rcit (Strobl et al. 2019) are kernel tests for nonlinear continuous data; "
                    + "ignored with the oracle");
    /** The {@code alpha} parameter. */
    public static final Parameter<Double> ALPHA = Parameter.real("alpha", 0.01, 1e-12, 0.999,
            "significance level of each independence test");
    /** The {@code missing} parameter. */
    public static final Parameter<MissingPolicy> MISSING = Parameter.choice("missing", MissingPolicy.TEST_WISE,
            "rows with missing cells: test-wise uses the rows complete for each test's "
                    + "variables, list-wise drops every incomplete row first");

    /** The {@code degrees_of_freedom} parameter of the G² and χ² tests. */
    public static final Parameter<ContingencyTest.DegreesOfFreedom> DEGREES_OF_FREEDOM = Parameter.choice(
            "degrees_of_freedom", ContingencyTest.DegreesOfFreedom.REDUCED,
            "degrees of freedom of g-square and chi-square: reduced counts only the non-empty rows and columns of each "
                    + "stratum with data (common practice); textbook is (|X|-1)(|Y|-1) times the number of configurations "
                    + "of the conditioning set (Agresti 2002)");

    /** The {@code kci_rank} parameter. */
    public static final Parameter<Integer> KCI_RANK = Parameter.integer("kci_rank", 100, 1, 100_000,
            "with test = kci: largest rank of the incomplete Cholesky factor of each kernel matrix (bounds the cost)");
    /** The {@code kci_ridge} parameter. */
    public static final Parameter<Double> KCI_RIDGE = Parameter.real("kci_ridge", 1e-3, 1e-12, 1e6,
            "with test = kci: ridge ε of the kernel regression on the conditioning set, R = ε(K + εI)⁻¹");
    /** The {@code kci_max_rows} parameter. */
    public static final Parameter<Integer> KCI_MAX_ROWS = Parameter.integer("kci_max_rows", 2000, 6, Integer.MAX_VALUE,
            "with test = kci: with more usable rows, each test uses a seeded random subset of this many");
    /** The {@code rcit_features} parameter. */
    public static final Parameter<Integer> RCIT_FEATURES = Parameter.integer("rcit_features", 5, 1, 100,
            "with test = rcit: random Fourier features for each of the two tested variables");
    /** The {@code rcit_conditioning_features} parameter. */
    public static final Parameter<Integer> RCIT_CONDITIONING_FEATURES = Parameter.integer("rcit_conditioning_features",
            100, 1, 5000, "with test = rcit: random Fourier features for the conditioning set");

    /** The parameters of the kernel tests, which every learner with a {@code test} parameter declares too. */
    public static java.util.List<ParameterSpec> kernelParameters() {
        return List.of(KCI_RANK.spec(), KCI_RIDGE.spec(), KCI_MAX_ROWS.spec(), RCIT_FEATURES.spec(),
                RCIT_CONDITIONING_FEATURES.spec());
    }

    private IndependenceTests() {
    }

    /**
     * The test for this input.
     *
     * @throws LearnerException when the named test does not fit the data (naming both), or
     *     list-wise deletion leaves no rows
     */
    public static IndependenceTest forInput(LearnerInput input, String test, double alpha, MissingPolicy missing) {
        return forInput(input, test, alpha, missing, ContingencyTest.DegreesOfFreedom.REDUCED,
                KciTest.Settings.defaults(0), RcitTest.Settings.defaults(0));
    }

    /**
     * The test named by the {@code test}, {@code alpha}, {@code missing} and
     * {@code degrees_of_freedom} values, with the kernel tests' settings read from the same
     * values and their randomness (KCI's row subset, RCIT's features) drawn from {@code seed}.
     */
    public static IndependenceTest forInput(LearnerInput input, ParameterValues values, long seed) {
        KciTest.Settings kci = new KciTest.Settings(values.get(KCI_RANK), values.get(KCI_RIDGE),
                values.get(KCI_MAX_ROWS), seed);
        RcitTest.Settings rcit = new RcitTest.Settings(values.get(RCIT_FEATURES),
                values.get(RCIT_CONDITIONING_FEATURES), seed);
        return forInput(input, values.get(TEST), values.get(ALPHA),
                values.get(MISSING),
                values.get(DEGREES_OF_FREEDOM), kci, rcit);
    }

    /**
     * As {@link #forInput(LearnerInput, String, double, MissingPolicy)}, with the degrees-of-freedom
     * rule of G² and χ² and the kernel tests' settings.
     */
    public static IndependenceTest forInput(LearnerInput input, String test, double alpha, MissingPolicy missing,
                                            ContingencyTest.DegreesOfFreedom degreesOfFreedom, KciTest.Settings kci,
                                            RcitTest.Settings rcit) {
        if (input.isOracle()) {
            return new OracleTest(input.oracle());
        }
        DataSet data = input.data();
        if (missing == MissingPolicy.LIST_WISE && data.hasMissing()) {
            data = data.completeCases();
            if (data.rows() == 0) {
                throw new LearnerException("list-wise deletion leaves no rows: every row has a missing cell");
            }
        }
        DataKind kind = data.kind();
        String chosen = test;
        if (AUTO.equals(test)) {
            chosen = kind == DataKind.CONTINUOUS ? FISHER_Z : kind == DataKind.DISCRETE ? G_SQUARE : CONDITIONAL_GAUSSIAN;
        }
        switch (chosen) {
            case FISHER_Z:
                if (kind != DataKind.CONTINUOUS) {
                    throw new LearnerException("test fisher-z needs continuous data, these are " + kind.word()
                            + " (use g-square or chi-square for discrete, conditional-gaussian for mixed)");
                }
                return data.hasMissing() ? new TestwiseFisherZTest(data, alpha) : FisherZTest.of(data, alpha);
            case G_SQUARE:
            case CHI_SQUARE:
                if (kind != DataKind.DISCRETE) {
                    throw new LearnerException("test " + chosen + " needs discrete data, these are " + kind.word()
                            + " (use fisher-z for continuous, conditional-gaussian for mixed)");
                }
                return new ContingencyTest(data, chosen.equals(G_SQUARE)
                        ? ContingencyTest.Statistic.G_SQUARE : ContingencyTest.Statistic.CHI_SQUARE, alpha,
                        degreesOfFreedom);
            case CONDITIONAL_GAUSSIAN:
                return new ConditionalGaussianTest(data, alpha);
            case KCI:
            case RCIT:
                if (kind != DataKind.CONTINUOUS) {
                    throw new LearnerException("test " + chosen + " needs continuous data, these are " + kind.word()
                            + " (use g-square or chi-square for discrete, conditional-gaussian for mixed)");
                }
                return chosen.equals(KCI) ? KciTest.of(data, alpha, kci) : RcitTest.of(data, alpha, rcit);
            default:
                throw new LearnerException("unknown independence test '" + test + "' (allowed: "
                        + String.join(", ", TEST.spec().choices()) + ")");
        }
    }

}
