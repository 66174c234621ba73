package dev.touchstone.generators.models;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;

/** The two mechanisms of the conditional Gaussian model (see {@link ConditionalGaussianKind}). */
final class MixedMechanisms {

    private MixedMechanisms() {
    }

    /**
     * Continuous parents with the moments that standardise them: z_k = (x_k − mean_k) / sd_k.
     *
     * @param parents the parents' indices
     * @param mean    their centres
     * @param sd      their scales
     */
    record Standardised(int[] parents, double[] mean, double[] sd) {

        /** Parents taken as they are: centre 0, scale 1. */
        static Standardised asIs(int[] parents) {
            double[] one = new double[parents.length];
            java.util.Arrays.fill(one, 1.0);
            return new Standardised(parents, new double[parents.length], one);
        }
    }

    /**
     * The shifts of a continuous variable by category of its discrete parents.
     *
     * @param parents    the discrete parents' indices
     * @param byCategory {@code byCategory[k][c]}: the shift when parent k has category c
     */
    record Shifts(int[] parents, double[][] byCategory) {
    }

    /**
     * The base of a continuous variable: {@code intercept + scale · ε} with ε standard normal.
     *
     * @param intercept the constant
     * @param scale     the noise's standard deviation
     */
    record Noise(double intercept, double scale) {
    }

    /**
     * Log-intercepts of a discrete variable by configuration of its discrete parents.
     *
     * @param parents the discrete parents' indices
     * @param strides the stride of each parent in the configuration number (last parent fastest)
     * @param alpha   {@code alpha[config][c]}
     */
    record Intercepts(int[] parents, int[] strides, double[][] alpha) {
    }

    /**
     * Continuous: X = intercept + Σ w_k z_k + Σ shift_k[code_k] + σ ε, with z_k the continuous
     * parents centred and scaled by pilot moments (drawn models: intercept 0; models assembled
     * from fitted parameters: mean 0 and scale 1, so z_k is the parent itself); one normal draw
     * per row.
     */
    record Continuous(int node, Standardised continuous, double[] weights, Shifts discrete, Noise noise)
            implements NodeMechanism {

        @Override
        public NodeParameters describe(dev.touchstone.core.graph.Graph graph,
                                       dev.touchstone.core.data.Variable[] variables) {
            int[] continuousParents = continuous.parents();
            double[] parentMean = continuous.mean();
            double[] parentSd = continuous.sd();
            int[] discreteParents = discrete.parents();
            double[][] shifts = discrete.byCategory();
            java.util.List<NodeParameters.Slope> slopes = new java.util.ArrayList<>();
            for (int k = 0; k < continuousParents.length; k++) {
                slopes.add(new NodeParameters.Slope(graph.name(continuousParents[k]),
                        new NodeParameters.Scaling(parentMean[k], parentSd[k]), new double[] {weights[k]}));
            }
            java.util.List<NodeParameters.Shift> shiftList = new java.util.ArrayList<>();
            for (int k = 0; k < discreteParents.length; k++) {
                shiftList.add(new NodeParameters.Shift(graph.name(discreteParents[k]), shifts[k].clone()));
            }
            return new NodeParameters.ConditionalGaussian(graph.name(node), noise.intercept(), slopes, shiftList,
                    noise.scale());
        }

        @Override
        public void fill(Object[] columns, int rows, UniformRandomProvider stream) {
            int[] continuousParents = continuous.parents();
            double[] parentMean = continuous.mean();
            double[] parentSd = continuous.sd();
            int[] discreteParents = discrete.parents();
            double[][] shifts = discrete.byCategory();
            double intercept = noise.intercept();
            double noiseScale = noise.scale();
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
    record Discrete(int node, int categories, Intercepts intercepts, Standardised continuous, double[][] beta)
            implements NodeMechanism {

        @Override
        public NodeParameters describe(dev.touchstone.core.graph.Graph graph,
                                       dev.touchstone.core.data.Variable[] variables) {
            int[] continuousParents = continuous.parents();
            double[] parentMean = continuous.mean();
            double[] parentSd = continuous.sd();
            double[][] alpha = intercepts.alpha();
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
                    NodeMechanism.names(graph, intercepts.parents()), a, slopes);
        }

        @Override
        public void fill(Object[] columns, int rows, UniformRandomProvider stream) {
            int[] discreteParents = intercepts.parents();
            int[] strides = intercepts.strides();
            double[][] alpha = intercepts.alpha();
            int[] continuousParents = continuous.parents();
            double[] parentMean = continuous.mean();
            double[] parentSd = continuous.sd();
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
