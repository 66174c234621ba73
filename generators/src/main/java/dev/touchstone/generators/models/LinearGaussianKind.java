package dev.touchstone.generators.models;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;

/**
 * Linear Gaussian structural equations X_v = Σ w_vk X_k + σ_v ε_v, ε_v standard normal:
 * weights uniform in ±[low, high], noise standard deviations uniform in [low, high] (all
 * equal when low = high). The setting of most simulation studies (common practice; the
 * artefacts of the default ±[0.5, 2] weights are analysed by Reisach, Seiler and
 * Weichwald 2021, "Beware of the simulated DAG!", NeurIPS). Sampling costs one normal draw
 * (Commons RNG ziggurat) and one multiply-add per edge per row.
 */
public final class LinearGaussianKind extends DeclaredGenerator implements ModelKind {

    public static final String ID = "linear-gaussian";

    public LinearGaussianKind() {
        super(ID, "linear equations with Gaussian noise",
                "common practice; see Reisach, Seiler and Weichwald (2021), Beware of the simulated DAG!, NeurIPS",
                ModelOptions.continuousKind());
    }

    @Override
    public DataKind produces() {
        return DataKind.CONTINUOUS;
    }

    @Override
    public StructuralModel draw(Graph dag, ParameterValues values, UniformRandomProvider random) {
        return LinearModels.draw(ID, dag, values, NoiseDistribution.GAUSSIAN, Double.NaN, random);
    }
}
