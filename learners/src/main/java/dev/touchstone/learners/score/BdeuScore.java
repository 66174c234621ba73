package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import org.apache.commons.math3.special.Gamma;

import java.util.Arrays;
import java.util.List;

/**
 * The BDeu score of a discrete DAG (Heckerman, Geiger and Chickering 1995, "Learning
 * Bayesian networks: the combination of knowledge and statistical data", Machine
 * Learning 20, eq. 28 with the uniform prior network): the log marginal likelihood under
 * Dirichlet priors with equivalent sample size α spread evenly over the cells,
 *
 * <pre>
 *   score(Y | P) = Σ_j [ lnΓ(α/q) − lnΓ(α/q + N_j) ] + Σ_j Σ_k [ lnΓ(α/(q r) + N_jk) − lnΓ(α/(q r)) ]
 * </pre>
 *
 * with r the number of categories of Y, q the number of configurations of P, N_jk the
 * count of rows with parent configuration j and Y = k, and N_j = Σ_k N_jk. Configurations
 * never observed contribute 0, so only observed ones are visited. The structure prior is
 * uniform (contributes nothing). Markov-equivalent DAGs get equal scores (ibid., theorem 6).
 *
 * <p>Rows with a missing cell anywhere are left out when the score is built (list-wise
 * deletion). <b>Cost</b> O(n |P|) per call with a dense count table when q r is small, and
 * O(n log n) by sorting configuration keys otherwise; scratch arrays are per thread.
 * Thread-safe.
 */
public final class BdeuScore implements LocalScore {

    private static final int DENSE_LIMIT = 1 << 16;

    private final List<String> names;
    private final int[][] codes;
    private final int[] cardinality;
    private final int rows;
    private final double ess;
    private final ThreadLocal<Scratch> scratch;

    private BdeuScore(DataSet complete, double ess) {
        this.names = complete.names();
        int p = complete.columns();
        this.codes = new int[p][];
        this.cardinality = new int[p];
        for (int j = 0; j < p; j++) {
            if (!complete.isDiscrete(j)) {
                throw new IllegalArgumentException("BDeu needs discrete variables; '" + names.get(j) + "' is continuous");
            }
            codes[j] = complete.discrete(j);
            cardinality[j] = complete.variable(j).cardinality();
        }
        this.rows = complete.rows();
        this.ess = ess;
        this.scratch = ThreadLocal.withInitial(() -> new Scratch(rows));
    }

    /**
     * The BDeu score of these discrete data with equivalent sample size {@code ess}.
     *
     * @throws IllegalArgumentException for a continuous column or ess ≤ 0
     */
    public static BdeuScore of(DataSet data, double equivalentSampleSize) {
        if (!(equivalentSampleSize > 0) || Double.isInfinite(equivalentSampleSize)) {
            throw new IllegalArgumentException("the BDeu equivalent sample size must be positive and finite, got "
                    + equivalentSampleSize);
        }
        return new BdeuScore(data.completeCases(), equivalentSampleSize);
    }

    @Override
    public List<String> names() {
        return names;
    }

    @Override
    public double localScore(int node, int[] parents) {
        int r = cardinality[node];
        double q = 1;
        for (int pa : parents) {
            q *= cardinality[pa];
        }
        double aj = ess / q;
        double ajk = ess / (q * r);
        double lgAj = Gamma.logGamma(aj);
        double lgAjk = Gamma.logGamma(ajk);
        int[] y = codes[node];
        Scratch s = scratch.get();
        double score = 0;
        if (q * r <= DENSE_LIMIT) {
            int cells = (int) q * r;
            int[] counts = s.counts(cells);
            Arrays.fill(counts, 0, cells, 0);
            for (int row = 0; row < rows; row++) {
                int j = 0;
                for (int pa : parents) {
                    j = j * cardinality[pa] + codes[pa][row];
                }
                counts[j * r + y[row]]++;
            }
            for (int j = 0; j < (int) q; j++) {
                int nj = 0;
                for (int k = 0; k < r; k++) {
                    int njk = counts[j * r + k];
                    if (njk > 0) {
                        nj += njk;
                        score += Gamma.logGamma(ajk + njk) - lgAjk;
                    }
                }
                if (nj > 0) {
                    score += lgAj - Gamma.logGamma(aj + nj);
                }
            }
            return score;
        }
        long[] keys = s.keys;
        for (int row = 0; row < rows; row++) {
            long j = 0;
            for (int pa : parents) {
                j = j * cardinality[pa] + codes[pa][row];
            }
            keys[row] = j * r + y[row];
        }
        Arrays.sort(keys, 0, rows);
        int i = 0;
        while (i < rows) {
            long config = keys[i] / r;
            int nj = 0;
            while (i < rows && keys[i] / r == config) {
                long cell = keys[i];
                int njk = 0;
                while (i < rows && keys[i] == cell) {
                    njk++;
                    i++;
                }
                nj += njk;
                score += Gamma.logGamma(ajk + njk) - lgAjk;
            }
            score += lgAj - Gamma.logGamma(aj + nj);
        }
        return score;
    }

    @Override
    public String describe() {
        return "bdeu(ess=" + ess + ")";
    }

    private static final class Scratch {
        private int[] counts = new int[256];
        private final long[] keys;

        Scratch(int rows) {
            this.keys = new long[rows];
        }

        int[] counts(int cells) {
            if (counts.length < cells) {
                counts = new int[cells];
            }
            return counts;
        }
    }
}
