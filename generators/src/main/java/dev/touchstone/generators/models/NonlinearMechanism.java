package dev.touchstone.generators.models;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/**
 * X_v = (f(z) − c) / s + σ ε, with z the parents centred and scaled by their pilot moments,
 * c and s the pilot mean and standard deviation of f, and ε standard normal (one draw per row).
 */
final class NonlinearMechanism implements NodeMechanism {

    private final int node;
    private final int[] parents;
    private final double[] parentMean;
    private final double[] parentSd;
    private final NodeFunction function;
    private final double functionMean;
    private final double functionSd;
    private final double noiseScale;

    NonlinearMechanism(int node, int[] parents, double[] parentMean, double[] parentSd, NodeFunction function,
                       double functionMean, double functionSd, double noiseScale) {
        this.node = node;
        this.parents = parents;
        this.parentMean = parentMean;
        this.parentSd = parentSd;
        this.function = function;
        this.functionMean = functionMean;
        this.functionSd = functionSd;
        this.noiseScale = noiseScale;
    }

    @Override
    public NodeParameters describe(dev.touchstone.core.graph.Graph graph, dev.touchstone.core.data.Variable[] variables) {
        java.util.List<NodeParameters.Input> inputs = new java.util.ArrayList<>();
        for (int k = 0; k < parents.length; k++) {
            inputs.add(new NodeParameters.Input(graph.name(parents[k]),
                    new NodeParameters.Scaling(parentMean[k], parentSd[k])));
        }
        return new NodeParameters.Additive(graph.name(node), inputs, function,
                new NodeParameters.Scaling(functionMean, functionSd), noiseScale);
    }

    /** The same mechanism with f rescaled by these moments. */
    NonlinearMechanism normalised(double mean, double sd) {
        return new NonlinearMechanism(node, parents, parentMean, parentSd, function, mean, sd > 0 ? sd : 1.0,
                noiseScale);
    }

    /** Just f(z) for every row, without noise. */
    double[] signal(Object[] columns, int rows) {
        double[] out = new double[rows];
        double[][] in = new double[parents.length][];
        for (int k = 0; k < parents.length; k++) {
            in[k] = (double[]) columns[parents[k]];
        }
        double[] z = new double[parents.length];
        for (int r = 0; r < rows; r++) {
            for (int k = 0; k < z.length; k++) {
                z[k] = (in[k][r] - parentMean[k]) / parentSd[k];
            }
            out[r] = function.apply(z);
        }
        return out;
    }

    @Override
    public void fill(Object[] columns, int rows, UniformRandomProvider stream) {
        ZigguratSampler.NormalizedGaussian eps = ZigguratSampler.NormalizedGaussian.of(stream);
        double[] out;
        if (parents.length == 0) {
            out = new double[rows];
        } else {
            out = signal(columns, rows);
            double inv = 1.0 / functionSd;
            for (int r = 0; r < rows; r++) {
                out[r] = (out[r] - functionMean) * inv;
            }
        }
        for (int r = 0; r < rows; r++) {
            out[r] += noiseScale * eps.sample();
        }
        columns[node] = out;
    }
}
