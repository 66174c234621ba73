package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;

import java.util.Arrays;

/**
 * The shared arithmetic of the kernel tests (HSIC, KCI, RCIT): standardising columns, the
 * median heuristic for Gaussian kernel widths, pivoted incomplete Cholesky factors of
 * Gaussian kernel matrices, centring, and small Cholesky solves.
 *
 * <p>Point sets are column-major, {@code double[d][n]} (d coordinates of n points), which is
 * how a data set stores its variables.
 *
 * <p><b>Median heuristic (the rule used throughout).</b> Every coordinate is first
 * standardised to mean 0 and standard deviation 1 (divisor n). The width σ of the Gaussian
 * kernel k(u, v) = exp(−‖u − v‖² / (2σ²)) is the median of the Euclidean distances
 * ‖u_i − u_j‖ over all pairs i &lt; j of the first min(n, {@value #MEDIAN_ROWS}) points,
 * pairs at distance 0 left out (the median of an even count is the mean of the two middle
 * values); when every such distance is 0, σ = 1. Using the median distance as the width is
 * common practice for kernel tests (Gretton et al. 2008, NIPS, Section 4, use it for HSIC).
 *
 * <p><b>Incomplete Cholesky.</b> The pivoted incomplete Cholesky factorisation of a kernel
 * matrix K ≈ G Gᵀ (Fine and Scheinberg 2001, JMLR 2; Bach and Jordan 2002, JMLR 3,
 * Section 5.2) picks at each step the point with the largest remaining diagonal, and stops
 * when that diagonal is at most {@value #CHOLESKY_TOLERANCE} or the rank reaches the cap;
 * its cost is O(n r²) for rank r, and the residual K − G Gᵀ is positive semi-definite with
 * trace at most n times the last pivot.
 *
 * <p>Public for the functional learners' kernel regressions; not a general matrix library.
 */
public final class KernelAlgebra {

    /** Points the median heuristic looks at. */
    public static final int MEDIAN_ROWS = 500;
    /** Largest remaining diagonal at which the incomplete Cholesky factorisation stops. */
    public static final double CHOLESKY_TOLERANCE = 1e-6;
    /** Rows per block of {@link #symmetricCrossProduct}: 100 columns of 1,024 doubles fill about 800 KB. */
    static final int PRODUCT_BLOCK = 1024;

    private KernelAlgebra() {
    }

    /** A standardised copy (mean 0, sd 1 with divisor n) of {@code values} at {@code rows}; a constant column becomes 0. */
    public static double[] standardised(double[] values, int[] rows) {
        return standardisedCopy(values, rows, rows.length);
    }

    /** Standardised copies (as {@link #standardised(double[], int[])}) of every column of {@code columns}, all rows. */
    public static double[][] standardised(double[][] columns) {
        double[][] s = new double[columns.length][];
        for (int d = 0; d < columns.length; d++) {
            s[d] = standardisedCopy(columns[d], null, columns[d].length);
        }
        return s;
    }

    /** Standardised copies (as {@link #standardised(double[], int[])}) of every column of {@code columns} at {@code rows}. */
    public static double[][] standardised(double[][] columns, int[] rows) {
        double[][] s = new double[columns.length][];
        for (int d = 0; d < columns.length; d++) {
            s[d] = standardisedCopy(columns[d], rows, rows.length);
        }
        return s;
    }

    /**
     * Standardised copies of the continuous columns {@code vars} of {@code data} at
     * {@code rows}. When the rows are all of the data's, each column's copy is made once per
     * data set and shared through {@link DataSet#shared} (read-only: callers must not write to
     * it), since the kernel tests of a PC run standardise the same columns for every test.
     */
    static double[][] standardised(DataSet data, int[] rows, int[] vars) {
        boolean allRows = rows.length == data.rows(); // usable rows are sorted and distinct: all of them, in order
        double[][] u = new double[vars.length][];
        for (int k = 0; k < vars.length; k++) {
            int v = vars[k];
            u[k] = allRows ? data.shared(new StandardisedKey(v), d -> standardised(d.continuous(v), rows))
                    : standardised(data.continuous(v), rows);
        }
        return u;
    }

