package dev.touchstone.learners.independence;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.numbers.gamma.Erfc;

/**
 * Fisher's z test of zero partial correlation for (approximately) Gaussian data, on a
 * correlation matrix computed once and shared: z = ½ ln((1 + r)/(1 − r)) √(n − |S| − 3),
 * two-sided p-value 2(1 − Φ(|z|)) (Kalisch and Bühlmann 2007, "Estimating high-dimensional
 * directed acyclic graphs with the PC-algorithm", JMLR 8).
 *
 * <p>{@link #independent} compares |r| with a threshold precomputed for each conditioning
 * size, tanh(Φ⁻¹(1 − α/2) / √(n − |S| − 3)), which is the same decision as p &gt; α
 * without a logarithm or an error function. A call with |S| ≤ 3 allocates nothing and costs
 * a few dozen floating-point operations (see {@link PartialCorrelation}); {@link #pValue}
 * adds a logarithm and Commons Numbers' {@code Erfc}.
 *
 * <p>Declared choices: when x or y is a linear function of S (zero residual variance) the
 * partial correlation is undefined and the test accepts independence (p = 1), since the
 * variable carries no further information given S; when n − |S| − 3 ≤ 0 there are too few
 * rows to test and independence is accepted as well. Thread-safe and immutable.
 */
public final class FisherZTest implements IndependenceTest {

    private static final double INV_SQRT2 = 0.7071067811865476;

    private final double[] correlation;
    private final int p;
    private final long n;
    private final double alpha;
    private final double[] threshold;

    private FisherZTest(double[] correlation, int p, long n, double alpha) {
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("alpha must be in (0, 1), got " + alpha);
        }
        this.correlation = correlation;
        this.p = p;
        this.n = n;
        this.alpha = alpha;
        double c = new NormalDistribution(0, 1).inverseCumulativeProbability(1 - alpha / 2);
        int sizes = (int) Math.min(p + 1L, Math.max(0, n));
        this.threshold = new double[Math.max(sizes, 1)];
        for (int k = 0; k < threshold.length; k++) {
            double dof = n - k - 3.0;
            threshold[k] = dof > 0 ? Math.tanh(c / Math.sqrt(dof)) : Double.POSITIVE_INFINITY;
        }
    }

    /** The test on the data set's shared covariance (rows with a missing cell are left out). */
    public static FisherZTest of(DataSet data, double alpha) {
        CovarianceMatrix cov = data.covariance();
        double[] corr = data.shared(CorrelationKey.INSTANCE, d -> cov.correlation().toArray());
        return new FisherZTest(corr, cov.dimension(), cov.sampleSize(), alpha);
    }

    /** The test on a covariance matrix estimated from {@link CovarianceMatrix#sampleSize()} rows. */
    public static FisherZTest of(CovarianceMatrix cov, double alpha) {
        return new FisherZTest(cov.correlation().toArray(), cov.dimension(), cov.sampleSize(), alpha);
    }

    @Override
    public int variables() {
        return p;
    }

    @Override
    public double alpha() {
        return alpha;
    }

    /** The sample size the correlations were estimated from. */
    public long sampleSize() {
        return n;
    }

    /** The sample partial correlation of x and y given z (NaN when x or y is determined by z). */
    public double partialCorrelation(int x, int y, int[] z) {
        return PartialCorrelation.of(correlation, p, x, y, z);
    }

    @Override
    public double pValue(int x, int y, int[] z) {
        return pValue(partialCorrelation(x, y, z), n, z.length);
    }

    @Override
    public boolean independent(int x, int y, int[] z) {
        int k = z.length;
        if (k >= threshold.length) {
            return true;
        }
        double r = PartialCorrelation.of(correlation, p, x, y, z, k);
        // NaN (undefined partial correlation) fails the comparison and so counts as independent.
        return !(Math.abs(r) >= threshold[k]);
    }

    @Override
    public String name() {
        return "fisher-z";
    }

    /** Fisher's z statistic for a partial correlation r from n rows given k variables (NaN if n − k − 3 ≤ 0). */
    public static double statistic(double r, long n, int k) {
        double dof = n - k - 3.0;
        if (!(dof > 0)) {
            return Double.NaN;
        }
        return 0.5 * Math.log((1 + r) / (1 - r)) * Math.sqrt(dof);
    }

    /** The two-sided p-value of Fisher's z for partial correlation r (1 when undefined). */
    static double pValue(double r, long n, int k) {
        if (Double.isNaN(r)) {
            return 1.0;
        }
        double z = statistic(r, n, k);
        if (Double.isNaN(z)) {
            return 1.0;
        }
        // Commons Numbers' erfc (rational approximations, a few dozen flops) rather than Commons Math's
        // incomplete-gamma series, which cost about 10x more; the test checks it against the latter.
        return Erfc.value(Math.abs(z) * INV_SQRT2);
    }

    private enum CorrelationKey { INSTANCE }
}
