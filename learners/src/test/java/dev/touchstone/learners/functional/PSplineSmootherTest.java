package dev.touchstone.learners.functional;

import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Checks of the P-spline smoother and of backfitting. Sources: Eilers and Marx (1996),
 * Statistical Science 11 (a second-difference penalty leaves linear fits unpenalised; the
 * B-spline basis is a partition of unity, de Boor 1978); generalised cross-validation choosing
 * a smoother fit for noisier data and recovering sin on a grid (common practice); the penalised
 * normal equations solved directly with Commons Math 3.6.1.
 */
class PSplineSmootherTest {

    private static double[] uniform(UniformRandomProvider rng, int n, double lo, double hi) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = lo + (hi - lo) * rng.nextDouble();
        }
        return x;
    }

    @Test
    @DisplayName("uniform cubic B-spline values are non-negative and sum to 1 (partition of unity, de Boor 1978)")
    void basisIsPartitionOfUnity() {
        double[] v = new double[4];
        for (int k = 0; k <= 20; k++) {
            PSplineSmoother.uniformCubic(k / 20.0, v, 0);
            assertEquals(1.0, v[0] + v[1] + v[2] + v[3], 1e-12);
            for (double b : v) {
                assertTrue(b >= 0);
            }
        }
    }

    @Test
    @DisplayName("fitted values of sin(x) + N(0, 0.2²) on [−3, 3], n = 500, are within 0.1 of sin on a grid (common practice)")
    void recoversSine() {
        UniformRandomProvider rng = Seeds.random(Seeds.derive(1996, "sine"));
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        int n = 500;
        double[] x = uniform(rng, n, -3, 3);
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            y[i] = Math.sin(x[i]) + 0.2 * g.sample();
        }
        // Each grid point is checked at the data point nearest to it, where the fit is defined.
        double[] fitted = new double[n];
        PSplineSmoother.Smooth s = PSplineSmoother.of(x, 10).smooth(y, fitted);
        double worst = 0;
        for (double t = -2.75; t <= 2.75; t += 0.25) {
            int nearest = 0;
            for (int i = 1; i < n; i++) {
                if (Math.abs(x[i] - t) < Math.abs(x[nearest] - t)) {
                    nearest = i;
                }
            }
            worst = Math.max(worst, Math.abs(fitted[nearest] - Math.sin(x[nearest])));
        }
        assertTrue(worst < 0.1, "largest error " + worst + " at edf " + s.edf());
        assertTrue(s.edf() > 3 && s.edf() < 13, "edf " + s.edf());
    }

    @Test
    @DisplayName("GCV picks a larger penalty and fewer degrees of freedom when the same curve has 5 times the noise (common practice)")
    void noisierDataGetSmootherFits() {
        UniformRandomProvider rng = Seeds.random(Seeds.derive(1979, "gcv"));
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        int n = 400;
        double[] x = uniform(rng, n, -3, 3);
        double[] quiet = new double[n];
        double[] noisy = new double[n];
        for (int i = 0; i < n; i++) {
            double e = g.sample();
            quiet[i] = Math.sin(2 * x[i]) + 0.2 * e;
            noisy[i] = Math.sin(2 * x[i]) + 1.0 * e;
        }
        PSplineSmoother sm = PSplineSmoother.of(x, 20);
        PSplineSmoother.Smooth a = sm.smooth(quiet, new double[n]);
        PSplineSmoother.Smooth b = sm.smooth(noisy, new double[n]);
        assertTrue(b.lambda() > a.lambda() && b.edf() < a.edf(), "quiet " + a + ", noisy " + b);
    }

    @Test
    @DisplayName("an exactly linear response is reproduced at every penalty: the second-difference penalty does not act on lines (Eilers and Marx 1996)")
    void linearResponseIsUnpenalised() {
        UniformRandomProvider rng = Seeds.random(Seeds.derive(1996, "line"));
        int n = 200;
        double[] x = uniform(rng, n, -1, 4);
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            y[i] = 2.5 - 1.5 * x[i];
        }
        PSplineSmoother sm = PSplineSmoother.of(x, 8);
        double[] fitted = new double[n];
        for (int k = 0; k < sm.gridSize(); k++) {
            sm.smoothAt(k, y, fitted);
            for (int i = 0; i < n; i++) {
                assertEquals(y[i], fitted[i], 1e-6, "penalty index " + k);
            }
        }
    }

    @Test
    @DisplayName("fitted values at a fixed penalty equal the direct solve of (BᵀB + λDᵀD)β = Bᵀy with Commons Math")
    void fixedPenaltyMatchesDirectSolve() {
        UniformRandomProvider rng = Seeds.random(Seeds.derive(1996, "direct"));
        int n = 120;
        int segments = 6;
        int m = segments + 3;
        double[] x = uniform(rng, n, 0, 1);
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            y[i] = Math.exp(x[i]) + rng.nextDouble();
        }
        // The basis built independently, from de Boor's recursion for equally spaced knots.
        double h = (max(x) - min(x)) / segments;
        double[] knots = new double[m + 4];
        for (int t = 0; t < knots.length; t++) {
            knots[t] = min(x) + (t - 3) * h;
        }
        RealMatrix b = new Array2DRowRealMatrix(n, m);
        for (int i = 0; i < n; i++) {
            for (int c = 0; c < m; c++) {
                b.setEntry(i, c, deBoor(knots, c, 3, Math.min(x[i], max(x) - 1e-12)));
            }
        }
        RealMatrix d = new Array2DRowRealMatrix(m - 2, m);
        for (int r = 0; r < m - 2; r++) {
            d.setEntry(r, r, 1);
            d.setEntry(r, r + 1, -2);
            d.setEntry(r, r + 2, 1);
        }
        PSplineSmoother sm = PSplineSmoother.of(x, segments);
        double[] fitted = new double[n];
        PSplineSmoother.Smooth s = sm.smoothAt(8, y, fitted);
        RealMatrix a = b.transpose().multiply(b).add(d.transpose().multiply(d).scalarMultiply(s.lambda()));
        double[] beta = new LUDecomposition(a).getSolver().solve(b.transpose().operate(new ArrayRealVector(y))).toArray();
        double[] expected = b.operate(beta);
        for (int i = 0; i < n; i++) {
            assertEquals(expected[i], fitted[i], 1e-8);
        }
        RealMatrix hat = b.multiply(new LUDecomposition(a).getSolver().getInverse()).multiply(b.transpose());
        assertEquals(hat.getTrace(), s.edf(), 1e-8);
    }

    @Test
    @DisplayName("backfitting two additive terms recovers each function up to its mean (Hastie and Tibshirani 1990, §4.3)")
    void backfittingSeparatesTerms() {
        UniformRandomProvider rng = Seeds.random(Seeds.derive(1990, "backfit"));
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        int n = 1000;
        double[] x1 = uniform(rng, n, -2, 2);
        double[] x2 = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            x2[i] = 0.5 * x1[i] + rng.nextDouble() * 3 - 1.5;
            y[i] = x1[i] * x1[i] + Math.sin(2 * x2[i]) + 0.3 * g.sample();
        }
        AdditiveRegression.Fit both = AdditiveRegression.fit(y, List.of(PSplineSmoother.of(x1, 10), PSplineSmoother.of(x2, 10)));
        AdditiveRegression.Fit one = AdditiveRegression.fit(y, List.of(PSplineSmoother.of(x1, 10)));
        double noiseVariance = both.rss() / (n - both.edf());
        assertEquals(0.09, noiseVariance, 0.015, "residual variance near the noise variance 0.3²");
        assertTrue(one.rss() > 2 * both.rss(), "dropping a real term raises the RSS: " + one.rss() + " vs " + both.rss());
        assertEquals(1 + both.termEdf(0) + both.termEdf(1), both.edf(), 1e-12);
    }

    private static double deBoor(double[] t, int i, int k, double x) {
        if (k == 0) {
            return t[i] <= x && x < t[i + 1] ? 1 : 0;
        }
        double left = (x - t[i]) / (t[i + k] - t[i]) * deBoor(t, i, k - 1, x);
        double right = (t[i + k + 1] - x) / (t[i + k + 1] - t[i + 1]) * deBoor(t, i + 1, k - 1, x);
        return left + right;
    }

    private static double min(double[] v) {
        double m = Double.POSITIVE_INFINITY;
        for (double a : v) {
            m = Math.min(m, a);
        }
        return m;
    }

    private static double max(double[] v) {
        double m = Double.NEGATIVE_INFINITY;
        for (double a : v) {
            m = Math.max(m, a);
        }
        return m;
    }
}
