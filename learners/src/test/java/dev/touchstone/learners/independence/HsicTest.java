package dev.touchstone.learners.independence;

import dev.touchstone.core.random.Seeds;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.statistics.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * HSIC against the formulas of Gretton, Fukumizu, Teo, Song, Schölkopf and Smola (2008, "A
 * kernel statistical test of independence", NIPS 20): HSIC_b = tr(KHLH)/n², and the gamma
 * moments of its Section 3 (formulas from the paper, as recalled from memory). The reference
 * values are computed here by explicit matrix products with Commons Math 3.6.1 and its
 * gamma distribution, a route independent of the implementation's loops and of Commons
 * Statistics.
 */
class HsicTest {

    /** Standardises (divisor n) with Commons Math's descriptive statistics. */
    private static double[] standardise(double[] x) {
        DescriptiveStatistics s = new DescriptiveStatistics(x);
        double sd = Math.sqrt(s.getPopulationVariance());
        return Arrays.stream(x).map(v -> (v - s.getMean()) / sd).toArray();
    }

    /** The median of the non-zero pairwise distances, by sorting (the rule stated in KernelAlgebra). */
    private static double medianDistance(double[] x) {
        int n = x.length;
        double[] d = new double[n * (n - 1) / 2];
        int k = 0;
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                d[k++] = Math.abs(x[i] - x[j]);
            }
        }
        Arrays.sort(d);
        return k % 2 == 1 ? d[k / 2] : (d[k / 2 - 1] + d[k / 2]) / 2;
    }

    private static RealMatrix gram(double[] x, double sigma) {
        int n = x.length;
        RealMatrix k = MatrixUtils.createRealMatrix(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double d = x[i] - x[j];
                k.setEntry(i, j, Math.exp(-d * d / (2 * sigma * sigma)));
            }
        }
        return k;
    }

    private static RealMatrix centring(int n) {
        RealMatrix h = MatrixUtils.createRealIdentityMatrix(n);
        return h.scalarAdd(0).subtract(MatrixUtils.createRealMatrix(n, n).scalarAdd(1.0 / n));
    }

    @Test
    @DisplayName("median heuristic by selection equals the median of the sorted pairwise distances (odd and even counts, ties, 2-d points)")
    void medianWidthMatchesSorting() {
        UniformRandomProvider rng = Seeds.random(77);
        for (int n : new int[] {2, 3, 4, 7, 12, 31, 64}) {
            double[][] u = new double[2][n];
            for (int i = 0; i < n; i++) {
                // Rounded to a coarse grid so that equal distances (ties) and zero distances occur.
                u[0][i] = Math.round(rng.nextDouble() * 4) / 2.0;
                u[1][i] = Math.round(rng.nextDouble() * 4) / 2.0;
            }
            double[] d = new double[n * (n - 1) / 2];
            int k = 0;
            for (int i = 0; i < n; i++) {
                for (int j = i + 1; j < n; j++) {
                    double e = Math.hypot(u[0][i] - u[0][j], u[1][i] - u[1][j]);
                    if (e > 0) {
                        d[k++] = e;
                    }
                }
            }
            double[] nz = Arrays.copyOf(d, k);
            Arrays.sort(nz);
            double expected = k == 0 ? 1.0 : k % 2 == 1 ? nz[k / 2] : (nz[k / 2 - 1] + nz[k / 2]) / 2;
            assertEquals(expected, KernelAlgebra.medianWidth(u), 1e-12, "n = " + n);
        }
    }

    @Test
    @DisplayName("n·HSIC_b on a hand sample of n = 5 equals tr(KHLH)/n from explicit Commons Math matrices")
    void statisticOnTinySample() {
        double[] x = {0.3, -1.2, 2.0, 0.7, -0.4};
        double[] y = {1.1, 0.2, 3.9, 0.4, 0.8};
        double[] sx = standardise(x);
        double[] sy = standardise(y);
        double wx = medianDistance(sx);
        double wy = medianDistance(sy);
        RealMatrix h = centring(5);
        RealMatrix k = gram(sx, wx);
        RealMatrix l = gram(sy, wy);
        double expected = k.multiply(h).multiply(l).multiply(h).getTrace() / 5; // n · tr(KHLH)/n²
        Hsic.Result r = Hsic.test(new double[][] {x}, new double[][] {y});
        assertEquals(wx, r.widths().u(), 1e-12);
        assertEquals(wy, r.widths().v(), 1e-12);
        assertEquals(expected, r.statistic(), 1e-12);
        assertTrue(expected > 0.05, "the hand sample is dependent enough for a non-trivial statistic: " + expected);
        // Symmetric in its arguments (HSIC is; tr(KHLH) = tr(LHKH)).
        assertEquals(r.statistic(), Hsic.test(new double[][] {y}, new double[][] {x}).statistic(), 1e-12);
    }

    @Test
    @DisplayName("gamma moments and p-value at n = 9 equal the paper's formulas evaluated with Commons Math matrices and GammaDistribution")
    void gammaApproximationOnSmallSample() {
        double[] x = {0.3, -1.2, 2.0, 0.7, -0.4, 1.5, -0.9, 0.05, 1.1};
        double[] y = {0.2, 1.7, -0.3, 0.9, 0.4, -1.1, 1.3, 0.6, -0.2};
        int n = x.length;
        double[] sx = standardise(x);
        double[] sy = standardise(y);
        RealMatrix k = gram(sx, medianDistance(sx));
        RealMatrix l = gram(sy, medianDistance(sy));
        RealMatrix h = centring(n);
        RealMatrix kc = h.multiply(k).multiply(h);
        RealMatrix lc = h.multiply(l).multiply(h);
        double hsicB = k.multiply(h).multiply(l).multiply(h).getTrace() / ((double) n * n);
        double muK = 0;
        double muL = 0;
        double offB = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (i != j) {
                    muK += k.getEntry(i, j);
                    muL += l.getEntry(i, j);
                    double e = kc.getEntry(i, j) * lc.getEntry(i, j);
                    offB += e * e;
                }
            }
        }
        muK /= n * (n - 1.0);
        muL /= n * (n - 1.0);
        double mean = (1 + muK * muL - muK - muL) / n;
        double var = 2.0 * (n - 4) * (n - 5) / ((double) n * (n - 1) * (n - 2) * (n - 3)) * offB / (n * (n - 1.0));
        double shape = mean * mean / var;
        double scale = n * var / mean;
        double expectedP = 1 - new GammaDistribution(shape, scale).cumulativeProbability(n * hsicB);

        Hsic.Result r = Hsic.test(new double[][] {x}, new double[][] {y});
        assertEquals(n * hsicB, r.statistic(), 1e-12);
        assertEquals(mean, r.nullMean(), 1e-12);
        assertEquals(var, r.nullVariance(), 1e-14);
        assertEquals(expectedP, r.pValue(), 1e-9);
        assertTrue(expectedP > 0 && expectedP < 1, "p = " + expectedP);
    }

    @Test
    @DisplayName("p-values of independent samples (n = 100, 200 seeded cases) are uniform by KS, p > 0.01; y = x² + noise rejected in ≥ 90% at n = 200")
    void calibrationAndPower() {
        UniformRandomProvider rng = Seeds.random(2008);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        int cases = 200;
        double[] p = new double[cases];
        for (int c = 0; c < cases; c++) {
            double[] x = new double[100];
            double[] y = new double[100];
            for (int i = 0; i < 100; i++) {
                x[i] = g.sample();
                y[i] = rng.nextDouble() * 2 - 1;
            }
            p[c] = Hsic.test(new double[][] {x}, new double[][] {y}).pValue();
        }
        double ks = KolmogorovSmirnovTest.withDefaults().test(p, v -> Math.min(1, Math.max(0, v))).getPValue();
        assertTrue(ks > 0.01, "KS p-value against the uniform: " + ks);
        int rejected = 0;
        for (int c = 0; c < 50; c++) {
            double[] x = new double[200];
            double[] y = new double[200];
            for (int i = 0; i < 200; i++) {
                x[i] = g.sample();
                y[i] = x[i] * x[i] + 0.5 * g.sample();
            }
            if (Hsic.test(new double[][] {x}, new double[][] {y}).pValue() < 0.05) {
                rejected++;
            }
        }
        assertTrue(rejected >= 45, "rejected " + rejected + " of 50");
    }
}
