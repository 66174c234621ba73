package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;

import java.util.List;

/**
 * What every score-based learner shares: its declaration (data kinds, knowledge, oracle,
 * assumptions of the scores) and parameters (which local score, its penalty or prior
 * strength, the parent-set bound), and the one place that turns them and the input into a
 * {@link LocalScore}.
 */
final class ScoreSettings {

    static final String AUTO = "auto";
    static final String BIC = "bic";
    static final String EBIC = "ebic";
    static final String BDEU = "bdeu";
    static final String CONDITIONAL_GAUSSIAN_BIC = "conditional-gaussian-bic";

    static final Parameter<String> SCORE = Parameter.oneOf("score", AUTO,
            List.of(AUTO, BIC, EBIC, BDEU, CONDITIONAL_GAUSSIAN_BIC),
            "local score: bic or ebic (continuous), bdeu (discrete), conditional-gaussian-bic (mixed; Andrews, Ramsey and Cooper 2018); auto picks by data kind");
    static final Parameter<Double> PENALTY = Parameter.real("penalty", 1.0, 0.01, 100.0,
            "multiplier of the BIC penalty (bic, ebic and conditional-gaussian-bic; 1 is the classical BIC)");
    static final Parameter<Double> GAMMA = Parameter.real("gamma", 0.5, 0.0, 1.0,
            "extended BIC's edge-prior weight: each parent costs 2·gamma·ln(p−1) more (ebic; 0 is the BIC)");
    static final Parameter<Double> EQUIVALENT_SAMPLE_SIZE = Parameter.real("equivalent_sample_size", 1.0, 0.001,
            10000.0, "equivalent sample size of the BDeu prior (bdeu)");
    static final Parameter<Integer> PARENT_LIMIT = Parameter.integer("parent_limit", -1, -1, 1000,
            "largest parent set a move may create; -1 for no limit");

    private ScoreSettings() {
    }

    /**
     * A description builder with the declaration every score-based learner shares filled in,
     * the score parameters included; the caller adds its own assumptions and parameters.
     */
    static LearnerDescription.Builder describe(String id, String summary, String publication, GraphClass returns) {
        LearnerDescription.Builder b = LearnerDescription.builder(id)
                .summary(summary)
                .publication(publication)
                .family(LearnerFamily.SCORE)
                .accepts(DataKind.CONTINUOUS, DataKind.DISCRETE, DataKind.MIXED)
                .returns(returns)
                .missingValues(MissingValues.LIST_WISE)
                .knowledge(KnowledgeUse.REQUIRED_EDGES, KnowledgeUse.FORBIDDEN_EDGES, KnowledgeUse.TIERS)
                .assumption("acyclic causal structure")
                .assumption("no hidden confounders")
                .assumption("the score's model: linear Gaussian (bic, ebic), multinomial (bdeu) or conditional Gaussian (conditional-gaussian-bic)")
                .oracle(OracleUse.COVARIANCE);
        for (ParameterSpec s : specs()) {
            b.parameter(s);
        }
        return b;
    }

    static List<ParameterSpec> specs() {
        return List.of(SCORE.spec(), PENALTY.spec(), GAMMA.spec(), EQUIVALENT_SAMPLE_SIZE.spec(), PARENT_LIMIT.spec());
    }

    /**
     * The local score the parameters ask for on this input, behind no cache.
     *
     * @throws LearnerException when the score does not fit the data kind or the oracle, or the data cannot be scored
     */
    static LocalScore build(String learnerId, LearnerInput input, ParameterValues values) {
        String name = values.get(SCORE);
        double penalty = values.get(PENALTY);
        try {
            if (input.isOracle()) {
                if (!name.equals(AUTO) && !name.equals(BIC) && !name.equals(EBIC)) {
                    throw new LearnerException("learner " + learnerId + ": score " + name
                            + " cannot use the oracle (it gives a covariance; use bic or ebic)");
                }
                return gaussian(name, BicScore.of(input.oracle().populationCovariance(), penalty), values);
            }
            DataSet data = input.data();
            DataKind kind = data.kind();
            if (name.equals(AUTO)) {
                name = kind == DataKind.CONTINUOUS ? BIC : kind == DataKind.DISCRETE ? BDEU : CONDITIONAL_GAUSSIAN_BIC;
            }
            switch (name) {
                case BIC:
                    requireKind(learnerId, name, kind, DataKind.CONTINUOUS);
                    return BicScore.of(data.covariance(), penalty);
                case EBIC:
                    requireKind(learnerId, name, kind, DataKind.CONTINUOUS);
                    return gaussian(name, BicScore.of(data.covariance(), penalty), values);
                case BDEU:
                    requireKind(learnerId, name, kind, DataKind.DISCRETE);
                    return BdeuScore.of(data, values.get(EQUIVALENT_SAMPLE_SIZE));
                default:
                    return ConditionalGaussianScore.of(data, penalty);
            }
        } catch (IllegalArgumentException e) {
            throw new LearnerException("learner " + learnerId + ": " + e.getMessage(), e);
        }
    }

    /** The BIC, or the extended BIC over it when the parameters ask for ebic. */
    private static LocalScore gaussian(String name, BicScore bic, ParameterValues values) {
        return name.equals(EBIC) ? EbicScore.of(bic, values.get(GAMMA)) : bic;
    }

    private static void requireKind(String learnerId, String score, DataKind got, DataKind needed) {
        if (got != needed) {
            throw new LearnerException("learner " + learnerId + ": score " + score + " needs " + needed.word()
                    + " data, got " + got.word() + " data (use score=auto or conditional-gaussian-bic)");
        }
    }
}
