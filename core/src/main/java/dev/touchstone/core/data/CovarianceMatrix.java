package dev.touchstone.core.data;

import java.util.List;

/**
 * A symmetric covariance matrix over named variables, with the number of rows it was
 * estimated from ({@link #INFINITE_SAMPLE} for an exact population covariance).
 * Immutable; the backing array is row-major p × p.
 */
public final class CovarianceMatrix {

    /** The sample size recorded for an exact population covariance. */
    public static final long INFINITE_SAMPLE = Long.MAX_VALUE;

    private final List<String> names;
    private final double[] values;
    private final long sampleSize;

    private CovarianceMatrix(List<String> names, double[] values, long sampleSize) {
        this.names = List.copyOf(names);
        this.values = values;
        this.sampleSize = sampleSize;
    }

    /**
     * Wraps a row-major p × p symmetric matrix (copied).
     *
     * @param sampleSize rows it was estimated from, or {@link #INFINITE_SAMPLE}
     */
    public static CovarianceMatrix of(List<String> names, double[] rowMajor, long sampleSize) {
        int p = names.size();
        if (rowMajor.length != p * p) {
            throw new IllegalArgumentException("a covariance over " + p + " variables needs " + (p * p)
                    + " entries, got " + rowMajor.length);
        }
        return new CovarianceMatrix(names, rowMajor.clone(), sampleSize);
    }

    /** Wraps a p × p matrix given as rows (copied). */
    public static CovarianceMatrix of(List<String> names, double[][] matrix, long sampleSize) {
        int p = names.size();
        double[] flat = new double[p * p];
        for (int i = 0; i < p; i++) {
            if (matrix[i].length != p) {
                throw new IllegalArgumentException("row " + i + " has " + matrix[i].length + " entries, expected " + p);
            }
            System.arraycopy(matrix[i], 0, flat, i * p, p);
        }
        return new CovarianceMatrix(names, flat, sampleSize);
    }

    static CovarianceMatrix wrap(List<String> names, double[] rowMajor, long sampleSize) {
        return new CovarianceMatrix(names, rowMajor, sampleSize);
    }

    public int dimension() {
        return names.size();
    }

    public List<String> names() {
        return names;
    }

    public long sampleSize() {
        return sampleSize;
    }

    public boolean isPopulation() {
        return sampleSize == INFINITE_SAMPLE;
    }

    public double get(int i, int j) {
        return values[i * names.size() + j];
    }

    /** A copy of the row-major entries. */
    public double[] toArray() {
        return values.clone();
    }

    /** The correlation matrix implied by this covariance. */
    public CovarianceMatrix correlation() {
        int p = names.size();
        double[] sd = new double[p];
        for (int i = 0; i < p; i++) {
            sd[i] = Math.sqrt(values[i * p + i]);
        }
        double[] r = new double[p * p];
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                r[i * p + j] = i == j ? 1.0 : values[i * p + j] / (sd[i] * sd[j]);
            }
        }
        return new CovarianceMatrix(names, r, sampleSize);
    }

    /** The sub-matrix over these indices, in the order given. */
    public CovarianceMatrix select(int[] indices) {
        int p = names.size();
        int q = indices.length;
        double[] sub = new double[q * q];
        String[] subNames = new String[q];
        for (int a = 0; a < q; a++) {
            subNames[a] = names.get(indices[a]);
            for (int b = 0; b < q; b++) {
                sub[a * q + b] = values[indices[a] * p + indices[b]];
            }
        }
        return new CovarianceMatrix(List.of(subNames), sub, sampleSize);
    }
}
