package dev.touchstone.generators.models;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ContinuousSampler;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

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
    public NodeParameters describe(dev.touchstone.core.graph.Graph graph, dev.touchstone.core.data.Variable[] variables) {
        return new NodeParameters.Linear(graph.name(node), NodeMechanism.names(graph, parents), weights.clone(),
                new NodeParameters.Noise(noise, noiseScale, degreesOfFreedom));
    }

    @Override
    public void fill(Object[] columns, int rows, UniformRandomProvider stream) {
        double[] out = new double[rows];
        if (noise == NoiseDistribution.GAUSSIAN) {
            fillGaussian(out, columns, rows, ZigguratSampler.NormalizedGaussian.of(stream));
            return;
        }
        ContinuousSampler eps = noise.standardSampler(stream, degreesOfFreedom);
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

    /** The Gaussian case with the concrete sampler type, so the draw inlines into the loop. */
    private void fillGaussian(double[] out, Object[] columns, int rows, ZigguratSampler.NormalizedGaussian eps) {
        columns[node] = out;
        GaussianBlocks b = new GaussianBlocks(out, columns, eps);
        for (int from = 0; from < rows; from += BLOCK) {
            b.fill(from, Math.min(rows, from + BLOCK));
        }
    }

    @Override
    public BlockFiller blocks(Object[] columns, int rows, UniformRandomProvider stream) {
        if (noise != NoiseDistribution.GAUSSIAN) {
            return null;
        }
        double[] out = new double[rows];
        columns[node] = out;
        return new GaussianBlocks(out, columns, ZigguratSampler.NormalizedGaussian.of(stream));
    }

    /** One Gaussian column filled block by block: noise first, then each parent's share. */
    private final class GaussianBlocks implements BlockFiller {
        private final double[] out;
        private final double[][] in;
        private final ZigguratSampler.NormalizedGaussian eps;

        GaussianBlocks(double[] out, Object[] columns, ZigguratSampler.NormalizedGaussian eps) {
            this.out = out;
            this.eps = eps;
            this.in = new double[parents.length][];
            for (int k = 0; k < parents.length; k++) {
                in[k] = (double[]) columns[parents[k]];
            }
        }

        @Override
        public void fill(int from, int to) {
            double s = noiseScale;
            double[] o = out;
            for (int r = from; r < to; r++) {
                o[r] = s * eps.sample();
            }
            for (int k = 0; k < in.length; k++) {
                double[] x = in[k];
                double w = weights[k];
                for (int r = from; r < to; r++) {
                    o[r] += w * x[r];
                }
            }
        }
    }
}
