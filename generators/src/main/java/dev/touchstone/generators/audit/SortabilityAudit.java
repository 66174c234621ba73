package dev.touchstone.generators.audit;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;

import java.util.BitSet;
import java.util.Locale;

/**
 * How far simple per-variable statistics of a data set already reveal the causal order,
 * as a small immutable value any report can show.
 *
 * <ul>
 * <li><b>varsortability</b> (Reisach, Seiler and Weichwald 2021, "Beware of the simulated
 *     DAG! Causal discovery benchmarks may be easy to game", NeurIPS): the fraction of
 *     directed paths along which the variance increases from cause to effect, each ordered
 *     pair counted once for every length of path joining it, ties counting one half. 1 means
 *     sorting by variance finds the order; 0.5 is what a random order scores on average.</li>
 * <li><b>R²-sortability</b> (Reisach, Tami, Seiler, Weichwald and Bühlmann 2023, "A
 *     scale-invariant sorting criterion to find a causal order in additive noise models",
 *     NeurIPS): the same fraction for R², the coefficient of determination of each variable
 *     regressed on all other observed variables. It survives standardisation.</li>
 * </ul>
 * Pairs are observed variables joined by a directed path in the full DAG (paths may pass
 * through hidden variables). Variances use each column's non-missing cells; R² uses the
 * covariance of the complete rows. Both are NaN when undefined: data not all continuous,
 * no directed path between observed variables, or a singular covariance (R² only). R² is
 * not computed for more than {@link #R2_MAX_VARIABLES} observed variables ({@link
 * #r2Skipped()}), because it needs the p × p covariance and its inverse. Cost
 * O(L · p² / 64 · p) for path counting (L the longest path) plus, for R², O(n p² + p³).
 */
public final class SortabilityAudit {

    /** Relative tolerance under which two values count as tied. */
    public static final double TIE_TOLERANCE = 1e-9;

    /**
     * The most observed variables for which R² is computed: the inverse covariance costs
     * O(p³) time and O(p²) memory (at 2,000, about 10¹⁰ operations and 32 MB per matrix).
     */
    public static final int R2_MAX_VARIABLES = 2000;

    private final double varsortability;
    private final double r2Sortability;
    private final long pathPairs;
    private final boolean r2Skipped;

    private SortabilityAudit(double varsortability, double r2Sortability, long pathPairs, boolean r2Skipped) {
        this.varsortability = varsortability;
        this.r2Sortability = r2Sortability;
        this.pathPairs = pathPairs;
        this.r2Skipped = r2Skipped;
    }

    /** The audit of {@code data} (columns matched to the DAG by name) against the true {@code dag}. */
    public static SortabilityAudit of(Graph dag, DataSet data) {
        int q = data.columns();
        int[] node = new int[q];
        for (int j = 0; j < q; j++) {
            node[j] = dag.index(data.variable(j).name());
        }
        boolean continuous = true;
        for (int j = 0; j < q; j++) {
            continuous &= !data.isDiscrete(j);
        }
        if (!continuous) {
            return new SortabilityAudit(Double.NaN, Double.NaN, countPaths(dag, node, null), false);
        }
        double[] variance = new double[q];
        boolean defined = true;
        for (int j = 0; j < q; j++) {
            variance[j] = variance(data.continuous(j));
            defined &= !Double.isNaN(variance[j]);
        }
        // One count of the paths gives both the number of pairs and the varsortability (the
        // count does not depend on the criterion, so it holds where a variance is undefined).
        double[] st = scoreAndTotal(dag, node, variance);
        long pairs = (long) st[1];
        if (pairs == 0) {
            return new SortabilityAudit(Double.NaN, Double.NaN, pairs, false);
        }
        double vs = defined ? st[0] / st[1] : Double.NaN;
        boolean skip = q > R2_MAX_VARIABLES;
        double r2 = skip ? Double.NaN : sortability(dag, node, rSquared(data.covariance()));
        return new SortabilityAudit(vs, r2, pairs, skip);
    }

    /**
     * The sortability of an arbitrary criterion: the fraction of (path length, ordered pair)
     * combinations along which the criterion increases from cause to effect (ties one half).
     *
     * @param node      the DAG index of each criterion entry
     * @param criterion one value per entry (NaN anywhere gives NaN)
     */
    public static double sortability(Graph dag, int[] node, double[] criterion) {
        for (double c : criterion) {
            if (Double.isNaN(c)) {
                return Double.NaN;
            }
        }
        double[] st = scoreAndTotal(dag, node, criterion);
        return st[1] == 0 ? Double.NaN : st[0] / st[1];
    }

    /** The score (increases count one, ties one half) and the number of (length, pair) combinations. */
    private static double[] scoreAndTotal(Graph dag, int[] node, double[] criterion) {
        double[] score = new double[2];
        long total = countPaths(dag, node, (i, j) -> {
            double a = criterion[i];
            double b = criterion[j];
            double tol = TIE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
            if (b > a + tol) {
                score[0] += 1;
            } else if (Math.abs(b - a) <= tol) {
                score[0] += 0.5;
            }
        });
        score[1] = total;
        return score;
    }

