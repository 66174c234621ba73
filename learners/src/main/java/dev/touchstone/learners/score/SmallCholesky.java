package dev.touchstone.learners.score;

/**
 * In-place Cholesky factorisation of small symmetric positive semi-definite matrices held
 * row-major in a {@code double[]}, for the parent blocks of local scores (Golub and Van Loan,
 * Matrix Computations, §4.2; common practice). Cost O(k³/3) for a k × k block.
 *
 * <p>A pivot that falls below {@link #RELATIVE_PIVOT_FLOOR} times its original diagonal
 * entry marks a variable that is (numerically) a linear combination of the ones before it;
 * its row is set to zero, which is the same as leaving the variable out of the regression.
 * That keeps collinear parent sets well defined instead of failing.
 */
final class SmallCholesky {

    /** Pivots this small relative to the diagonal entry count as zero. */
    static final double RELATIVE_PIVOT_FLOOR = 1e-12;

    private SmallCholesky() {
    }

    /**
     * Replaces the lower triangle of the k × k matrix {@code a} (row-major, leading
     * dimension k) by its Cholesky factor L with A = L Lᵀ; rows of redundant variables
     * become zero. The upper triangle is left as it was.
     *
     * @return the number of variables found redundant
     */
    static int factor(double[] a, int k) {
        int dropped = 0;
        for (int j = 0; j < k; j++) {
            int rj = j * k;
            double original = a[rj + j];
            double d = original;
            for (int m = 0; m < j; m++) {
                d -= a[rj + m] * a[rj + m];
            }
            if (!(d > RELATIVE_PIVOT_FLOOR * Math.abs(original)) || d <= 0) {
                for (int m = 0; m <= j; m++) {
                    a[rj + m] = 0;
                }
                for (int i = j + 1; i < k; i++) {
                    a[i * k + j] = 0;
                }
                dropped++;
                continue;
            }
            double l = Math.sqrt(d);
            a[rj + j] = l;
            for (int i = j + 1; i < k; i++) {
                int ri = i * k;
                double s = a[ri + j];
                for (int m = 0; m < j; m++) {
                    s -= a[ri + m] * a[rj + m];
                }
                a[ri + j] = s / l;
            }
        }
        return dropped;
    }

    /**
     * Solves L z = b in place by forward substitution (b becomes z), treating zero rows of L
     * (redundant variables) as contributing nothing.
     */
    static void forward(double[] l, int k, double[] b) {
        for (int i = 0; i < k; i++) {
            int ri = i * k;
            double d = l[ri + i];
            if (d == 0) {
                b[i] = 0;
                continue;
            }
            double s = b[i];
            for (int m = 0; m < i; m++) {
                s -= l[ri + m] * b[m];
            }
            b[i] = s / d;
        }
    }

    /** The sum of the logarithms of the non-zero diagonal entries of L, i.e. ½ ln det of the kept block. */
    static double halfLogDet(double[] l, int k) {
        double s = 0;
        for (int i = 0; i < k; i++) {
            double d = l[i * k + i];
            if (d > 0) {
                s += Math.log(d);
            }
        }
        return s;
    }
}
