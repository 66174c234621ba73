package dev.touchstone.generators.models;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/** The two mechanisms of the conditional Gaussian model (see {@link ConditionalGaussianKind}). */
final class MixedMechanisms {

    private MixedMechanisms() {
    }

    /**
     * Continuous: X = intercept + Σ w_k z_k + Σ shift_k[code_k] + σ ε, with z_k the continuous
     * parents centred and scaled by pilot moments (drawn models: intercept 0; models assembled
     * from fitted parameters: mean 0 and scale 1, so z_k is the parent itself); one normal draw
     * per row.
     */
    record Continuous(int node, int[] continuousParents, double[] parentMean, double[] parentSd, double[] weights,
                      int[] discreteParents, double[][] shifts, double noiseScale, double intercept)
            implements NodeMechanism {

        @Override
        public NodeParameters describe(dev.touchstone.core.graph.Graph graph,
                                       dev.touchstone.core.data.Variable[] variables) {
            java.util.List<NodeParameters.Slope> slopes = new java.util.ArrayList<>();
            for (int k = 0; k < continuousParents.length; k++) {
                slopes.add(new NodeParameters.Slope(graph.name(continuousParents[k]),
                        new NodeParameters.Scaling(parentMean[k], parentSd[k]), new double[] {weights[k]}));
            }
            java.util.List<NodeParameters.Shift> shiftList = new java.util.ArrayList<>();
            for (int k = 0; k < discreteParents.length; k++) {
                shiftList.add(new NodeParameters.Shift(graph.name(discreteParents[k]), shifts[k].clone()));
            }
            return new NodeParameters.ConditionalGaussian(graph.name(node), intercept, slopes, shiftList, noiseScale);
        }

        @Override
        public void fill(Object[] columns, int rows, UniformRandomProvider stream) {
            ZigguratSampler.NormalizedGaussian eps = ZigguratSampler.NormalizedGaussian.of(stream);
            double[] out = new double[rows];
            for (int r = 0; r < rows; r++) {
                out[r] = intercept + noiseScale * eps.sample();
            }
            for (int k = 0; k < continuousParents.length; k++) {
                double[] x = (double[]) columns[continuousParents[k]];
                double w = weights[k] / parentSd[k];
                double m = parentMean[k];
                for (int r = 0; r < rows; r++) {
                    out[r] += w * (x[r] - m);
                }
            }
            for (int k = 0; k < discreteParents.length; k++) {
                int[] c = (int[]) columns[discreteParents[k]];
                double[] s = shifts[k];
                for (int r = 0; r < rows; r++) {
                    out[r] += s[c[r]];
                }
            }
            columns[node] = out;
        }
    }

    /**
     * Discrete, multinomial logistic: log-odds_c = α[config][c] + Σ_k β[c][k] z_k over the
     * continuous parents (β[0] = 0, the reference category); one uniform draw per row.
     */
    record Discrete(int node, int categories, int[] discreteParents, int[] strides, double[][] alpha,
                    int[] continuousParents, double[] parentMean, double[] parentSd, double[][] beta)
            implements NodeMechanism {

        @Override
        public NodeParameters describe(dev.touchstone.core.graph.Graph graph,
                                       dev.touchstone.core.data.Variable[] variables) {
            java.util.List<NodeParameters.Slope> slopes = new java.util.ArrayList<>();
            for (int k = 0; k < continuousParents.length; k++) {
                double[] byCategory = new double[categories];
                for (int c = 0; c < categories; c++) {
                    byCategory[c] = beta[c][k];
                }
                slopes.add(new NodeParameters.Slope(graph.name(continuousParents[k]),
                        new NodeParameters.Scaling(parentMean[k], parentSd[k]), byCategory));
            }
            double[][] a = new double[alpha.length][];
            for (int r = 0; r < a.length; r++) {
                a[r] = alpha[r].clone();
            }
            return new NodeParameters.Logistic(graph.name(node), variables[node].categories(),
                    NodeMechanism.names(graph, discreteParents), a, slopes);
        }

        @Override
        public void fill(Object[] columns, int rows, UniformRandomProvider stream) {
            int[] out = new int[rows];
            int[][] dis = new int[discreteParents.length][];
            for (int k = 0; k < dis.length; k++) {
                dis[k] = (int[]) columns[discreteParents[k]];
            }
            double[][] con = new double[continuousParents.length][];
            for (int k = 0; k < con.length; k++) {
                con[k] = (double[]) columns[continuousParents[k]];
            }
            double[] eta = new double[categories];
            double[] z = new double[con.length];
            for (int r = 0; r < rows; r++) {
                int config = 0;
                for (int k = 0; k < dis.length; k++) {
                    config += dis[k][r] * strides[k];
                }
                for (int k = 0; k < z.length; k++) {
                    z[k] = (con[k][r] - parentMean[k]) / parentSd[k];
                }
                double max = Double.NEGATIVE_INFINITY;
                for (int c = 0; c < categories; c++) {
                    double e = alpha[config][c];
                    for (int k = 0; k < z.length; k++) {
                        e += beta[c][k] * z[k];
                    }
                    eta[c] = e;
                    max = Math.max(max, e);
                }
                double total = 0;
                for (int c = 0; c < categories; c++) {
                    eta[c] = Math.exp(eta[c] - max);
                    total += eta[c];
                }
                double u = stream.nextDouble() * total;
                int c = 0;
                double acc = eta[0];
                while (c < categories - 1 && u >= acc) {
                    c++;
                    acc += eta[c];
                }
                out[r] = c;
            }
            columns[node] = out;
        }
    }
}
