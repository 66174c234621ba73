package dev.touchstone.generators.fit;

import java.util.List;

/**
 * The fitted mechanism of one variable, with the number of rows it was fitted on (the rows
 * complete for the variable and its parents). Immutable.
 */
public sealed interface FittedNode permits FittedNode.Gaussian, FittedNode.Categorical {

    /** The variable's name. */
    String name();

    /** Rows complete for the variable and all its parents, which the fit used. */
    int rows();

    /** The parents, continuous first, then discrete, in the order the parameters use. */
    List<String> parents();

    /**
     * A continuous variable: intercept + Σ weights·continuous parents + Σ shifts[k][category]
     * + Gaussian noise with standard deviation {@code noiseSd} (shift of category 0 is 0).
     *
     * @param residuals the least-squares residuals on the rows used (for diagnostics)
     * @param fitted    the fitted values on the rows used
     */
    record Gaussian(String name, int rows, double intercept, List<String> continuousParents, double[] weights,
                    List<String> discreteParents, double[][] shifts, double noiseSd, double[] residuals,
                    double[] fitted) implements FittedNode {

        @Override
        public List<String> parents() {
            List<String> out = new java.util.ArrayList<>(continuousParents);
            out.addAll(discreteParents);
            return out;
        }
    }

    /**
     * A discrete variable: log-odds of category c are {@code logIntercepts[config][c]} plus
     * Σ_k {@code slopes[c][k]}·(x_k − centre_k)/scale_k over the continuous parents; with no
     * continuous parent, {@code logIntercepts} is the log of the smoothed conditional table.
     */
    record Categorical(String name, int rows, List<String> categories, List<String> discreteParents,
                       double[][] logIntercepts, List<String> continuousParents, double[] centre, double[] scale,
                       double[][] slopes) implements FittedNode {

        @Override
        public List<String> parents() {
            List<String> out = new java.util.ArrayList<>(continuousParents);
            out.addAll(discreteParents);
            return out;
        }

        /** The conditional table P(category | configuration), when there are no continuous parents. */
        public double[][] table() {
            double[][] t = new double[logIntercepts.length][];
            for (int c = 0; c < t.length; c++) {
                t[c] = Softmax.of(logIntercepts[c]);
            }
            return t;
        }
    }
}
