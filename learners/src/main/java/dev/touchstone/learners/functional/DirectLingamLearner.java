package dev.touchstone.learners.functional;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.Worded;
import dev.touchstone.learners.regression.AdaptiveLasso;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;

import java.util.Arrays;

/**
 * DirectLiNGAM (Shimizu et al. 2011, "DirectLiNGAM: a direct method for learning a linear
 * non-Gaussian structural equation model", JMLR 12): finds a causal order by repeatedly
 * taking the most exogenous remaining variable and regressing it out of the others, then
 * keeps the parents each variable needs among its predecessors.
 *
 * <p><b>Exogeneity measure.</b> The original paper measures independence of a variable and
 * the residuals by kernel mutual information. Here, as proposed by Hyvärinen and Smith
 * (2013, JMLR 14, Section 5), the measure is kernel-free: the candidate x_i minimising
 * Σ_j min(0, R(x_i → x_j))², with R the pairwise likelihood ratio of
 * {@link PairwiseLikelihoodRatio} on standardised variables, is taken as next in the order.
 *
 * <p><b>Pruning.</b> Either (default) an adaptive Lasso with its penalty chosen by BIC on
 * each variable's predecessors ({@link AdaptiveLasso}; the original paper suggests the
 * adaptive Lasso of Zou 2006), or ordinary least squares on the predecessors with a fixed
 * threshold on the absolute coefficients.
 *
 * <p>The pairs of each step are spread over {@link RunContext#threads()}; the result does
 * not depend on the thread count.
 *
 * <p>Cost: O(p³ n) for the order (each of the p steps evaluates all O(p²) pairs of the
 * remaining variables at O(n) each) plus the pruning regressions, O(p⁴) at worst from the
 * covariance.
 */
public final class DirectLingamLearner extends DeclaredLearner {

    public static final String ID = "direct-lingam";

    /** How weak edges are removed once the order is known. */
    enum Pruning implements Worded {
        /** The adaptive Lasso with its penalty chosen by BIC, on the predecessors. */
        ADAPTIVE_LASSO_BIC,
        /** Least squares on the predecessors, then a threshold on the coefficients. */
        WEIGHT_THRESHOLD
    }

    static final Parameter<Pruning> PRUNING = Parameter.choice("pruning", Pruning.ADAPTIVE_LASSO_BIC,
            "how weak edges are removed once the order is known: adaptive Lasso with BIC on the predecessors,"
                    + " or least squares on the predecessors with a coefficient threshold");
    static final Parameter<Double> WEIGHT_THRESHOLD = Parameter.real("weight_threshold", 0.1, 0.0,
            Double.POSITIVE_INFINITY,
            "with pruning = weight-threshold: keep an edge when its least-squares coefficient exceeds this in"
                    + " absolute value");

    private static final LearnerDescription DESCRIPTION = FunctionalLearners.describe(ID,
                    "finds a causal order by the pairwise likelihood-ratio measure of non-Gaussianity, then prunes"
                            + " each variable's regression on its predecessors",
                    "Shimizu et al. (2011), DirectLiNGAM: a direct method for learning a linear non-Gaussian"
                            + " structural equation model, JMLR 12; measure of Hyvärinen and Smith (2013), JMLR 14")
            .assumption("linear structural equations")
            .assumption("independent non-Gaussian noise (at most one Gaussian noise term)")
            .assumption(FunctionalLearners.ACYCLIC)
            .parameter(PRUNING)
            .parameter(WEIGHT_THRESHOLD)
            .build();

