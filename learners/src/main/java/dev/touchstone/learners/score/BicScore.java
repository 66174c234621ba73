package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;

import java.util.Arrays;
import java.util.List;

/**
 * The Bayesian information criterion (Schwarz 1978) of a linear Gaussian DAG, as a local
 * score computed from a covariance matrix:
 *
 * <pre>
 *   score(Y | P) = −n/2 · (ln(2π σ̂²) + 1) − c · (|P| + 2)/2 · ln n
 * </pre>
 *
 * where σ̂² = (n−1)/n · (Σ_YY − Σ_YP Σ_PP⁻¹ Σ_PY) is the maximum-likelihood residual
 * variance of the least-squares regression of Y on P with an intercept, and c the penalty
 * multiplier (c = 1 is the classical BIC). The first term is exactly the maximised
 * Gaussian log-likelihood of that regression; |P| + 2 counts the coefficients, the
 * intercept and the variance. Markov-equivalent DAGs have equal BIC (Chickering 1995),
 * which GES needs (Chickering 2002).
 *
 * <p><b>Oracle.</b> For an exact population covariance ({@link CovarianceMatrix#isPopulation()})
 * the score is evaluated as if from {@link #ORACLE_SAMPLE_SIZE} rows, without the
 * (n−1)/n factor. Why this is consistent: with exact moments an edge that adds no
 * information leaves σ̂² unchanged to rounding, so it only costs the penalty
 * c·ln(n)/2 ≈ 10.4 c; an edge with true partial correlation r gains n/2 · ln(1/(1−r²)),
 * which exceeds the penalty whenever r² ≳ 2·10⁻⁸. Rounding errors of σ̂² are about 10⁻¹²
 * relative on models of tens of variables, so they move the score by about 10⁻³, far
 * below the penalty. GES with this score therefore returns the true CPDAG whenever every
 * dependence of the model has a partial correlation above that floor (Chickering 2002,
 * consistency of the score in the limit).
 *
 * <p><b>Cost.</b> O(|P|³/3) for the Cholesky factor of the parent block plus O(|P|²) to
 * gather it; no allocation per call (scratch arrays are per thread). Thread-safe.
 */
public final class BicScore implements LocalScore {

    /** The row count the exact population covariance stands for (see the class comment). */
    public static final double ORACLE_SAMPLE_SIZE = 1e9;

    private static final double LOG_2PI = Math.log(2 * Math.PI);

    private final List<String> names;
    private final double[] cov;
    private final int p;
    private final double n;
    private final double varianceFactor;
    private final double penaltyPerParameter;
    private final double penaltyMultiplier;
    private final ThreadLocal<Scratch> scratch = ThreadLocal.withInitial(Scratch::new);

    private BicScore(CovarianceMatrix covariance, double penaltyMultiplier) {
        if (!(penaltyMultiplier > 0) || Double.isInfinite(penaltyMultiplier)) {
            throw new IllegalArgumentException("the BIC penalty multiplier must be positive and finite, got "
                    + penaltyMultiplier);
        }
        this.names = covariance.names();
        this.cov = covariance.toArray();
        this.p = covariance.dimension();
        if (covariance.isPopulation()) {
            this.n = ORACLE_SAMPLE_SIZE;
            this.varianceFactor = 1.0;
        } else {
            long rows = covariance.sampleSize();
            if (rows < 2) {
                throw new IllegalArgumentException("the BIC needs at least 2 complete rows, got " + rows);
            }
            this.n = rows;
            this.varianceFactor = (rows - 1.0) / rows;
        }
        for (int i = 0; i < p; i++) {
            double v = cov[i * p + i];
            if (!(v > 0) || Double.isInfinite(v)) {
                throw new IllegalArgumentException("variable '" + names.get(i) + "' has variance " + v
                        + "; the BIC needs positive finite variances");
            }
        }
        this.penaltyMultiplier = penaltyMultiplier;
        this.penaltyPerParameter = penaltyMultiplier * 0.5 * Math.log(n);
    }

    /**
     * The BIC over this covariance (sample or exact population) with penalty multiplier c.
     *
     * @throws IllegalArgumentException for c ≤ 0, fewer than 2 rows, or a non-positive variance
     */
    public static BicScore of(CovarianceMatrix covariance, double penaltyMultiplier) {
        return new BicScore(covariance, penaltyMultiplier);
    }

    @Override
    public List<String> names() {
        return names;
    }

    /** The row count the score is evaluated at ({@link #ORACLE_SAMPLE_SIZE} for the oracle). */
    public double sampleSize() {
        return n;
    }

    @Override
    public double localScore(int node, int[] parents) {
        double residual = residualVariance(node, parents);
        double mle = Math.max(residual * varianceFactor, Double.MIN_NORMAL);
        double logLikelihood = -0.5 * n * (LOG_2PI + Math.log(mle) + 1.0);
        return logLikelihood - penaltyPerParameter * (parents.length + 2);
    }

