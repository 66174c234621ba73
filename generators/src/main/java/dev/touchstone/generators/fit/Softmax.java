package dev.touchstone.generators.fit;

/** The softmax of a vector of log-odds, computed stably (maximum subtracted first). */
final class Softmax {

    private Softmax() {
    }

    static double[] of(double[] eta) {
        double[] p = new double[eta.length];
        into(eta, p);
        return p;
    }

    static void into(double[] eta, double[] p) {
        double max = Double.NEGATIVE_INFINITY;
        for (double e : eta) {
            max = Math.max(max, e);
        }
        double total = 0;
        for (int c = 0; c < eta.length; c++) {
            p[c] = Math.exp(eta[c] - max);
            total += p[c];
        }
        for (int c = 0; c < eta.length; c++) {
            p[c] /= total;
        }
    }
}
