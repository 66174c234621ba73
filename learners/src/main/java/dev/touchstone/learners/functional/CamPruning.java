package dev.touchstone.learners.functional;

import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import org.apache.commons.statistics.distribution.FDistribution;

import java.util.ArrayList;
import java.util.List;

/**
 * The last stage of CAM (Bühlmann, Peters and Ernest 2014, Annals of Statistics 42, Section
 * 3.2): each node's additive model is fitted on the parents the search gave it, and the parents
 * whose smooth term is not significant at {@code level} are dropped, all at once (the paper uses
 * the p-values of its additive-model software at 0.001).
 *
 * <p><b>Declared test.</b> For parent j of x_k, an F-test of the nested additive fits with and
 * without j: F = ((RSS₀ − RSS₁)/d_j) / (RSS₁/(n − d)), where RSS₁ and d are the residual sum
 * of squares and effective degrees of freedom of the full fit, RSS₀ that of the fit without j
 * and d_j the effective degrees of freedom of j's term in the full fit; the p-value is the
 * upper tail of F(d_j, n − d) (the approximate F-test for smoothing terms of Hastie and
 * Tibshirani 1990, §3.9). Required parents are never dropped. Cost: one additive fit per
 * node plus one per parent.
 */
final class CamPruning {

    private CamPruning() {
    }

    /** The parent lists with the non-significant parents removed; required edges are kept. */
    static List<List<Integer>> prune(double[][] x, List<PSplineSmoother> smoothers, List<List<Integer>> parents,
            KnowledgeIndex rules, double level, RunContext context) {
        List<List<Integer>> kept = new ArrayList<>();
        for (int k = 0; k < parents.size(); k++) {
            context.checkDeadline();
            List<Integer> pa = parents.get(k);
            List<Integer> out = new ArrayList<>();
            if (!pa.isEmpty()) {
                AdditiveRegression.Fit full = fit(x[k], smoothers, pa, -1, context);
                for (int a = 0; a < pa.size(); a++) {
                    int j = pa.get(a);
                    if (rules.isRequired(j, k)) {
                        out.add(j);
                        continue;
                    }
                    context.checkDeadline();
                    AdditiveRegression.Fit without = fit(x[k], smoothers, pa, a, context);
                    if (pValue(full, without, a, x[k].length) < level) {
                        out.add(j);
                    }
                }
            }
            out.sort(Integer::compare);
            kept.add(out);
        }
        return kept;
    }

    /**
     * The F-test p-value of term {@code a} of {@code full} against the fit {@code without} it,
     * as in the class comment; 1 when the full fit leaves no residual degrees of freedom.
     */
    static double pValue(AdditiveRegression.Fit full, AdditiveRegression.Fit without, int a, int n) {
        double termDf = Math.max(full.termEdf(a), 1e-3);
        double residualDf = n - full.edf();
        if (residualDf <= 0 || full.rss() <= 0) {
            return full.rss() <= 0 && without.rss() > 0 ? 0.0 : 1.0;
        }
        double f = Math.max(0, without.rss() - full.rss()) / termDf / (full.rss() / residualDf);
        return FDistribution.of(termDf, residualDf).survivalProbability(f);
    }

    /** The additive fit of y on {@code parents}, leaving out the one at position {@code skip} (−1: none). */
    private static AdditiveRegression.Fit fit(double[] y, List<PSplineSmoother> smoothers, List<Integer> parents,
            int skip, RunContext context) {
        List<PSplineSmoother> terms = new ArrayList<>();
        for (int a = 0; a < parents.size(); a++) {
            if (a != skip) {
                terms.add(smoothers.get(parents.get(a)));
            }
        }
        context.countScores(1);
        return AdditiveRegression.fit(y, terms);
    }
}
