package dev.touchstone.learners.baseline;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.regression.AdaptiveLasso;

/**
 * The sort-and-regress baselines of Reisach, Seiler and Weichwald (2021, "Beware of the
 * simulated DAG! Causal discovery benchmarks may be easy to game", NeurIPS): order the
 * variables by a statistic that scale artefacts of simulated data make increase along the
 * causal order, then regress each variable on all earlier ones with a sparse regression
 * ({@link AdaptiveLasso}) and keep the non-zero coefficients as parents. A benchmark on
 * which such a baseline does well rewards the data's scale, not causal discovery.
 *
 * <p>Cost: the shared covariance plus one sparse regression per variable on up to p − 1
 * candidates, O(p⁴) in the worst case, fine for the tens to hundreds of variables of
 * typical studies.
 */
abstract class SortAndRegress extends DeclaredLearner {

    SortAndRegress(String id, String summary, String publication, String sortAssumption) {
        super(LearnerDescription.builder(id).summary(summary).publication(publication)
                .family(LearnerFamily.BASELINE).accepts(DataKind.CONTINUOUS).returns(GraphClass.DAG)
                .missingValues(MissingValues.LIST_WISE)
                .assumption(sortAssumption)
                .assumption("linear relations (the regression step is a linear sparse regression)")
                .build());
    }

    /** The variables in the order the baseline believes causal (first = root). */
    abstract int[] order(CovarianceMatrix cov);

    @Override
    protected final Estimate run(LearnerRun run) {
        RunContext context = run.context();
        CovarianceMatrix cov = run.input().data().covariance();
        int p = cov.dimension();
        double[] s = cov.toArray();
        int[] order = order(cov);
        MutableGraph g = Graph.builder(run.names());
        for (int k = 1; k < p; k++) {
            context.checkDeadline();
            int target = order[k];
            int[] candidates = java.util.Arrays.copyOf(order, k);
            double[] beta = AdaptiveLasso.fit(s, p, Math.max(cov.sampleSize(), 2), target, candidates);
            for (int a = 0; a < k; a++) {
                if (beta[a] != 0) {
                    g.addDirected(candidates[a], target);
                }
            }
        }
        return Estimate.of(g.freeze(), GraphClass.DAG);
    }

    /** Indices sorted by increasing key, ties by index (so the order is deterministic). */
    static int[] ascending(double[] key) {
        Integer[] idx = new Integer[key.length];
        for (int i = 0; i < idx.length; i++) {
            idx[i] = i;
        }
        java.util.Arrays.sort(idx, (a, b) -> {
            int c = Double.compare(key[a], key[b]);
            return c != 0 ? c : Integer.compare(a, b);
        });
        int[] out = new int[idx.length];
        for (int i = 0; i < idx.length; i++) {
            out[i] = idx[i];
        }
        return out;
    }
}
