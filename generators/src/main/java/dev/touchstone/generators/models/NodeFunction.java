package dev.touchstone.generators.models;

import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/**
 * A random function of a variable's (standardised) parents, for the additive noise model.
 * The classes, each drawn with the model's weight range for its coefficients:
 * sigmoid Σ_k w_k tanh(a_k z_k); polynomial Σ_k (b_k x_k + c_k (x_k² − 1)) with x_k = z_k clipped
 * to ±3; neural-net
 * Σ_h v_h σ(Σ_k W_hk z_k + c_h) with the logistic σ; fourier √(2/D) Σ_d a_d cos(ω_d·z + b_d)
 * with ω_d ~ N(0, I/ℓ²), b_d ~ U(0, 2π), a_d ~ N(0, 1), whose covariance approaches the RBF
 * kernel exp(−|z − z'|²/(2ℓ²)) as D grows (Rahimi and Recht 2007, "Random features for
 * large-scale kernel machines", NeurIPS).
 */
interface NodeFunction {

    /**
     * Polynomials act on the standardised parent clipped to ±3: chained quadratics otherwise
     * give ever heavier tails, whose variance a pilot draw cannot pin down.
     */
    double POLYNOMIAL_CLIP = 3.0;

    double apply(double[] z);

    static NodeFunction draw(String kind, int parents, ParameterValues values, UniformRandomProvider random) {
        ModelOptions.WeightDraw w = ModelOptions.weights(values);
        switch (kind) {
            case "sigmoid": {
                double[] weight = new double[parents];
                double[] slope = new double[parents];
                for (int k = 0; k < parents; k++) {
                    weight[k] = w.draw(random);
                    slope[k] = 0.5 + 1.5 * random.nextDouble();
                }
                return z -> {
                    double s = 0;
                    for (int k = 0; k < z.length; k++) {
                        s += weight[k] * Math.tanh(slope[k] * z[k]);
                    }
                    return s;
                };
            }
            case "polynomial": {
                double[] lin = new double[parents];
                double[] quad = new double[parents];
                for (int k = 0; k < parents; k++) {
                    lin[k] = w.draw(random);
                    quad[k] = w.draw(random);
                }
                return z -> {
                    double s = 0;
                    for (int k = 0; k < z.length; k++) {
                        double x = Math.max(-POLYNOMIAL_CLIP, Math.min(POLYNOMIAL_CLIP, z[k]));
                        s += lin[k] * x + quad[k] * (x * x - 1);
                    }
                    return s;
                };
            }
            case "neural-net": {
                int units = values.getInt(AdditiveNonlinearKind.HIDDEN_UNITS.name());
                double[][] in = new double[units][parents];
                double[] bias = new double[units];
                double[] out = new double[units];
                for (int h = 0; h < units; h++) {
                    for (int k = 0; k < parents; k++) {
                        in[h][k] = w.draw(random);
                    }
                    bias[h] = 2 * random.nextDouble() - 1;
                    out[h] = w.draw(random);
                }
                return z -> {
                    double s = 0;
                    for (int h = 0; h < units; h++) {
                        double a = bias[h];
                        for (int k = 0; k < z.length; k++) {
                            a += in[h][k] * z[k];
                        }
                        s += out[h] / (1 + Math.exp(-a));
                    }
                    return s;
                };
            }
            case "fourier": {
                int d = values.getInt(AdditiveNonlinearKind.FEATURES.name());
                double ell = values.getDouble(AdditiveNonlinearKind.LENGTH_SCALE.name());
                ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(random);
                double[][] omega = new double[d][parents];
                double[] phase = new double[d];
                double[] amp = new double[d];
                double norm = Math.sqrt(2.0 / d);
                for (int f = 0; f < d; f++) {
                    for (int k = 0; k < parents; k++) {
                        omega[f][k] = g.sample() / ell;
                    }
                    phase[f] = 2 * Math.PI * random.nextDouble();
                    amp[f] = norm * g.sample();
                }
                return z -> {
                    double s = 0;
                    for (int f = 0; f < d; f++) {
                        double a = phase[f];
                        for (int k = 0; k < z.length; k++) {
                            a += omega[f][k] * z[k];
                        }
                        s += amp[f] * Math.cos(a);
                    }
                    return s;
                };
            }
            default:
                throw new IllegalArgumentException("unknown function class '" + kind + "'");
        }
    }
}