    public DirectLingamLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        RunContext context = run.context();
        DataSet data = data(run, 3);
        int[] order = causalOrder(data, context);
        CovarianceMatrix cov = data.covariance();
        int p = cov.dimension();
        double[] s = cov.toArray();
        boolean lasso = run.get(PRUNING) == Pruning.ADAPTIVE_LASSO_BIC;
        double threshold = run.get(WEIGHT_THRESHOLD);
        MutableGraph g = Graph.builder(run.names());
        for (int k = 1; k < p; k++) {
            context.checkDeadline();
            int target = order[k];
            int[] candidates = Arrays.copyOf(order, k);
            double[] beta = lasso
                    ? AdaptiveLasso.fit(s, p, Math.max(cov.sampleSize(), 2), target, candidates)
                    : leastSquares(s, p, target, candidates);
            for (int a = 0; a < k; a++) {
                boolean keep = lasso ? beta[a] != 0 : Math.abs(beta[a]) > threshold;
                if (keep) {
                    g.addDirected(candidates[a], target);
                }
            }
        }
        return Estimate.of(g.freeze(), GraphClass.DAG);
    }

    /**
     * The estimated causal order (first = most exogenous) of the data's columns.
     * Ties are broken by column index so the result is deterministic.
     */
    static int[] causalOrder(DataSet data, RunContext context) {
        int p = data.columns();
        int n = data.rows();
        double[][] x = new double[p][];
        for (int j = 0; j < p; j++) {
            x[j] = data.continuous(j).clone();
            standardise(x[j]);
        }
        int[] remaining = new int[p];
        for (int j = 0; j < p; j++) {
            remaining[j] = j;
        }
        int left = p;
        int[] order = new int[p];
        double[] entropy = new double[p];
        double[] penalty = new double[p];
        for (int step = 0; step < p; step++) {
            context.checkDeadline();
            if (left == 1) {
                order[step] = remaining[0];
                break;
            }
            for (int a = 0; a < left; a++) {
                int i = remaining[a];
                entropy[i] = PairwiseLikelihoodRatio.entropy(x[i]);
                penalty[i] = 0;
            }
            double[][] ratio = pairRatios(x, remaining, left, entropy, context);
            for (int a = 0; a < left; a++) {
                int i = remaining[a];
                for (int b = a + 1; b < left; b++) {
                    int j = remaining[b];
                    double r = ratio[a][b];
                    // R(i → j) < 0 is evidence against i being exogenous, R(j → i) = −r against j.
                    if (r < 0) {
                        penalty[i] += r * r;
                    } else {
                        penalty[j] += r * r;
                    }
                }
            }
            int best = 0;
            for (int a = 1; a < left; a++) {
                int i = remaining[a];
                int current = remaining[best];
                if (penalty[i] < penalty[current] || (penalty[i] == penalty[current] && i < current)) {
                    best = a;
                }
            }
            int m = remaining[best];
            order[step] = m;
            System.arraycopy(remaining, best + 1, remaining, best, left - best - 1);
            left--;
            for (int a = 0; a < left; a++) {
                double[] xi = x[remaining[a]];
                double[] xm = x[m];
                double c = 0;
                for (int r = 0; r < n; r++) {
                    c += xi[r] * xm[r];
                }
                c /= n; // x_m is standardised, so this is the regression coefficient
                for (int r = 0; r < n; r++) {
                    xi[r] -= c * xm[r];
                }
                standardise(xi);
            }
        }
        return order;
    }

    /**
     * R(x_a → x_b) for all remaining pairs a < b (positions in {@code remaining}), spread
     * over the run's threads by rows; every entry is computed alone, so the result does not
     * depend on the thread count.
     */
    private static double[][] pairRatios(double[][] x, int[] remaining, int left, double[] entropy,
                                         RunContext context) {
        double[][] ratio = new double[left][left];
        // Row a has left − a − 1 pairs: one row per chunk keeps the threads evenly loaded.
        dev.touchstone.core.learner.ParallelLoop.run(context.threads(), left, 1, () -> a -> {
            context.checkDeadline();
            int i = remaining[a];
            for (int b = a + 1; b < left; b++) {
                int j = remaining[b];
                ratio[a][b] = PairwiseLikelihoodRatio.ratio(x[i], x[j], entropy[i], entropy[j]);
            }
        });
        return ratio;
    }

    /** Centres and scales to variance 1 (divisor n); a constant column is left at 0. */
    static void standardise(double[] v) {
        int n = v.length;
        double mean = 0;
        for (double d : v) {
            mean += d;
        }
        mean /= n;
        double ss = 0;
        for (int r = 0; r < n; r++) {
            v[r] -= mean;
            ss += v[r] * v[r];
        }
        double sd = Math.sqrt(ss / n);
        if (sd <= 1e-12) {
            Arrays.fill(v, 0);
            return;
        }
        for (int r = 0; r < n; r++) {
            v[r] /= sd;
        }
    }

    private static double[] leastSquares(double[] cov, int p, int target, int[] candidates) {
        int q = candidates.length;
        double[][] sxx = new double[q][q];
        double[] sxy = new double[q];
        for (int a = 0; a < q; a++) {
            sxy[a] = cov[candidates[a] * p + target];
            for (int b = 0; b < q; b++) {
                sxx[a][b] = cov[candidates[a] * p + candidates[b]];
            }
        }
        RealMatrix m = new Array2DRowRealMatrix(sxx, false);
        // SVD gives the minimum-norm solution when predecessors are collinear.
        return new SingularValueDecomposition(m).getSolver().solve(new ArrayRealVector(sxy, false)).toArray();
    }
}