    /** The key of a shared standardised column. */
    private record StandardisedKey(int column) {
    }

    /** The one standardisation rule of the kernel tests and regressions: {@code rows} null means the first n. */
    private static double[] standardisedCopy(double[] values, int[] rows, int n) {
        double[] v = rows == null ? Arrays.copyOf(values, n) : new double[n];
        double mean = 0;
        for (int r = 0; r < n; r++) {
            if (rows != null) {
                v[r] = values[rows[r]];
            }
            mean += v[r];
        }
        mean /= n;
        double ss = 0;
        for (int r = 0; r < n; r++) {
            v[r] -= mean;
            ss += v[r] * v[r];
        }
        double sd = Math.sqrt(ss / n);
        if (!(sd > 1e-12)) {
            Arrays.fill(v, 0);
            return v;
        }
        for (int r = 0; r < n; r++) {
            v[r] /= sd;
        }
        return v;
    }

    /** The width σ by the median heuristic (see the class comment) for standardised points {@code u}. */
    public static double medianWidth(double[][] u) {
        int n = u[0].length;
        int m = Math.min(n, MEDIAN_ROWS);
        double[] d = new double[m * (m - 1) / 2];
        int k = 0;
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++) {
                double s = squaredDistance(u, i, j);
                if (s > 0) {
                    d[k++] = s;
                }
            }
        }
        if (k == 0) {
            return 1.0;
        }
        // The median of the distances is the root of the median of the squared distances (a
        // monotone map); the order statistics are found by selection in expected O(k).
        double upper = Math.sqrt(select(d, k, k / 2));
        double median = k % 2 == 1 ? upper : 0.5 * (Math.sqrt(maxBelow(d, k / 2)) + upper);
        return median > 0 ? median : 1.0;
    }

    /** The element of rank {@code rank} (0-based) among the first {@code k} of {@code a}; reorders them. */
    static double select(double[] a, int k, int rank) {
        int lo = 0;
        int hi = k - 1;
        while (lo < hi) {
            double pivot = a[(lo + hi) >>> 1];
            int i = lo;
            int j = hi;
            while (i <= j) {
                while (a[i] < pivot) {
                    i++;
                }
                while (a[j] > pivot) {
                    j--;
                }
                if (i <= j) {
                    double t = a[i];
                    a[i] = a[j];
                    a[j] = t;
                    i++;
                    j--;
                }
            }
            if (rank <= j) {
                hi = j;
            } else if (rank >= i) {
                lo = i;
            } else {
                return a[rank];
            }
        }
        return a[rank];
    }

    /** The largest of the first {@code count} entries (after {@link #select} put the smaller ones there). */
    private static double maxBelow(double[] a, int count) {
        double m = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < count; i++) {
            m = Math.max(m, a[i]);
        }
        return m;
    }

    /**
     * The median-heuristic width of the variables {@code vars} of {@code data} on all its rows,
     * given their standardised columns {@code u}: computed once per data set and variable set
     * and shared through {@link DataSet#shared} by every kernel test on the same data (the
     * width depends only on the data of the set, and PC asks about the same sets often).
     */
    static double sharedWidth(DataSet data, int[] vars, double[][] u) {
        return data.shared(new WidthKey(Arrays.stream(vars).boxed().toList()), d -> medianWidth(u));
    }

    /** The key of a shared kernel width: the variable set, in the order the test uses it. */
    private record WidthKey(java.util.List<Integer> vars) {
    }

    static double squaredDistance(double[][] u, int i, int j) {
        double s = 0;
        for (double[] c : u) {
            double t = c[i] - c[j];
            s += t * t;
        }
        return s;
    }

    /** The full Gaussian kernel matrix of {@code u} with width σ, row-major n × n. */
    static double[] gram(double[][] u, double sigma) {
        int n = u[0].length;
        double g = -1.0 / (2 * sigma * sigma);
        double[] k = new double[n * n];
        for (int i = 0; i < n; i++) {
            k[i * n + i] = 1.0;
            for (int j = i + 1; j < n; j++) {
                double v = Math.exp(g * squaredDistance(u, i, j));
                k[i * n + j] = v;
                k[j * n + i] = v;
            }
        }
        return k;
    }

    /**
     * The pivoted incomplete Cholesky factor G (columns {@code double[r][n]}) of the Gaussian
     * kernel matrix of {@code u} with width σ, of rank at most {@code maxRank}.
     */
    public static double[][] incompleteCholesky(double[][] u, double sigma, int maxRank) {
        int n = u[0].length;
        double g = -1.0 / (2 * sigma * sigma);
        double[] residual = new double[n];
        Arrays.fill(residual, 1.0);
        int cap = Math.min(maxRank, n);
        double[][] cols = new double[cap][];
        int[] pivots = new int[cap];
        int rank = 0;
        while (rank < cap) {
            int pivot = 0;
            for (int i = 1; i < n; i++) {
                if (residual[i] > residual[pivot]) {
                    pivot = i;
                }
            }
            double d = residual[pivot];
            if (!(d > CHOLESKY_TOLERANCE)) {
                break;
            }
            double s = Math.sqrt(d);
            double[] col = new double[n];
            for (int i = 0; i < n; i++) {
                double v = Math.exp(g * squaredDistance(u, i, pivot));
                for (int j = 0; j < rank; j++) {
                    v -= cols[j][i] * cols[j][pivot];
                }
                col[i] = v / s;
            }
            col[pivot] = s;
            for (int i = 0; i < n; i++) {
                residual[i] -= col[i] * col[i];
            }
            residual[pivot] = 0;
            pivots[rank] = pivot;
            cols[rank++] = col;
        }
        return Arrays.copyOf(cols, rank);
    }

    /** Subtracts each column's mean in place: H G for the centring matrix H = I − 11ᵀ/n. */
    public static double[][] centreColumns(double[][] cols) {
        for (double[] c : cols) {
            double mean = 0;
            for (double v : c) {
                mean += v;
            }
            mean /= c.length;
            for (int i = 0; i < c.length; i++) {
                c[i] -= mean;
            }
        }
        return cols;
    }

    /** The r × s matrix Aᵀ B of column sets A (r columns) and B (s columns), row-major. */
    public static double[] crossProduct(double[][] a, double[][] b) {
        int r = a.length;
        int s = b.length;
        double[] out = new double[r * s];
        for (int i = 0; i < r; i++) {
            double[] ai = a[i];
            for (int j = 0; j < s; j++) {
                out[i * s + j] = dot(ai, b[j]);
            }
        }
        return out;
    }

    /**
     * The symmetric r × r matrix Aᵀ A of a column set A (row-major), each entry computed once.
     * Four entries of a row are accumulated together, so each element of column i is loaded
     * once for four products (the O(n r²) products of RCIT's conditioning features dominate
     * its cost), and the rows are taken in blocks of {@value #PRODUCT_BLOCK}, so that the
     * block of every column stays in the processor's cache while it is multiplied with all the
     * others, instead of each column being streamed from memory r/4 times. Up to
     * {@value #PRODUCT_BLOCK} rows the sums are those of unblocked dot products to the bit.
     */
    public static double[] symmetricCrossProduct(double[][] a) {
        int r = a.length;
        double[] out = new double[r * r];
        int n = r == 0 ? 0 : a[0].length;
        for (int from = 0; from < n; from += PRODUCT_BLOCK) {
            int to = Math.min(n, from + PRODUCT_BLOCK);
            for (int i = 0; i < r; i++) {
                double[] ai = a[i];
                int j = i;
                for (; j + 3 < r; j += 4) {
                    double[] b0 = a[j];
                    double[] b1 = a[j + 1];
                    double[] b2 = a[j + 2];
                    double[] b3 = a[j + 3];
                    double s0 = 0;
                    double s1 = 0;
                    double s2 = 0;
                    double s3 = 0;
                    for (int k = from; k < to; k++) {
                        double v = ai[k];
                        s0 += v * b0[k];
                        s1 += v * b1[k];
                        s2 += v * b2[k];
                        s3 += v * b3[k];
                    }
                    out[i * r + j] += s0;
                    out[i * r + j + 1] += s1;
                    out[i * r + j + 2] += s2;
                    out[i * r + j + 3] += s3;
                }
                for (; j < r; j++) {
                    out[i * r + j] += dot(ai, from, a[j], from, to - from);
                }
            }
        }
        for (int i = 0; i < r; i++) {
            for (int c = i + 1; c < r; c++) {
                out[c * r + i] = out[i * r + c];
            }
        }
        return out;
    }

    /**
     * The dot product of two equally long vectors, with four partial sums: independent
     * additions let the processor overlap them (a single running sum waits on each addition),
     * which makes the products of the kernel tests several times faster.
     */
    static double dot(double[] a, double[] b) {
        return dot(a, 0, b, 0, a.length);
    }

    /** The dot product of two stretches of arrays (row-major blocks), summed as {@link #dot(double[], double[])}. */
    static double dot(double[] a, int offA, double[] b, int offB, int len) {
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int k = 0;
        for (; k + 3 < len; k += 4) {
            s0 += a[offA + k] * b[offB + k];
            s1 += a[offA + k + 1] * b[offB + k + 1];
            s2 += a[offA + k + 2] * b[offB + k + 2];
            s3 += a[offA + k + 3] * b[offB + k + 3];
        }
        for (; k < len; k++) {
            s0 += a[offA + k] * b[offB + k];
        }
        return (s0 + s1) + (s2 + s3);
    }

    /** The squared Frobenius norm of a matrix stored as an array. */
    static double squaredNorm(double[] m) {
        return dot(m, m);
    }

    /** The squared Frobenius norm of a column set. */
    static double squaredNorm(double[][] cols) {
        double s = 0;
        for (double[] c : cols) {
            s += squaredNorm(c);
        }
        return s;
    }

    /**
     * The lower Cholesky factor (row-major) of the symmetric positive definite q × q matrix
     * {@code a}; a pivot that is not positive (round-off on a singular matrix) is set to a
     * tiny positive value so the solve stays finite.
     */
    static double[] cholesky(double[] a, int q) {
        double[] l = new double[q * q];
        for (int i = 0; i < q; i++) {
            for (int j = 0; j <= i; j++) {
                double s = a[i * q + j];
                for (int k = 0; k < j; k++) {
                    s -= l[i * q + k] * l[j * q + k];
                }
                if (i == j) {
                    l[i * q + i] = Math.sqrt(Math.max(s, 1e-300));
                } else {
                    l[i * q + j] = s / l[j * q + j];
                }
            }
        }
        return l;
    }

    /** Solves (L Lᵀ) X = B in place for a row-major q × c right-hand side B. */
    static void choleskySolve(double[] l, int q, double[] b, int c) {
        for (int col = 0; col < c; col++) {
            for (int i = 0; i < q; i++) {
                double s = b[i * c + col];
                for (int k = 0; k < i; k++) {
                    s -= l[i * q + k] * b[k * c + col];
                }
                b[i * c + col] = s / l[i * q + i];
            }
            for (int i = q - 1; i >= 0; i--) {
                double s = b[i * c + col];
                for (int k = i + 1; k < q; k++) {
                    s -= l[k * q + i] * b[k * c + col];
                }
                b[i * c + col] = s / l[i * q + i];
            }
        }
    }

    /**
     * The survival function 1 − F(t) of the gamma distribution whose mean and variance are
     * {@code mean} and {@code variance} (shape mean²/variance, scale variance/mean), by
     * moment matching; 1 when the moments are not positive (nothing to test).
     */
    static double gammaSurvival(double t, double mean, double variance) {
        if (!(mean > 0 && variance > 0) || Double.isNaN(t)) {
            return 1.0;
        }
        double shape = mean * mean / variance;
        double scale = variance / mean;
        return org.apache.commons.statistics.distribution.GammaDistribution.of(shape, scale).survivalProbability(t);
    }
}
