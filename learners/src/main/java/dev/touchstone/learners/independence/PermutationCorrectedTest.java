package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.rng.UniformRandomProvider;
import dev.touchstone.core.random.Shuffles;

import java.util.Arrays;
import java.util.BitSet;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Fisher's z with test-wise deletion, corrected for values missing at random or not at random
 * by the permutation-based correction ("PermC") of Tu, Zhang, Ackermann, Mohan, Kjellström and
 * Zhang (2019, "Causal discovery in the presence of missing data", AISTATS, PMLR 89), as we
 * read it (from memory of the paper).
 *
 * <p>Why: deleting the rows where a variable of the test is missing conditions on its
 * missingness indicator R. When R has causes W outside the test's variables — in the
 * worst case a common effect of the two variables tested — the complete rows show a
 * dependence the population does not have, and PC keeps a spurious edge. If R depends only
 * on W (no self-masking), each test variable V keeps its conditional law V | W in the
 * complete rows. So: fit V = Wβ + ε by least squares on the rows complete for the test's
 * variables and W; draw W from the rows where W alone is observed (a sample selected on
 * fewer indicators); add residual rows of the fit, permuted jointly so their mutual
 * dependence given W is kept; test on these virtual rows. With no such W the test is plain
 * test-wise deletion.
 *
 * <p>The causes of each indicator are given (see {@link MissingnessCauses}); W is the union of
 * the causes of the indicators of the test's variables, closed under the causes of W's own
 * indicators, minus the test's variables. The permutation is seeded from the run's seed and
 * the test's variables in canonical order, so a test is a pure function of its arguments and
 * symmetric to the bit (see {@link IndependenceTest}).
 *
 * <p>Cost per corrected test O(n (|S| + 2)(|W| + 1)²) for the fits plus O(n (|S| + 2)²) for
 * the statistic. Thread-safe.
 */
public final class PermutationCorrectedTest implements IndependenceTest {

    private final double[][] columns;
    private final int rows;
    private final double alpha;
    private final int[][] causes;
    private final long seed;
    private final TestwiseFisherZTest plain;
    private final AtomicLong corrected = new AtomicLong();

    /**
     * @param data continuous data, missing cells as NaN
     * @param causes for each column, the columns that cause its missingness indicator (empty
     *     for a column without missing cells)
     * @param seed the root of the permutations' seeds
     */
    public PermutationCorrectedTest(DataSet data, double alpha, int[][] causes, long seed) {
        this.plain = new TestwiseFisherZTest(data, alpha);
        this.rows = data.rows();
        this.columns = new double[data.columns()][];
        for (int j = 0; j < columns.length; j++) {
            columns[j] = data.continuous(j);
        }
        if (causes.length != columns.length) {
            throw new IllegalArgumentException("causes given for " + causes.length + " of " + columns.length
                    + " columns");
        }
        this.alpha = alpha;
        this.causes = causes;
        this.seed = seed;
    }

    @Override
    public int variables() {
        return columns.length;
    }

    @Override
    public double alpha() {
        return alpha;
    }

    /** How many tests so far needed the correction (had a non-empty W). */
    public long correctedTests() {
        return corrected.get();
    }