    private interface PairVisitor {
        void visit(int causeEntry, int effectEntry);
    }

    /**
     * Counts (length, pair) combinations: for k = 1, 2, … the ordered pairs of entries joined
     * by a directed path of exactly k edges, by boolean powers of the adjacency matrix.
     */
    private static long countPaths(Graph dag, int[] node, PairVisitor visitor) {
        int p = dag.size();
        int[] entryOf = new int[p];
        java.util.Arrays.fill(entryOf, -1);
        for (int j = 0; j < node.length; j++) {
            entryOf[node[j]] = j;
        }
        BitSet[] step = new BitSet[p];
        for (int v = 0; v < p; v++) {
            step[v] = new BitSet(p);
            for (int c : dag.children(v)) {
                step[v].set(c);
            }
        }
        BitSet[] reach = new BitSet[p];
        BitSet[] spare = new BitSet[p];
        for (int v = 0; v < p; v++) {
            reach[v] = (BitSet) step[v].clone();
            spare[v] = new BitSet();
        }
        long total = 0;
        for (int k = 1; k < p; k++) {
            boolean any = false;
            for (int v = 0; v < p; v++) {
                if (reach[v].isEmpty()) {
                    continue;
                }
                any = true;
                int i = entryOf[v];
                if (i < 0) {
                    continue;
                }
                for (int w = reach[v].nextSetBit(0); w >= 0; w = reach[v].nextSetBit(w + 1)) {
                    int j = entryOf[w];
                    if (j >= 0) {
                        total++;
                        if (visitor != null) {
                            visitor.visit(i, j);
                        }
                    }
                }
            }
            if (!any) {
                break;
            }
            // The sets of the step before are cleared and reused: clearing touches only the
            // words in use, where a new set per variable and step would zero p/64 words each.
            for (int v = 0; v < p; v++) {
                spare[v].clear();
                for (int w = reach[v].nextSetBit(0); w >= 0; w = reach[v].nextSetBit(w + 1)) {
                    spare[v].or(step[w]);
                }
            }
            BitSet[] swap = reach;
            reach = spare;
            spare = swap;
        }
        return total;
    }

    private static double variance(double[] x) {
        double s = 0;
        int n = 0;
        for (double v : x) {
            if (!Double.isNaN(v)) {
                s += v;
                n++;
            }
        }
        if (n < 2) {
            return Double.NaN;
        }
        double mean = s / n;
        double ss = 0;
        for (double v : x) {
            if (!Double.isNaN(v)) {
                ss += (v - mean) * (v - mean);
            }
        }
        return ss / (n - 1);
    }

    /** R² of each variable on all others: 1 − 1 / (Σ_jj (Σ⁻¹)_jj). */
    static double[] rSquared(CovarianceMatrix cov) {
        int q = cov.dimension();
        double[] out = new double[q];
        if (q == 1) {
            return out;
        }
        RealMatrix m = new Array2DRowRealMatrix(q, q);
        for (int a = 0; a < q; a++) {
            for (int b = 0; b < q; b++) {
                m.setEntry(a, b, cov.get(a, b));
            }
        }
        LUDecomposition lu = new LUDecomposition(m, 1e-12);
        if (!lu.getSolver().isNonSingular()) {
            java.util.Arrays.fill(out, Double.NaN);
            return out;
        }
        RealMatrix inv = lu.getSolver().getInverse();
        for (int j = 0; j < q; j++) {
            out[j] = 1.0 - 1.0 / (cov.get(j, j) * inv.getEntry(j, j));
        }
        return out;
    }

    /** Varsortability in [0, 1], or NaN when undefined. */
    public double varsortability() {
        return varsortability;
    }

    /** R²-sortability in [0, 1], or NaN when undefined. */
    public double r2Sortability() {
        return r2Sortability;
    }

    /** Whether R²-sortability was left out because there are more than {@link #R2_MAX_VARIABLES} variables. */
    public boolean r2Skipped() {
        return r2Skipped;
    }

    /** The number of (path length, ordered observed pair) combinations counted. */
    public long pathPairs() {
        return pathPairs;
    }

    /** Whether the audit could be computed (continuous data with at least one path). */
    public boolean isDefined() {
        return !Double.isNaN(varsortability);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof SortabilityAudit && Double.compare(((SortabilityAudit) o).varsortability, varsortability) == 0
                && Double.compare(((SortabilityAudit) o).r2Sortability, r2Sortability) == 0
                && ((SortabilityAudit) o).pathPairs == pathPairs && ((SortabilityAudit) o).r2Skipped == r2Skipped;
    }

    @Override
    public int hashCode() {
        return Double.hashCode(varsortability) * 31 + Double.hashCode(r2Sortability) * 17 + Long.hashCode(pathPairs);
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "varsortability %.3f, R2-sortability %.3f over %d path pairs",
                varsortability, r2Sortability, pathPairs);
    }
}
