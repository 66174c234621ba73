package dev.touchstone.learners.baseline;

import dev.touchstone.core.data.CovarianceMatrix;

/**
 * Sorts variables by increasing marginal variance, then sparse regression
 * ("sortnregress", Reisach, Seiler and Weichwald 2021). On raw linear Gaussian data with
 * large edge weights variance grows along the causal order, so this baseline looks good;
 * on standardised data it falls to chance.
 */
public final class VarianceSortLearner extends SortAndRegress {

    public VarianceSortLearner() {
        super("variance-sort-regress",
                "sorts variables by variance, then keeps the non-zero coefficients of a sparse regression on all"
                        + " earlier variables",
                "Reisach, Seiler and Weichwald (2021), Beware of the simulated DAG! Causal discovery benchmarks may"
                        + " be easy to game, NeurIPS",
                "variance increases along the causal order (a scale artefact of many simulations)");
    }

    @Override
    int[] order(CovarianceMatrix cov) {
        double[] var = new double[cov.dimension()];
        for (int i = 0; i < var.length; i++) {
            var[i] = cov.get(i, i);
        }
        return ascending(var);
    }
}