    @Override
    public double pValue(int x, int y, int[] z) {
        if (x > y) {
            int t = x;
            x = y;
            y = t;
        }
        int[] tested = new int[z.length + 2];
        tested[0] = x;
        tested[1] = y;
        System.arraycopy(z, 0, tested, 2, z.length);
        int[] w = causesOutside(tested);
        if (w.length == 0) {
            return plain.pValue(x, y, z);
        }
        corrected.incrementAndGet();
        int[] all = concat(tested, w);
        int[] fitRows = completeIn(all);
        int[] sourceRows = completeIn(w);
        int q = tested.length;
        if (fitRows.length - z.length - 3 <= 0 || fitRows.length <= w.length + 1) {
            return 1.0;
        }
        double[][] design = design(w, fitRows);
        // Least squares by Householder QR (Commons Math); a singular W (collinear causes) leaves the test uncorrected.
        DecompositionSolver fit = new QRDecomposition(new Array2DRowRealMatrix(design, false), 1e-12).getSolver();
        if (!fit.isNonSingular()) {
            return plain.pValue(x, y, z);
        }
        double[][] beta = new double[q][];
        double[][] residual = new double[q][fitRows.length];
        for (int i = 0; i < q; i++) {
            double[] v = new double[fitRows.length];
            for (int r = 0; r < fitRows.length; r++) {
                v[r] = columns[tested[i]][fitRows[r]];
            }
            beta[i] = fit.solve(new ArrayRealVector(v, false)).toArray();
            for (int r = 0; r < fitRows.length; r++) {
                residual[i][r] = v[r] - dot(design[r], beta[i]);
            }
        }
        UniformRandomProvider rng = Seeds.random(Seeds.derive(seed, "missingness-correction", key(tested)));
        int m = fitRows.length;
        int[] residualOrder = Shuffles.permutation(rng, m);
        int[] sourceOrder = Shuffles.permutation(rng, sourceRows.length);
        double[][] virtual = new double[q][m];
        double[] wRow = new double[w.length + 1];
        for (int r = 0; r < m; r++) {
            int src = sourceRows[sourceOrder[r]];
            wRow[0] = 1.0;
            for (int a = 0; a < w.length; a++) {
                wRow[a + 1] = columns[w[a]][src];
            }
            for (int i = 0; i < q; i++) {
                virtual[i][r] = dot(wRow, beta[i]) + residual[i][residualOrder[r]];
            }
        }
        boolean[] keep = new boolean[m];
        Arrays.fill(keep, true);
        return TestwiseFisherZTest.pValueOnRows(virtual, keep, m);
    }

    /** W: the causes of the tested variables' indicators, closed under their own indicators' causes. */
    private int[] causesOutside(int[] tested) {
        BitSet in = new BitSet();
        for (int v : tested) {
            in.set(v);
        }
        BitSet w = new BitSet();
        int[] frontier = tested;
        while (frontier.length > 0) {
            BitSet next = new BitSet();
            for (int v : frontier) {
                for (int c : causes[v]) {
                    if (!in.get(c) && !w.get(c)) {
                        w.set(c);
                        next.set(c);
                    }
                }
            }
            frontier = next.stream().toArray();
        }
        return w.stream().toArray();
    }

    private int[] completeIn(int[] vars) {
        int[] out = new int[rows];
        int n = 0;
        for (int r = 0; r < rows; r++) {
            boolean ok = true;
            for (int i = 0; i < vars.length && ok; i++) {
                ok = !Double.isNaN(columns[vars[i]][r]);
            }
            if (ok) {
                out[n++] = r;
            }
        }
        return Arrays.copyOf(out, n);
    }

    /** Rows [1, W] of the fit, one per row of {@code at}. */
    private double[][] design(int[] w, int[] at) {
        double[][] d = new double[at.length][w.length + 1];
        for (int r = 0; r < at.length; r++) {
            d[r][0] = 1.0;
            for (int a = 0; a < w.length; a++) {
                d[r][a + 1] = columns[w[a]][at[r]];
            }
        }
        return d;
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    private static int[] concat(int[] a, int[] b) {
        int[] c = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, c, a.length, b.length);
        return c;
    }

    /** The seed key of a test: x, y and the sorted conditioning set, so the order of S does not matter. */
    private static String key(int[] tested) {
        int[] z = Arrays.copyOfRange(tested, 2, tested.length);
        Arrays.sort(z);
        return tested[0] + "," + tested[1] + "|" + Arrays.toString(z);
    }

    @Override
    public String name() {
        return "fisher-z-permutation-corrected";
    }
}
