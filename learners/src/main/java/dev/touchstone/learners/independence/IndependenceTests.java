package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.param.ParameterSpec;

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

    /** The {@code test} parameter. */
    public static final ParameterSpec TEST = ParameterSpec.choice("test", AUTO,
            List.of(AUTO, FISHER_Z, G_SQUARE, CHI_SQUARE, CONDITIONAL_GAUSSIAN),
            "independence test: auto picks fisher-z (continuous), g-square (discrete) or conditional-gaussian (mixed; Andrews, Ramsey and Cooper 2018); "
                    + "ignored with the oracle");
    /** The {@code alpha} parameter. */
    public static final ParameterSpec ALPHA = ParameterSpec.real("alpha", 0.01, 1e-12, 0.999,
            "significance level of each independence test");
    /** The {@code missing} parameter. */
    public static final ParameterSpec MISSING = ParameterSpec.choice("missing", MissingPolicy.TEST_WISE.word(),
            MissingPolicy.words(), "rows with missing cells: test-wise uses the rows complete for each test's "
                    + "variables, list-wise drops every incomplete row first");

    /** The {@code degrees_of_freedom} parameter of the G² and χ² tests. */
    public static final ParameterSpec DEGREES_OF_FREEDOM = ParameterSpec.choice("degrees_of_freedom",
            ContingencyTest.DegreesOfFreedom.REDUCED.word(), List.of(ContingencyTest.DegreesOfFreedom.REDUCED.word(),
                    ContingencyTest.DegreesOfFreedom.TEXTBOOK.word()),
            "degrees of freedom of g-square and chi-square: reduced counts only the non-empty rows and columns of each "
                    + "stratum with data (common practice); textbook is (|X|-1)(|Y|-1) times the number of configurations "
                    + "of the conditioning set (Agresti 2002)");

    private IndependenceTests() {
    }

    /**
     * The test for this input.
     *
     * @throws LearnerException when the named test does not fit the data (naming both), or
     *     list-wise deletion leaves no rows
     */
    public static IndependenceTest forInput(LearnerInput input, String test, double alpha, MissingPolicy missing) {
        return forInput(input, test, alpha, missing, ContingencyTest.DegreesOfFreedom.REDUCED);
    }

    /**
     * The test for this input, with the given degrees-of-freedom rule for G² and χ².
     *
     * @throws LearnerException as {@link #forInput(LearnerInput, String, double, MissingPolicy)}
     */
    public static IndependenceTest forInput(LearnerInput input, String test, double alpha, MissingPolicy missing,
                                            ContingencyTest.DegreesOfFreedom degreesOfFreedom) {
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
            default:
                throw new LearnerException("unknown independence test '" + test + "' (allowed: "
                        + String.join(", ", TEST.choices()) + ")");
        }
    }

}
