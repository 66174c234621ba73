package dev.touchstone.generators.models;

/** Means and standard deviations (divisor n − 1) of continuous columns; NaN for discrete ones. */
record Moments(double[] mean, double[] sd) {

    static Moments of(Object[] columns, int rows) {
        int p = columns.length;
        double[] mean = new double[p];
        double[] sd = new double[p];
        for (int v = 0; v < p; v++) {
            if (columns[v] instanceof double[]) {
                double[] m = of((double[]) columns[v], rows);
                mean[v] = m[0];
                sd[v] = m[1];
            } else {
                mean[v] = Double.NaN;
                sd[v] = Double.NaN;
            }
        }
        return new Moments(mean, sd);
    }

    /** {mean, sd} of the first {@code rows} values, by the two-pass formula. */
    static double[] of(double[] x, int rows) {
        double s = 0;
        for (int r = 0; r < rows; r++) {
            s += x[r];
        }
        double mean = s / rows;
        double ss = 0;
        for (int r = 0; r < rows; r++) {
            double d = x[r] - mean;
            ss += d * d;
        }
        return new double[] {mean, Math.sqrt(ss / Math.max(1, rows - 1))};
    }
}
