package dev.touchstone.learners.functional;

import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.ArrayList;
import java.util.List;

/**
 * CAM's preliminary neighbourhood selection (Bühlmann, Peters and Ernest 2014, Annals of
 * Statistics 42, Section 3.1: a sparse additive fit of each node on all others keeps a few
 * candidate parents). Declared form: componentwise L2-boosting with P-spline base learners
 * (Bühlmann and Yu 2003, JASA 98; Bühlmann and Hothorn 2007, Statistical Science 22): the
 * node's centred values are the first residual; at each of {@value #STEPS} steps every allowed
 * variable's P-spline (its penalty fixed at the grid value whose effective degrees of freedom
 * are nearest {@value #BASE_DF}) is fitted to the residual, the best-fitting one is taken and
 * {@value #STEP_LENGTH} of its fit is subtracted. A variable's importance is the total decrease
 * of the residual sum of squares it brought; each node keeps the {@code candidates} allowed
 * variables of largest importance (ties, including never-chosen variables, by column).
 * Step count, step length and base degrees of freedom are common practice for boosting, not
 * taken from the paper.
 *
 * <p>A multivariate fit rather than a ranking of univariate fits, because a node's children
 * and spouses can fit it alone better than a weak parent does; boosting picks up what is left
 * after the strongest neighbours. When every allowed variable would be kept anyway, no
 * boosting is done. Cost: {@value #STEPS} · p base fits of O(4n + m²) per node.
 */
final class NeighbourhoodSelection {

    static final int STEPS = 100;
    static final double STEP_LENGTH = 0.1;
    static final double BASE_DF = 4.0;

    private NeighbourhoodSelection() {
    }

    /** eligible[j][k]: j is among the kept candidates of k, or j → k is required. */
    static boolean[][] select(double[][] x, List<PSplineSmoother> smoothers, KnowledgeIndex rules, int candidates,
            RunContext context) {
        int p = x.length;
        boolean[][] eligible = new boolean[p][p];
        for (int k = 0; k < p; k++) {
            context.checkDeadline();
            List<Integer> allowed = new ArrayList<>();
            for (int j = 0; j < p; j++) {
                if (rules.isAllowed(j, k)) {
                    allowed.add(j);
                }
            }
            if (allowed.size() > candidates) {
                double[] importance = importance(x[k], smoothers, allowed, context);
                List<Integer> ranked = new ArrayList<>(allowed);
                ranked.sort((a, b) -> importance[a] != importance[b]
                        ? Double.compare(importance[b], importance[a]) : Integer.compare(a, b));
                allowed = ranked.subList(0, candidates);
            }
            for (int j : allowed) {
                eligible[j][k] = true;
            }
            for (int j = 0; j < p; j++) {
                eligible[j][k] |= rules.isRequired(j, k);
            }
        }
        return eligible;
    }

    /** Residual-sum-of-squares decrease brought by each variable (indexed by column) in boosting y. */
    private static double[] importance(double[] y, List<PSplineSmoother> smoothers, List<Integer> allowed,
            RunContext context) {
        int n = y.length;
        double[] residual = AdditiveRegression.centred(y);
        double[] importance = new double[smoothers.size()];
        double[] fit = new double[n];
        double[] bestFit = new double[n];
        for (int step = 0; step < STEPS; step++) {
            context.checkDeadline();
            int best = -1;
            double bestRss = Double.POSITIVE_INFINITY;
            for (int j : allowed) {
                PSplineSmoother s = smoothers.get(j);
                s.smoothAt(s.indexNearestEdf(BASE_DF), residual, fit);
                double rss = 0;
                for (int i = 0; i < n; i++) {
                    double d = residual[i] - fit[i];
                    rss += d * d;
                }
                if (rss < bestRss) {
                    bestRss = rss;
                    best = j;
                    System.arraycopy(fit, 0, bestFit, 0, n);
                }
            }
            double before = 0;
            double after = 0;
            for (int i = 0; i < n; i++) {
                before += residual[i] * residual[i];
                residual[i] -= STEP_LENGTH * bestFit[i];
                after += residual[i] * residual[i];
            }
            importance[best] += before - after;
        }
        return importance;
    }
}
