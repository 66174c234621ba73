package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class EbicScoreTest {

    @Test
    @DisplayName("gamma = 0 is the BIC exactly, on sample and population covariances (Foygel and Drton 2010:"
            + " EBIC_0 = BIC)")
    void gammaZeroIsTheBic() {
        DataSet data = ScoreData.linearGaussian(RandomDags.erdosRenyi(9, 3.0, 5), 250, 6);
        CovarianceMatrix sample = data.covariance();
        CovarianceMatrix population = CovarianceMatrix.of(sample.names(), sample.toArray(),
                CovarianceMatrix.INFINITE_SAMPLE);
        UniformRandomProvider rng = Seeds.random(17);
        for (CovarianceMatrix c : new CovarianceMatrix[] {sample, population}) {
            BicScore bic = BicScore.of(c, 1.3);
            EbicScore ebic = EbicScore.of(bic, 0.0);
            for (int trial = 0; trial < 50; trial++) {
                int y = rng.nextInt(9);
                int[] parents = ScoreTesting.randomParents(rng, 9, y, rng.nextInt(6));
                assertEquals(bic.localScore(y, parents), ebic.localScore(y, parents), 0.0);
            }
        }
    }

    @Test
    @DisplayName("by hand, p = 5, n = 200, node 4 given {0, 2}, gamma = 0.5: −2 · score equals −2 · (Gaussian"
            + " log-likelihood of Commons Math OLS residuals) + 4 · ln 200 + 2 · 0.5 · 2 · ln 4 (Chen and Chen 2008;"
            + " Foygel and Drton 2010, linear form)")
    void penaltyByHand() {
        DataSet data = ScoreData.linearGaussian(RandomDags.erdosRenyi(5, 2.0, 8), 200, 1);
        int[] parents = {0, 2};
        double[][] x = new double[200][2];
        for (int r = 0; r < 200; r++) {
            x[r][0] = data.continuous(0)[r];
            x[r][1] = data.continuous(2)[r];
        }
        OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
        ols.newSampleData(data.continuous(4).clone(), x);
        double logLik = -0.5 * 200 * (Math.log(2 * Math.PI * ols.calculateResidualSumOfSquares() / 200) + 1);
        // k = 2 parents, 2 + 2 parameters in the BIC part, p − 1 = 4 candidate parents
        double ebic = -2 * logLik + 4 * Math.log(200) + 2 * 0.5 * 2 * Math.log(4);
        EbicScore score = EbicScore.of(BicScore.of(data.covariance(), 1.0), 0.5);
        assertEquals(ebic, -2 * score.localScore(4, parents), 1e-9 * Math.abs(ebic));
        // the extra term is per parent: nothing for the empty set, γ · ln(p − 1) more per parent
        BicScore bic = BicScore.of(data.covariance(), 1.0);
        assertEquals(bic.localScore(4, new int[0]), score.localScore(4, new int[0]), 0.0);
        assertEquals(0.5 * 3 * Math.log(4), bic.localScore(3, new int[] {0, 1, 2})
                - score.localScore(3, new int[] {0, 1, 2}), 1e-9);
    }

    @Test
    @DisplayName("Markov-equivalent DAGs (a covered edge reversed) get equal EBIC: the extra term depends only on"
            + " the parent-set size, and a covered-edge reversal keeps the sizes (Chickering 1995)")
    void scoreEquivalence() {
        ScoreTesting.assertCoveredReversalsScoreEqual(seed -> EbicScore.of(BicScore.of(ScoreData.linearGaussian(
                RandomDags.erdosRenyi(7, 3.0, seed + 1000), 150, seed).covariance(), 1.0), 1.0));
    }

    @Test
    @DisplayName("bad gamma gets one clear message")
    void rejectsBadGamma() {
        BicScore bic = BicScore.of(ScoreData.linearGaussian(RandomDags.erdosRenyi(3, 1.0, 2), 50, 3).covariance(), 1);
        for (double g : new double[] {-0.1, 1.5, Double.NaN}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> EbicScore.of(bic, g));
            assertTrue(e.getMessage().contains("gamma"), e.getMessage());
        }
        assertTrue(EbicScore.of(bic, 0.5).describe().startsWith("ebic(gamma=0.5"));
    }
}
