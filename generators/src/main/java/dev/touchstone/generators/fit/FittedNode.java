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
     * @param mean  the fitted mean given the parents
     * @param onRows the fit on the rows used (for diagnostics)
     */
    record Gaussian(String name, int rows, Mean mean, double noiseSd, OnRows onRows) implements FittedNode {

        /**
         * The mean given the parents: an intercept, one weight per continuous parent and one
         * shift per category of each discrete parent.
         */
        public record Mean(double intercept, List<String> continuousParents, double[] weights,
                           List<String> discreteParents, double[][] shifts) {

            /** The same parents and intercept with other weights and shifts. */
            public Mean with(double[] otherWeights, double[][] otherShifts) {
                return new Mean(intercept, continuousParents, otherWeights, discreteParents, otherShifts);
            }
        }

        /**
         * The least-squares fit on the rows used.
         *
         * @param residuals the residuals
         * @param fitted    the fitted values
         */
        public record OnRows(double[] residuals, double[] fitted) {
        }

        /** The intercept. */
        public double intercept() {
            return mean.intercept();
        }

        /** The continuous parents, in the order of {@link #weights()}. */
        public List<String> continuousParents() {
            return mean.continuousParents();
        }

        /** One weight per continuous parent. */
        public double[] weights() {
            return mean.weights();
        }

        /** The discrete parents, in the order of {@link #shifts()}. */
        public List<String> discreteParents() {
            return mean.discreteParents();
        }

        /** Per discrete parent, the shift of each category (0 for category 0). */
        public double[][] shifts() {
            return mean.shifts();
        }

        /** The least-squares residuals on the rows used. */
        public double[] residuals() {
            return onRows.residuals();
        }

        /** The fitted values on the rows used. */
        public double[] fitted() {
            return onRows.fitted();
        }

        @Override
        public List<String> parents() {
            return FittedNode.parents(continuousParents(), discreteParents());
        }
    }

    /**
     * A discrete variable: log-odds of category c are {@code logIntercepts[config][c]} plus
     * Σ_k {@code slopes[c][k]}·(x_k − centre_k)/scale_k over the continuous parents; with no
     * continuous parent, {@code logIntercepts} is the log of the smoothed conditional table.
     *
     * @param intercepts the log-intercepts by configuration of the discrete parents
     * @param effects    the slopes of the standardised continuous parents
     */
    record Categorical(String name, int rows, List<String> categories, Intercepts intercepts, Effects effects)
            implements FittedNode {

        /**
         * Log-intercepts: {@code logIntercepts[config][c]} for each configuration of the
         * discrete parents (last parent fastest) and category c.
         */
        public record Intercepts(List<String> discreteParents, double[][] logIntercepts) {
        }

        /**
         * Slopes of the continuous parents, standardised by {@code centre} and {@code scale}:
         * {@code slopes[c][k]} for category c and parent k.
         */
        public record Effects(List<String> continuousParents, double[] centre, double[] scale, double[][] slopes) {

            /** No continuous parent: an empty slope row for each of {@code categories}. */
            public static Effects none(int categories) {
                return new Effects(List.of(), new double[0], new double[0], new double[categories][0]);
            }
        }

        /** The discrete parents, in the order of the configurations. */
        public List<String> discreteParents() {
            return intercepts.discreteParents();
        }

        /** {@code logIntercepts[config][c]}. */
        public double[][] logIntercepts() {
            return intercepts.logIntercepts();
        }

        /** The continuous parents, in the order of the slopes' columns. */
        public List<String> continuousParents() {
            return effects.continuousParents();
        }

        /** The centre of each continuous parent. */
        public double[] centre() {
            return effects.centre();
        }

        /** The scale of each continuous parent. */
        public double[] scale() {
            return effects.scale();
        }

        /** {@code slopes[c][k]}: category c, continuous parent k. */
        public double[][] slopes() {
            return effects.slopes();
        }

        @Override
        public List<String> parents() {
            return FittedNode.parents(continuousParents(), discreteParents());
        }

        /** The conditional table P(category | configuration), when there are no continuous parents. */
        public double[][] table() {
            double[][] t = new double[logIntercepts().length][];
            for (int c = 0; c < t.length; c++) {
                t[c] = Softmax.of(logIntercepts()[c]);
            }
            return t;
        }
    }

    private static List<String> parents(List<String> continuous, List<String> discrete) {
        List<String> out = new java.util.ArrayList<>(continuous);
        out.addAll(discrete);
        return out;
    }
}
