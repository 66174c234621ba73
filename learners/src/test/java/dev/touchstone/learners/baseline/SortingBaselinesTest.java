package dev.touchstone.learners.baseline;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.learners.score.ScoreData;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SortingBaselinesTest {

    private static Graph learn(Learner l, DataSet d) {
        return l.learn(LearnerInput.of(d), Knowledge.none(), ParameterValues.none(), RunContext.unlimited(1)).graph();
    }

    /** Share of true edges found adjacent whose direction is also right. */
    private static double[] recallAndOrientation(Graph truth, Graph est) {
        int found = 0;
        int right = 0;
        for (Edge e : truth.edges()) {
            int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
            int to = e.other(from);
            if (est.adjacent(from, to)) {
                found++;
                if (est.hasDirected(from, to)) {
                    right++;
                }
            }
        }
        return new double[] {found / (double) truth.edgeCount(), found == 0 ? Double.NaN : right / (double) found};
    }

    static DataSet standardised(DataSet d) {
        DataSet.Builder b = DataSet.builder(d.rows());
        for (int j = 0; j < d.columns(); j++) {
            double[] x = d.continuous(j);
            double mean = 0;
            for (double v : x) {
                mean += v;
            }
            mean /= x.length;
            double ss = 0;
            for (double v : x) {
                ss += (v - mean) * (v - mean);
            }
            double sd = Math.sqrt(ss / (x.length - 1));
            double[] z = new double[x.length];
            for (int r = 0; r < x.length; r++) {
                z[r] = (x[r] - mean) / sd;
            }
            b.continuous(d.variable(j).name(), z);
        }
        return b.build();
    }

    @Test
    @DisplayName("Variance sorting orients most edges on raw data and falls to chance after standardising"
            + " (Reisach, Seiler and Weichwald 2021, qualitative, from memory)")
    void varianceSortingExploitsScale() {
        double rawRight = 0;
        double stdRight = 0;
        int graphs = 12;
        for (int s = 0; s < graphs; s++) {
            Graph truth = RandomDags.erdosRenyi(10, 2.0, 100 + s);
            DataSet raw = ScoreData.linearGaussian(truth, 3000, 200 + s);
            rawRight += recallAndOrientation(truth, learn(new VarianceSortLearner(), raw))[1];
            stdRight += recallAndOrientation(truth, learn(new VarianceSortLearner(), standardised(raw)))[1];
        }
        rawRight /= graphs;
        stdRight /= graphs;
        assertTrue(rawRight > 0.8, "raw data: share of found edges oriented right " + rawRight);
        assertTrue(stdRight > 0.25 && stdRight < 0.75, "standardised data: near chance (0.5), got " + stdRight);
    }

    @Test
    @DisplayName("The sparse regression finds the true parents of a sink once the order is right (common practice)")
    void regressionStepRecoversParents() {
        Graph truth = RandomDags.erdosRenyi(8, 2.0, 5);
        DataSet raw = ScoreData.linearGaussian(truth, 20000, 6);
        double[] rec = recallAndOrientation(truth, learn(new VarianceSortLearner(), raw));
        assertTrue(rec[0] > 0.85, "adjacency recall " + rec[0]);
    }

    @Test
    @DisplayName("R² of each variable on all others equals Commons Math OLS R² (Commons Math 3.6.1)")
    void r2MatchesOrdinaryLeastSquares() {
        Graph truth = RandomDags.erdosRenyi(6, 2.0, 9);
        DataSet d = ScoreData.linearGaussian(truth, 2000, 10);
        double[] r2 = R2SortLearner.r2(d.covariance());
        int p = d.columns();
        for (int j = 0; j < p; j++) {
            double[][] x = new double[d.rows()][p - 1];
            double[] y = new double[d.rows()];
            for (int r = 0; r < d.rows(); r++) {
                y[r] = d.value(r, j);
                int k = 0;
                for (int c = 0; c < p; c++) {
                    if (c != j) {
                        x[r][k++] = d.value(r, c);
                    }
                }
            }
            OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
            ols.newSampleData(y, x);
            assertEquals(ols.calculateRSquared(), r2[j], 1e-9, "variable " + j);
        }
    }

    @Test
    @DisplayName("The random DAG baseline has the asked-for expected density (binomial mean, 5 standard errors)")
    void randomDagDensity() {
        java.util.List<String> names = RandomDags.names(40);
        DataSet d = ScoreData.linearGaussian(Graph.empty(names), 10, 1);
        Learner l = new RandomDagLearner();
        long edges = 0;
        int runs = 50;
        for (int s = 0; s < runs; s++) {
            ParameterValues pv = ParameterValues.resolve("random-dag", l.description().parameters(),
                    java.util.Map.of("mean_degree", 3.0));
            edges += l.learn(LearnerInput.of(d), Knowledge.none(), pv, RunContext.unlimited(s)).graph().edgeCount();
        }
        double pairs = 40 * 39 / 2.0;
        double prob = 3.0 / 39;
        double mean = pairs * prob;
        double se = Math.sqrt(pairs * prob * (1 - prob) / runs);
        assertEquals(mean, edges / (double) runs, 5 * se);
    }
}
