package dev.touchstone.generators.models;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ContinuousSampler;

/**
 * X_v = Σ_k w_k X_k + σ_v ε_v with standardised noise ε_v. Rows are processed in blocks
 * so that the block of the output and of each parent stay in cache. One noise draw per row.
 */
final class LinearMechanism implements NodeMechanism {

    private static final int BLOCK = 2048;

    private final int node;
    private final int[] parents;
    private final double[] weights;
    private final double noiseScale;
    private final NoiseDistribution noise;
    private final double degreesOfFreedom;

    LinearMechanism(int node, int[] parents, double[] weights, double noiseScale, NoiseDistribution noise,
                    double degreesOfFreedom) {
        this.node = node;
        this.parents = parents.clone();
        this.weights = weights.clone();
        this.noiseScale = noiseScale;
        this.noise = noise;
        this.degreesOfFreedom = degreesOfFreedom;
    }

    int[] parents() {
        return parents.clone();
    }

    double[] weights() {
        return weights.clone();
    }

    double noiseScale() {
        return noiseScale;
    }

    @Override
    public void fill(Object[] columns, int rows, UniformRandomProvider stream) {
        ContinuousSampler eps = noise.standardSampler(stream, degreesOfFreedom);
        double[] out = new double[rows];
        double[][] in = new double[parents.length][];
        for (int k = 0; k < parents.length; k++) {
            in[k] = (double[]) columns[parents[k]];
        }
        double s = noiseScale;
        for (int from = 0; from < rows; from += BLOCK) {
            int to = Math.min(rows, from + BLOCK);
            for (int r = from; r < to; r++) {
                out[r] = s * eps.sample();
            }
            for (int k = 0; k < in.length; k++) {
                double[] x = in[k];
                double w = weights[k];
                for (int r = from; r < to; r++) {
                    out[r] += w * x[r];
                }
            }
        }
        columns[node] = out;
    }
}
