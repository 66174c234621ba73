package dev.touchstone.generators.models;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;

/**
 * Mixed data from a conditional Gaussian model (Lauritzen and Wermuth 1989, "Graphical
 * models for associations between variables, some of which are qualitative and some
 * quantitative", Annals of Statistics 17): each variable is discrete with the set
 * probability, otherwise continuous. A continuous variable is linear in its continuous
 * parents plus a mean shift for each category of each discrete parent, plus Gaussian noise.
 * A discrete variable follows a multinomial logistic link: its log-odds are a table over
 * the configurations of its discrete parents (logarithms of Dirichlet draws) plus a linear
 * term in its continuous parents, which enter standardised by pilot moments. Cost per row:
 * O(parents · categories).
 */
public final class ConditionalGaussianKind extends DeclaredGenerator implements ModelKind {

    public static final String ID = "conditional-gaussian";

    static final ParameterSpec DISCRETE_FRACTION = ParameterSpec.real("discrete_fraction", 0.5, 0.0, 1.0,
            "probability that a variable is discrete");

    public ConditionalGaussianKind() {
        super(ID, "mixed discrete and continuous variables (conditional Gaussian, multinomial logistic link)",
                "Lauritzen and Wermuth (1989), Graphical models for associations between variables, Ann. Statist. 17",
                ModelOptions.continuousKind(DISCRETE_FRACTION, DiscreteNetworkKind.CARDINALITY_LOW,
                        DiscreteNetworkKind.CARDINALITY_HIGH, DiscreteNetworkKind.CONCENTRATION));
    }

    @Override
    public DataKind produces() {
        return DataKind.MIXED;
    }

    @Override
    public StructuralModel draw(Graph dag, ParameterValues values, UniformRandomProvider random) {
        return MixedModels.draw(ID, dag, values, random);
    }
}