    /**
     * All single additions to one parent set S at O(|S|²) each instead of O(|S|³): with the
     * Cholesky factor L of Σ_SS (computed once), b = L⁻¹Σ_Sy and c = L⁻¹Σ_Sx, the residual
     * variance of y given S ∪ {x} is r_yy − r_xy²/r_xx with r_yy = Σ_yy − bᵀb,
     * r_xy = Σ_xy − cᵀb and r_xx = Σ_xx − cᵀc (partial covariances given S; the block form of
     * the Schur complement, Golub and Van Loan §4.2, common practice). An x that is numerically
     * a linear combination of S (r_xx below {@link SmallCholesky#RELATIVE_PIVOT_FLOOR} of Σ_xx)
     * adds nothing, as in {@link #localScore}. Equal to {@link #localScore} up to rounding.
     */
    @Override
    public void scoreAdditions(int node, int[] parents, boolean[] candidates, double[] out) {
        int k = parents.length;
        double penalty = penaltyPerParameter * (k + 3);
        double[] a = new double[Math.max(1, k * k)];
        double[] b = new double[k];
        for (int i = 0; i < k; i++) {
            int row = parents[i] * p;
            for (int j = 0; j <= i; j++) {
                a[i * k + j] = cov[row + parents[j]];
            }
            b[i] = cov[row + node];
        }
        double ryy = cov[node * p + node];
        if (k > 0) {
            SmallCholesky.factor(a, k);
            SmallCholesky.forward(a, k, b);
            for (int i = 0; i < k; i++) {
                ryy -= b[i] * b[i];
            }
        }
        // c_i[x] for all x at once, row by row of Σ: contiguous reads instead of one row per candidate
        int m = candidates.length;
        // the rows are per-thread scratch: a permutation search expands hundreds of thousands of nodes.
        // Row i depends only on parents[0..i] (and the leading block of the factor, which is computed
        // from those alone), so rows left by the previous call on this thread for a parent set with
        // the same first entries are reused as they are: the same numbers, not recomputed
        Scratch sc = scratch.get();
        double[][] c = sc.rows(k, m);
        int reused = sc.sharedPrefix(parents);
        for (int i = reused; i < k; i++) {
            double[] ci = c[i];
            System.arraycopy(cov, parents[i] * p, ci, 0, m);
            for (int j = 0; j < i; j++) {
                double lij = a[i * k + j];
                if (lij != 0) {
                    double[] cj = c[j];
                    for (int x = 0; x < m; x++) {
                        ci[x] -= lij * cj[x];
                    }
                }
            }
            double d = a[i * k + i];
            if (d == 0) {
                Arrays.fill(ci, 0);
            } else {
                double inv = 1.0 / d;
                for (int x = 0; x < m; x++) {
                    ci[x] *= inv;
                }
            }
        }
        int rowY = node * p;
        for (int x = 0; x < m; x++) {
            if (!candidates[x]) {
                continue;
            }
            double sxx = cov[x * p + x];
            double rxx = sxx;
            double rxy = cov[rowY + x];
            for (int i = 0; i < k; i++) {
                double cix = c[i][x];
                rxx -= cix * cix;
                rxy -= cix * b[i];
            }
            double residual = rxx > SmallCholesky.RELATIVE_PIVOT_FLOOR * sxx && rxx > 0 ? ryy - rxy * rxy / rxx : ryy;
            double mle = Math.max(residual * varianceFactor, Double.MIN_NORMAL);
            out[x] = -0.5 * n * (LOG_2PI + Math.log(mle) + 1.0) - penalty;
        }
    }

    /**
     * Up to 2 parents a BIC term costs less than a lookup in a large memo (about 30–80 ns
     * against 45–100 ns, LocalScoreBenchmark; docs/dev/score.md), so those are not cached.
     */
    @Override
    public boolean worthCaching(int parentCount) {
        return parentCount > 2;
    }

    /** Σ_YY − Σ_YP Σ_PP⁻¹ Σ_PY, the residual variance of Y given P under the covariance (divisor as given). */
    double residualVariance(int y, int[] parents) {
        int k = parents.length;
        double syy = cov[y * p + y];
        if (k == 0) {
            return syy;
        }
        Scratch s = scratch.get();
        double[] a = s.block(k);
        double[] b = s.vector(k);
        for (int i = 0; i < k; i++) {
            int row = parents[i] * p;
            for (int j = 0; j <= i; j++) {
                a[i * k + j] = cov[row + parents[j]];
            }
            b[i] = cov[row + y];
        }
        SmallCholesky.factor(a, k);
        SmallCholesky.forward(a, k, b);
        double explained = 0;
        for (int i = 0; i < k; i++) {
            explained += b[i] * b[i];
        }
        return syy - explained;
    }

    @Override
    public String describe() {
        return "bic(penalty=" + penaltyMultiplier + ")";
    }

    /** Per-thread work arrays, grown on demand. */
    private static final class Scratch {
        private double[] block = new double[64];
        private double[] vector = new double[8];
        private double[][] rows = new double[0][];

        double[] block(int k) {
            if (block.length < k * k) {
                block = new double[k * k];
            }
            return block;
        }

        /** The parents whose rows {@link #rows} holds, in order. */
        private int[] rowParents = new int[0];

        /**
         * At least k rows of exactly m entries, the rows of {@link #rowParents} kept; contents
         * beyond those are left over from earlier calls.
         */
        double[][] rows(int k, int m) {
            if (rows.length > 0 && rows[0].length != m) {
                rows = new double[0][];
                rowParents = new int[0];
            }
            if (rows.length < k) {
                int old = rows.length;
                rows = Arrays.copyOf(rows, Math.max(k, 2 * old));
                for (int i = old; i < rows.length; i++) {
                    rows[i] = new double[m];
                }
            }
            return rows;
        }

        /** How many leading parents the rows already hold; the rows then stand for {@code parents}. */
        int sharedPrefix(int[] parents) {
            int q = 0;
            int limit = Math.min(rowParents.length, parents.length);
            while (q < limit && rowParents[q] == parents[q]) {
                q++;
            }
            rowParents = parents.clone();
            return q;
        }

        double[] vector(int k) {
            if (vector.length < k) {
                vector = new double[k];
            }
            return vector;
        }
    }
}
