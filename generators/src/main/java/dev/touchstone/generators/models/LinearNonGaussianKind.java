package dev.touchstone.generators.models;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;

/**
 * Linear structural equations with independent non-Gaussian noise (uniform, exponential,
 * Laplace, Gumbel or Student t, each standardised to variance 1 and scaled by the noise
 * standard deviation), the LiNGAM setting in which the full DAG is identifiable
 * (Shimizu et al. 2006, "A linear non-Gaussian acyclic model for causal discovery", JMLR 7).
 * Cost as for {@link LinearGaussianKind}, with the noise sampler's cost per draw.
 */
public final class LinearNonGaussianKind extends DeclaredGenerator implements ModelKind {

    public static final String ID = "linear-non-gaussian";

    static final ParameterSpec NOISE = ParameterSpec.choice("noise", "uniform",
            List.of("uniform", "exponential", "laplace", "gumbel", "student-t"),
            "shape of the noise (standardised to mean 0, variance 1)");
    static final ParameterSpec DEGREES_OF_FREEDOM = ParameterSpec.real("degrees_of_freedom", 5.0, 2.5, 1e6,
            "degrees of freedom of student-t noise");

    public LinearNonGaussianKind() {
        super(ID, "linear equations with non-Gaussian noise (LiNGAM setting)",
                "Shimizu et al. (2006), A linear non-Gaussian acyclic model for causal discovery, JMLR 7",
                ModelOptions.continuousKind(NOISE, DEGREES_OF_FREEDOM));
    }

    @Override
    public DataKind produces() {
        return DataKind.CONTINUOUS;
    }

    @Override
    public StructuralModel draw(Graph dag, ParameterValues values, UniformRandomProvider random) {
        NoiseDistribution noise = NoiseDistribution.parse(values.getString(NOISE.name()));
        return LinearModels.draw(ID, dag, values, noise, values.getDouble(DEGREES_OF_FREEDOM.name()), random);
    }
}
