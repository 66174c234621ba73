package dev.touchstone.generators.models;

import java.util.List;

/**
 * Every parameter of one variable's mechanism, by name, as plain values: what a model file
 * writes and what {@link ModelParameters#model()} rebuilds the mechanism from, exactly. One
 * record per kind of mechanism:
 * <ul>
 * <li>{@link Linear}: X = Σ w_k X_k + σ ε (linear structural equations, common practice);</li>
 * <li>{@link Additive}: X = (f(z) − c) / s + σ ε with z_k = (X_k − centre_k) / scale_k
 *     (additive noise model, Hoyer et al. 2009);</li>
 * <li>{@link Table}: a conditional probability table (Pearl 1988);</li>
 * <li>{@link ConditionalGaussian}: X = intercept + Σ w_k z_k + Σ shift_k[code_k] + σ ε
 *     (conditional Gaussian, Lauritzen and Wermuth 1989);</li>
 * <li>{@link Logistic}: a multinomial logistic link over continuous parents with intercepts
 *     by discrete-parent configuration.</li>
 * </ul>
 * Arrays are held as given (not copied): these are carriers between a model and a file.
 */
public sealed interface NodeParameters {

    /** The variable the mechanism computes. */
    String variable();

    /** A centre and scale: a value enters as (x − centre) / scale. */
    record Scaling(double centre, double scale) {
    }

    /** A parent entering standardised by {@code scaling}. */
    record Input(String parent, Scaling scaling) {
    }

    /** A standardised continuous parent with its coefficients (one, or one per category of the child). */
    record Slope(String parent, Scaling scaling, double[] values) {
    }

    /** A discrete parent's additive shift for each of its categories (the first is usually 0). */
    record Shift(String parent, double[] byCategory) {
    }

    /** Standardised noise (mean 0, variance 1) times {@code scale}; ν only matters for student-t. */
    record Noise(NoiseDistribution distribution, double scale, double degreesOfFreedom) {
    }

    /** X = Σ_k weights[k] · X[parents[k]] + noise. */
    record Linear(String variable, List<String> parents, double[] weights, Noise noise) implements NodeParameters {
    }

    /** X = (f(z) − output.centre) / output.scale + noiseScale · ε, ε standard normal. */
    record Additive(String variable, List<Input> inputs, NodeFunction function, Scaling output, double noiseScale)
            implements NodeParameters {
    }

    /**
     * P(X = categories[c] | parents in configuration r) = probabilities[r][c], configurations
     * in mixed radix with the last parent varying fastest.
     */
    record Table(String variable, List<String> categories, List<String> parents, double[][] probabilities)
            implements NodeParameters {
    }

    /** X = intercept + Σ slope.values[0] · z + Σ shift.byCategory[code] + noiseScale · ε, ε standard normal. */
    record ConditionalGaussian(String variable, double intercept, List<Slope> continuousParents, List<Shift> discreteParents,
                               double noiseScale) implements NodeParameters {
    }

    /**
     * log-odds of category c = logIntercepts[r][c] + Σ_k slopes[k].values[c] · z_k, with r the
     * configuration of the discrete parents (last fastest).
     */
    record Logistic(String variable, List<String> categories, List<String> discreteParents, double[][] logIntercepts,
                    List<Slope> slopes) implements NodeParameters {
    }
}
