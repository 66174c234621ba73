package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class BicScoreTest {

    @Test
    @DisplayName("log-likelihood part equals the Gaussian log-likelihood of Commons Math OLS residuals (Commons Math 3.6.1)")
    void matchesOrdinaryLeastSquares() {
        Graph dag = RandomDags.erdosRenyi(8, 3.0, 21);
        DataSet data = ScoreData.linearGaussian(dag, 300, 4);
        int n = data.rows();
        BicScore bic = BicScore.of(data.covariance(), 1.0);
        UniformRandomProvider rng = Seeds.random(99);
        for (int trial = 0; trial < 40; trial++) {
            int y = rng.nextInt(8);
            int[] parents = ScoreTesting.randomParents(rng, 8, y, 1 + rng.nextInt(5));
            int k = parents.length;
            double[][] x = new double[n][k];
            for (int r = 0; r < n; r++) {
                for (int i = 0; i < k; i++) {
                    x[r][i] = data.continuous(parents[i])[r];
                }
            }
            OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
            ols.newSampleData(data.continuous(y).clone(), x);
            double rss = ols.calculateResidualSumOfSquares();
            double logLik = -0.5 * n * (Math.log(2 * Math.PI * rss / n) + 1);
            double penalty = 0.5 * (k + 2) * Math.log(n);
            assertEquals(logLik, bic.localScore(y, parents) + penalty, 1e-9 * Math.abs(logLik),
                    "node " + y + " given " + java.util.Arrays.toString(parents));
        }
    }

    @Test
    @DisplayName("empty parent set: the log-likelihood of the MLE variance (common practice)")
    void emptyParentSet() {
        DataSet data = ScoreData.linearGaussian(RandomDags.erdosRenyi(3, 1.0, 2), 50, 3);
        double[] y = data.continuous(1);
        double mean = 0;
        for (double v : y) {
            mean += v;
        }
        mean /= y.length;
        double ss = 0;
        for (double v : y) {
            ss += (v - mean) * (v - mean);
        }
        double expected = -0.5 * 50 * (Math.log(2 * Math.PI * ss / 50) + 1) - 0.5 * 2 * Math.log(50);
        assertEquals(expected, BicScore.of(data.covariance(), 1.0).localScore(1, new int[0]), 1e-9);
    }

    @Test
    @DisplayName("the penalty multiplier scales the (|P| + 2)/2 · ln n term only (Schwarz 1978)")
    void penaltyMultiplier() {
        DataSet data = ScoreData.linearGaussian(RandomDags.erdosRenyi(5, 2.0, 8), 200, 1);
        int[] pa = {0, 2};
        double s1 = BicScore.of(data.covariance(), 1.0).localScore(4, pa);
        double s3 = BicScore.of(data.covariance(), 3.0).localScore(4, pa);
        assertEquals(2 * 0.5 * 4 * Math.log(200), s1 - s3, 1e-9);
    }

    @Test
    @DisplayName("Markov-equivalent DAGs (a covered edge reversed) get equal BIC (Chickering 1995)")
    void scoreEquivalence() {
        ScoreTesting.assertCoveredReversalsScoreEqual(seed -> BicScore.of(ScoreData.linearGaussian(
                RandomDags.erdosRenyi(7, 3.0, seed + 1000), 150, seed).covariance(), 1.5));
    }

    @Test
    @DisplayName("with the population covariance the score stands for 1e9 rows (documented oracle sample size)")
    void oracleSampleSize() {
        DataSet data = ScoreData.linearGaussian(RandomDags.erdosRenyi(4, 2.0, 8), 100, 1);
        CovarianceMatrix c = data.covariance();
        CovarianceMatrix population = CovarianceMatrix.of(c.names(), c.toArray(), CovarianceMatrix.INFINITE_SAMPLE);
        BicScore bic = BicScore.of(population, 1.0);
        assertEquals(BicScore.ORACLE_SAMPLE_SIZE, bic.sampleSize());
        double s2 = c.get(0, 0);
        double expected = -0.5 * 1e9 * (Math.log(2 * Math.PI * s2) + 1) - Math.log(1e9);
        assertEquals(expected, bic.localScore(0, new int[0]), 1e-6 * Math.abs(expected));
    }

    @Test
    @DisplayName("collinear parents: a duplicated parent adds nothing to the fit (common practice: pseudo-inverse)")
    void collinearParents() {
        DataSet base = ScoreData.linearGaussian(RandomDags.erdosRenyi(3, 2.0, 5), 100, 2);
        DataSet data = DataSet.builder(100).continuous("A", base.continuous(0)).continuous("B", base.continuous(1))
                .continuous("A2", base.continuous(0).clone()).build();
        BicScore bic = BicScore.of(data.covariance(), 1.0);
        double one = bic.localScore(1, new int[] {0});
        double two = bic.localScore(1, new int[] {0, 2});
        assertEquals(one - 0.5 * Math.log(100), two, 1e-6);
    }

    @Test
    @DisplayName("bad input gets one clear message")
    void rejectsBadInput() {
        DataSet data = ScoreData.linearGaussian(RandomDags.erdosRenyi(3, 1.0, 2), 50, 3);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> BicScore.of(data.covariance(), 0));
        assertTrue(e.getMessage().contains("penalty multiplier"), e.getMessage());
        DataSet constant = DataSet.builder(3).continuous("flat", new double[] {1, 1, 1}).build();
        e = assertThrows(IllegalArgumentException.class, () -> BicScore.of(constant.covariance(), 1));
        assertTrue(e.getMessage().contains("'flat'"), e.getMessage());
        assertNotNull(BicScore.of(data.covariance(), 1).describe());
    }
}
