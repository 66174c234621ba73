package dev.touchstone.generators.models;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;

/**
 * Discrete Bayesian networks: each variable gets a number of categories uniform in
 * [low, high] and, for every configuration of its parents, a distribution drawn from a
 * symmetric Dirichlet with the set concentration (common practice; small concentrations
 * give near-deterministic tables, 1 gives uniform draws from the simplex). Given tables are
 * built with {@link DiscreteNetworkModel#builder}. Sampling costs one uniform draw and a
 * table search per variable per row.
 */
public final class DiscreteNetworkKind extends DeclaredGenerator implements ModelKind {

    public static final String ID = "discrete";

    static final ParameterSpec CARDINALITY_LOW = ParameterSpec.integer("categories_low", 2, 2, 1000,
            "fewest categories of a variable");
    static final ParameterSpec CARDINALITY_HIGH = ParameterSpec.integer("categories_high", 3, 2, 1000,
            "most categories of a variable");
    static final ParameterSpec CONCENTRATION = ParameterSpec.real("concentration", 1.0, 1e-6, 1e6,
            "Dirichlet concentration of every cell of the conditional tables");

    public DiscreteNetworkKind() {
        super(ID, "discrete Bayesian network with conditional tables drawn from a Dirichlet",
                "common practice (Dirichlet-drawn conditional tables)",
                List.of(CARDINALITY_LOW, CARDINALITY_HIGH, CONCENTRATION, ModelOptions.SHUFFLE_COLUMNS));
    }

    @Override
    public DataKind produces() {
        return DataKind.DISCRETE;
    }

    @Override
    public StructuralModel draw(Graph dag, ParameterValues values, UniformRandomProvider random) {
        return DiscreteNetworkModel.drawRandom(ID, dag, values, random);
    }
}
