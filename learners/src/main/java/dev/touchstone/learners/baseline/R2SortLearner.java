package dev.touchstone.learners.baseline;

import dev.touchstone.core.data.CovarianceMatrix;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * Sorts variables by increasing R² of each variable regressed on all others, then sparse
 * regression ("R²-SortnRegress", Reisach et al. 2023, "A scale-invariant sorting
 * criterion to find a causal order in additive noise models", NeurIPS). Unlike variance,
 * R² does not change when variables are rescaled, so this baseline also exposes
 * simulations whose standardised data still leak the causal order.
 *
 * <p>R²ⱼ = 1 − 1 / (Σⱼⱼ (Σ⁻¹)ⱼⱼ), from one inverse of the covariance (common practice).
 */
public final class R2SortLearner extends SortAndRegress {

    public R2SortLearner() {
        super("r2-sort-regress",
                "sorts variables by the R² of regressing each on all others, then keeps the non-zero coefficients"
                        + " of a sparse regression on all earlier variables",
                "Reisach et al. (2023), A scale-invariant sorting criterion to find a causal"
                        + " order in additive noise models, NeurIPS",
                "the share of explained variance increases along the causal order (an artefact of many simulations)");
    }

    @Override
    int[] order(CovarianceMatrix cov) {
        return ascending(r2(cov));
    }

    /** The R² of each variable regressed on all others. */
    static double[] r2(CovarianceMatrix cov) {
        int p = cov.dimension();
        double[][] m = new double[p][p];
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                m[i][j] = cov.get(i, j);
            }
        }
        RealMatrix s = new Array2DRowRealMatrix(m, false);
        LUDecomposition lu = new LUDecomposition(s);
        RealMatrix inv = lu.getSolver().isNonSingular() ? lu.getSolver().getInverse()
                : new SingularValueDecomposition(s).getSolver().getInverse();
        double[] out = new double[p];
        for (int j = 0; j < p; j++) {
            out[j] = 1 - 1 / (m[j][j] * inv.getEntry(j, j));
        }
        return out;
    }
}
