package dev.touchstone.generators.fit;

import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;

import java.util.ArrayList;
import java.util.List;

/**
 * Checks of a fitted model's assumptions, per variable:
 *
 * <ul>
 * <li>non-Gaussian residuals of a continuous variable: the Jarque–Bera test (Jarque and
 *     Bera 1980), JB = m/6 · (S² + (K − 3)²/4) with sample skewness S and kurtosis K,
 *     referred to χ² with 2 degrees of freedom;</li>
 * <li>nonlinearity of a continuous variable with continuous parents: a RESET-type test
 *     (Ramsey 1969) of whether the residuals correlate with the squared centred fitted
 *     values, t = r √((m − 2)/(1 − r²)) on m − 2 degrees of freedom (the residuals are
 *     orthogonal to the fitted values and the intercept already, so this is close to the
 *     t test of the added squared term);</li>
 * <li>missingness: the fraction of cells missing.</li>
 * </ul>
 *
 * Cost O(rows) per variable.
 */
public final class FitDiagnostics {

    /** Fewer complete rows than this: no residual tests. */
    public static final int MIN_ROWS = 8;

    private FitDiagnostics() {
    }

    /**
     * The checks of one variable.
     *
     * @param residuals the tests of its residuals ({@link Residuals#NONE} when none applies)
     */
    public record Check(String name, boolean continuous, int rows, double missingRate, Residuals residuals) {
    }

    /**
     * The tests of a continuous variable's residuals (null where a test does not apply).
     *
     * @param normalityP    Jarque–Bera p-value
     * @param nonlinearityP RESET-type p-value
     */
    public record Residuals(Double skewness, Double excessKurtosis, Double normalityP, Double nonlinearityP) {

        /** No test applied. */
        public static final Residuals NONE = new Residuals(null, null, null, null);
    }

    /** One check per variable, in graph order. */
    public static List<Check> of(FittedModel model) {
        List<Check> out = new ArrayList<>();
        double[] rates = model.missingRates();
        for (int v = 0; v < model.nodes().size(); v++) {
            FittedNode n = model.nodes().get(v);
            if (!(n instanceof FittedNode.Gaussian g) || g.rows() < MIN_ROWS) {
                out.add(new Check(n.name(), n instanceof FittedNode.Gaussian, n.rows(), rates[v], Residuals.NONE));
                continue;
            }
            double[] e = g.residuals();
            double[] moments = moments(e);
            Double skew = null;
            Double kurt = null;
            Double normal = null;
            if (moments[1] > 0) {
                skew = moments[2] / Math.pow(moments[1], 1.5);
                kurt = moments[3] / (moments[1] * moments[1]) - 3;
                double jb = e.length / 6.0 * (skew * skew + kurt * kurt / 4);
                normal = 1 - new ChiSquaredDistribution(null, 2).cumulativeProbability(jb);
            }
            Double nonlinear = g.continuousParents().isEmpty() || moments[1] == 0 ? null : reset(g);
            out.add(new Check(n.name(), true, n.rows(), rates[v], new Residuals(skew, kurt, normal, nonlinear)));
        }
        return out;
    }

    /** Mean and central moments 2, 3, 4 (divisor m). */
    static double[] moments(double[] x) {
        double mean = 0;
        for (double v : x) {
            mean += v;
        }
        mean /= x.length;
        double m2 = 0;
        double m3 = 0;
        double m4 = 0;
        for (double v : x) {
            double d = v - mean;
            double d2 = d * d;
            m2 += d2;
            m3 += d2 * d;
            m4 += d2 * d2;
        }
        return new double[] {mean, m2 / x.length, m3 / x.length, m4 / x.length};
    }

    private static Double reset(FittedNode.Gaussian g) {
        double[] e = g.residuals();
        double[] f = g.fitted();
        int m = e.length;
        double fm = moments(f)[0];
        double[] sq = new double[m];
        for (int i = 0; i < m; i++) {
            sq[i] = (f[i] - fm) * (f[i] - fm);
        }
        // Pearson's r by Commons Math (NaN when either side is constant)
        double r = new PearsonsCorrelation().correlation(e, sq);
        if (Double.isNaN(r)) {
            return null;
        }
        double t = r * Math.sqrt((m - 2) / Math.max(1e-300, 1 - r * r));
        return 2 * (1 - new TDistribution(null, m - 2).cumulativeProbability(Math.abs(t)));
    }
}
