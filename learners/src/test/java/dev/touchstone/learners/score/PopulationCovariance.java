package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.rng.UniformRandomProvider;

/**
 * The exact covariance of a linear SEM X = BX + E with independent noise of covariance Ω:
 * Σ = (I − B)⁻¹ Ω (I − B)⁻ᵀ (common practice), computed with Commons Math. Edge weights
 * uniform on ±[low, high], noise variances uniform on [0.5, 1.5], seeded. Public for the hybrid
 * learners' oracle tests, which need the covariance of the observed variables alone.
 */
public final class PopulationCovariance {

    private PopulationCovariance() {
    }

    /**
     * The covariance over the observed variables of a DAG with hidden ones: the rows and columns of
     * the full covariance for the observed variables (a marginal of a Gaussian is the sub-matrix;
     * common practice).
     */
    public static CovarianceMatrix observed(Graph dag, double low, double high, long seed) {
        return of(dag, low, high, seed).select(dag.observedIndices());
    }

    static CovarianceMatrix of(Graph dag, double low, double high, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int p = dag.size();
        RealMatrix b = new Array2DRowRealMatrix(p, p);
        for (var e : dag.edges()) {
            int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
            int to = e.other(from);
            b.setEntry(to, from, (low + (high - low) * rng.nextDouble()) * (rng.nextBoolean() ? 1 : -1));
        }
        RealMatrix omega = new Array2DRowRealMatrix(p, p);
        for (int i = 0; i < p; i++) {
            omega.setEntry(i, i, 0.5 + rng.nextDouble());
        }
        RealMatrix inv = new LUDecomposition(MatrixUtils.createRealIdentityMatrix(p).subtract(b)).getSolver().getInverse();
        RealMatrix sigma = inv.multiply(omega).multiply(inv.transpose());
        return CovarianceMatrix.of(dag.names(), sigma.getData(), CovarianceMatrix.INFINITE_SAMPLE);
    }
}
