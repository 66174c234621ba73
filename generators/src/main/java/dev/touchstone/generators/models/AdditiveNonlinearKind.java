package dev.touchstone.generators.models;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;

/**
 * Nonlinear structural equations with additive noise, X_v = f_v(parents) + σ_v ε_v
 * (the additive noise model of Hoyer et al. 2009, "Nonlinear causal discovery with
 * additive noise models", NeurIPS; Peters et al. 2014, JMLR 15). Each f_v is drawn from one
 * class: {@code sigmoid} (a sum of scaled tanh of each parent), {@code polynomial} (a sum of
 * random quadratics of each parent, clipped to ±3 sd), {@code neural-net} (a one-hidden-layer network of all
 * parents with sigmoid units), {@code fourier} (random Fourier features, a stand-in for a
 * Gaussian-process draw with an RBF kernel: Rahimi and Recht 2007, NeurIPS), or
 * {@code mixed} (each variable picks one of the four).
 *
 * <p>Parents enter centred and scaled by their own pilot moments, and f_v is rescaled to
 * unit pilot variance, so the noise scale sets the signal-to-noise ratio and values do not
 * explode along long paths. Noise is Gaussian. Cost per row: the functions' cost,
 * O(parents · units).
 */
public final class AdditiveNonlinearKind extends DeclaredGenerator implements ModelKind {

    public static final String ID = "additive-nonlinear";

    static final ParameterSpec FUNCTIONS = ParameterSpec.choice("functions", "mixed",
            List.of("sigmoid", "polynomial", "neural-net", "fourier", "mixed"),
            "class of the random function of each variable's parents");
    static final ParameterSpec HIDDEN_UNITS = ParameterSpec.integer("hidden_units", 8, 1, 1000,
            "hidden units of each neural-net function");
    static final ParameterSpec FEATURES = ParameterSpec.integer("fourier_features", 20, 1, 10_000,
            "random features of each fourier function");
    static final ParameterSpec LENGTH_SCALE = ParameterSpec.real("length_scale", 1.0, 1e-3, 1e3,
            "length scale of the RBF kernel the fourier functions imitate (on standardised parents)");

    public AdditiveNonlinearKind() {
        super(ID, "nonlinear functions of the parents plus Gaussian noise (additive noise model)",
                "Hoyer et al. (2009), Nonlinear causal discovery with additive noise models, NeurIPS",
                ModelOptions.continuousKind(FUNCTIONS, HIDDEN_UNITS, FEATURES, LENGTH_SCALE));
    }

    @Override
    public DataKind produces() {
        return DataKind.CONTINUOUS;
    }

    @Override
    public StructuralModel draw(Graph dag, ParameterValues values, UniformRandomProvider random) {
        return NonlinearModels.draw(ID, dag, values, random);
    }
}
