package dev.touchstone.learners.functional;

import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.ArrayList;
import java.util.List;

/**
 * The first two stages of CAM (Bühlmann, Peters and Ernest 2014, Annals of Statistics 42,
 * Sections 3.1 and 4): preliminary neighbourhood selection and the greedy search that adds,
 * one edge at a time, the edge j → k with the largest increase of the Gaussian log-likelihood
 * −(n/2) Σ_k log σ̂²_k, where σ̂²_k is the residual variance of an additive fit of x_k on its
 * parents ({@link AdditiveRegression}).
 *
 * <p><b>Neighbourhood selection</b> keeps {@code candidates} candidate parents per node by
 * componentwise boosting ({@link NeighbourhoodSelection}); only candidates are searched.
 *
 * <p><b>Search.</b> An edge is eligible when its parent is a candidate, knowledge allows it, it
 * is not yet there and it closes no cycle (ancestry kept as a reachability matrix). The best
 * eligible edge is added while its gain is positive; ties go to the smaller parent, then the
 * smaller child. After adding j → k only the gains into k change, so only those are refitted.
 * Required edges are placed before the search. Cost: the selection, one univariate fit per candidate, then one
 * additive fit per candidate of the child of each added edge.
 */
final class CamOrderSearch {

    private final List<PSplineSmoother> smoothers;
    private final double[][] x;
    private final RunContext context;
    private final int p;
    private final int n;

    private CamOrderSearch(double[][] x, List<PSplineSmoother> smoothers, RunContext context) {
        this.x = x;
        this.smoothers = smoothers;
        this.context = context;
        this.p = x.length;
        this.n = x.length == 0 ? 0 : x[0].length;
    }

    /**
     * The DAG found by the search, as parent lists.
     *
     * @param x the columns
     * @param smoothers one smoother per column
     * @param rules the edges knowledge allows and requires
     * @param candidates number of candidate parents kept per node
     * @throws LearnerException if the required edges form a cycle
     */
    static List<List<Integer>> search(double[][] x, List<PSplineSmoother> smoothers, KnowledgeIndex rules,
            int candidates, RunContext context) {
        return new CamOrderSearch(x, smoothers, context).run(rules, candidates);
    }

    private List<List<Integer>> run(KnowledgeIndex rules, int candidates) {
        double[] logVariance = new double[p];
        for (int k = 0; k < p; k++) {
            logVariance[k] = logResidualVariance(k, List.of());
        }
        boolean[][] eligible = NeighbourhoodSelection.select(x, smoothers, rules, candidates, context);
        double[][] gain = univariateGains(eligible, logVariance);
        List<List<Integer>> parents = new ArrayList<>();
        for (int k = 0; k < p; k++) {
            parents.add(new ArrayList<>());
        }
        boolean[][] reach = new boolean[p][p];
        for (int j = 0; j < p; j++) {
            for (int k = 0; k < p; k++) {
                if (rules.isRequired(j, k)) {
                    if (reach[k][j]) {
                        throw new LearnerException("learner " + CamLearner.ID + ": the required edges form a cycle through "
                                + rules.name(j) + " -> " + rules.name(k));
                    }
                    addEdge(j, k, parents, reach, eligible);
                }
            }
        }
        for (int k = 0; k < p; k++) {
            if (!parents.get(k).isEmpty()) {
                logVariance[k] = logResidualVariance(k, parents.get(k));
                refreshGains(k, parents, eligible, logVariance, gain);
            }
        }
        while (true) {
            context.checkDeadline();
            int bestJ = -1;
            int bestK = -1;
            double best = 0;
            for (int j = 0; j < p; j++) {
                for (int k = 0; k < p; k++) {
                    if (eligible[j][k] && !reach[k][j] && gain[j][k] > best) {
                        best = gain[j][k];
                        bestJ = j;
                        bestK = k;
                    }
                }
            }
            if (bestJ < 0) {
                return parents;
            }
            addEdge(bestJ, bestK, parents, reach, eligible);
            logVariance[bestK] -= best;
            refreshGains(bestK, parents, eligible, logVariance, gain);
        }
    }

    /** gain[j][k] of x_j as the only parent of x_k, for the eligible pairs (−∞ elsewhere). */
    private double[][] univariateGains(boolean[][] eligible, double[] logVariance) {
        double[][] gain = new double[p][p];
        for (int j = 0; j < p; j++) {
            context.checkDeadline();
            for (int k = 0; k < p; k++) {
                gain[j][k] = eligible[j][k] ? logVariance[k] - logResidualVariance(k, List.of(j)) : Double.NEGATIVE_INFINITY;
            }
        }
        return gain;
    }

    private void addEdge(int j, int k, List<List<Integer>> parents, boolean[][] reach, boolean[][] eligible) {
        parents.get(k).add(j);
        eligible[j][k] = false;
        for (int u = 0; u < p; u++) {
            if (u == j || reach[u][j]) {
                for (int w = 0; w < p; w++) {
                    if (w == k || reach[k][w]) {
                        reach[u][w] = true;
                    }
                }
            }
        }
    }

    /** Re-fits the gain of every still-eligible parent of {@code k} given k's current parents. */
    private void refreshGains(int k, List<List<Integer>> parents, boolean[][] eligible, double[] logVariance,
            double[][] gain) {
        for (int j = 0; j < p; j++) {
            if (eligible[j][k]) {
                context.checkDeadline();
                List<Integer> with = new ArrayList<>(parents.get(k));
                with.add(j);
                gain[j][k] = logVariance[k] - logResidualVariance(k, with);
            }
        }
    }

    /** log σ̂² of the additive fit of x_k on {@code parents}; one score evaluation. */
    private double logResidualVariance(int k, List<Integer> parents) {
        List<PSplineSmoother> terms = new ArrayList<>(parents.size());
        for (int j : parents) {
            terms.add(smoothers.get(j));
        }
        context.countScores(1);
        double rss = AdditiveRegression.fit(x[k], terms).rss();
        // A perfect fit would give −∞; a floor far below any noise keeps gains finite and ordered.
        return Math.log(Math.max(rss / n, Double.MIN_NORMAL));
    }
}
