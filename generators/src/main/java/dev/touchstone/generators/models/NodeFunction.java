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
 * large-scale kernel machines", NeurIPS). Each class is a record of its coefficients, so a
 * drawn function can be written out and rebuilt exactly. Cost O(parents) per value
 * (O(units · parents) for neural-net, O(D · parents) for fourier).
 */
public sealed interface NodeFunction {

    /**
     * Polynomials act on the standardised parent clipped to ±3: chained quadratics otherwise
     * give ever heavier tails, whose variance a pilot draw cannot pin down.
     */
    double POLYNOMIAL_CLIP = 3.0;

    /** f(z) for the standardised parents z. */
    double apply(double[] z);

    /** The class word: {@code none}, {@code sigmoid}, {@code polynomial}, {@code neural-net} or {@code fourier}. */
    String word();

    /** The function of a variable without parents: 0. */
    record None() implements NodeFunction {
        @Override
        public double apply(double[] z) {
            return 0.0;
        }

        @Override
        public String word() {
            return "none";
        }
    }

    /** Σ_k weights[k] · tanh(slopes[k] · z_k). */
    record Sigmoid(double[] weights, double[] slopes) implements NodeFunction {
        @Override
        public double apply(double[] z) {
            double s = 0;
            for (int k = 0; k < z.length; k++) {
                s += weights[k] * Math.tanh(slopes[k] * z[k]);
            }
            return s;
        }

        @Override
        public String word() {
            return "sigmoid";
        }
    }

    /** Σ_k (linear[k] · x_k + quadratic[k] · (x_k² − 1)) with x_k = z_k clipped to ±{@value #POLYNOMIAL_CLIP}. */
    record Polynomial(double[] linear, double[] quadratic) implements NodeFunction {
        @Override
        public double apply(double[] z) {
            double s = 0;
            for (int k = 0; k < z.length; k++) {
                double x = Math.max(-POLYNOMIAL_CLIP, Math.min(POLYNOMIAL_CLIP, z[k]));
                s += linear[k] * x + quadratic[k] * (x * x - 1);
            }
            return s;
        }

        @Override
        public String word() {
            return "polynomial";
        }
    }

    /** Σ_h output[h] · σ(bias[h] + Σ_k input[h][k] · z_k) with the logistic σ. */
    record NeuralNet(double[][] input, double[] bias, double[] output) implements NodeFunction {
        @Override
        public double apply(double[] z) {
            return ridgeSum(input, bias, output, z, false);
        }

        @Override
        public String word() {
            return "neural-net";
        }
    }

    /** Σ_d amplitude[d] · cos(phase[d] + Σ_k frequency[d][k] · z_k). */
    record Fourier(double[][] frequency, double[] phase, double[] amplitude) implements NodeFunction {
        @Override
        public double apply(double[] z) {
            return ridgeSum(frequency, phase, amplitude, z, true);
        }

        @Override
        public String word() {
            return "fourier";
        }
    }

    /**
     * Σ_h weight[h] · φ(offset[h] + Σ_k direction[h][k] · z_k), the sum of ridge functions that
     * both the network (φ the logistic, written weight / (1 + e^−a)) and the Fourier features
     * (φ = cos) are. The branch is per term, so one loop serves both at the cost of one
     * well-predicted test.
     */
    private static double ridgeSum(double[][] direction, double[] offset, double[] weight, double[] z,
                                   boolean cosine) {
        double s = 0;
        for (int h = 0; h < weight.length; h++) {
            double a = offset[h];
            for (int k = 0; k < z.length; k++) {
                a += direction[h][k] * z[k];
            }
            s += cosine ? weight[h] * Math.cos(a) : weight[h] / (1 + Math.exp(-a));
        }
        return s;
    }

    /** Draws a function of the class {@code kind} over {@code parents} standardised parents. */
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
                return new Sigmoid(weight, slope);
            }
            case "polynomial": {
                double[] lin = new double[parents];
                double[] quad = new double[parents];
                for (int k = 0; k < parents; k++) {
                    lin[k] = w.draw(random);
                    quad[k] = w.draw(random);
                }
                return new Polynomial(lin, quad);
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
                return new NeuralNet(in, bias, out);
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
                return new Fourier(omega, phase, amp);
            }
            default:
                throw new IllegalArgumentException("unknown function class '" + kind + "'");
        }
    }
}
