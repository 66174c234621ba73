package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.learner.RunContext;

import java.util.ArrayList;
import java.util.List;

/**
 * Finds, for each variable with missing cells, the variables that cause its missingness
 * indicator R (1 where the cell is missing), the first step of the missing-value PC of Tu,
 * Zhang, Ackermann, Mohan, Kjellström and Zhang (2019, AISTATS, PMLR 89): an adjacency search
 * between R and the other variables by Fisher z with test-wise deletion, removing a variable
 * once R is independent of it given a subset of the remaining candidates. Under the paper's
 * assumptions (indicators have no children and are not caused by their own variable) the
 * adjacencies left are R's causes.
 *
 * <p>The indicator enters Fisher z as a 0/1 column: a point-biserial partial correlation,
 * common practice for a binary variable against Gaussian ones, and what the linear Gaussian
 * form of the method needs. Cost: for each incomplete column, O(p) tests at level 0, then
 * O(c · C(c, ℓ)) for the c candidates left at each level ℓ ≤ depth, each test O(n).
 */
public final class MissingnessCauses {

    private MissingnessCauses() {
    }

    /**
     * The causes found, per column (empty for a column without missing cells).
     *
     * @param depth the largest conditioning set tried
     */
    public static int[][] find(DataSet data, double alpha, int depth, RunContext context) {
        int p = data.columns();
        List<Integer> incomplete = new ArrayList<>();
        for (int j = 0; j < p; j++) {
            if (data.missingCount(j) > 0) {
                incomplete.add(j);
            }
        }
        int[][] causes = new int[p][0];
        if (incomplete.isEmpty()) {
            return causes;
        }
        DataSet.Builder b = DataSet.builder(data.rows());
        for (int j = 0; j < p; j++) {
            b.continuous(data.variable(j).name(), data.continuous(j));
        }
        for (int j : incomplete) {
            double[] r = new double[data.rows()];
            for (int row = 0; row < r.length; row++) {
                r[row] = data.isMissing(row, j) ? 1.0 : 0.0;
            }
            b.continuous("missing indicator " + j, r);
        }
        TestwiseFisherZTest test = new TestwiseFisherZTest(b.build(), alpha);
        for (int k = 0; k < incomplete.size(); k++) {
            int j = incomplete.get(k);
            int indicator = p + k;
            List<Integer> candidates = new ArrayList<>();
            for (int v = 0; v < p; v++) {
                context.checkDeadline();
                if (v != j) {
                    context.countTests(1);
                    if (!test.independent(indicator, v, new int[0])) {
                        candidates.add(v);
                    }
                }
            }
            for (int level = 1; level <= depth && candidates.size() > level; level++) {
                for (int v : new ArrayList<>(candidates)) {
                    List<Integer> others = new ArrayList<>(candidates);
                    others.remove(Integer.valueOf(v));
                    if (separatedBySubset(test, indicator, v, others, level, context)) {
                        candidates.remove(Integer.valueOf(v));
                    }
                }
            }
            causes[j] = candidates.stream().mapToInt(Integer::intValue).toArray();
        }
        return causes;
    }

    /** Whether some subset of {@code others} of size {@code level} makes the indicator independent of v. */
    private static boolean separatedBySubset(IndependenceTest test, int indicator, int v, List<Integer> others,
                                             int level, RunContext context) {
        // Earlier removals at this level can leave fewer candidates than the subset size.
        if (others.size() < level) {
            return false;
        }
        int[] idx = new int[level];
        for (int i = 0; i < level; i++) {
            idx[i] = i;
        }
        int[] s = new int[level];
        while (true) {
            context.checkDeadline();
            for (int i = 0; i < level; i++) {
                s[i] = others.get(idx[i]);
            }
            context.countTests(1);
            if (test.independent(indicator, v, s)) {
                return true;
            }
            int i = level - 1;
            while (i >= 0 && idx[i] == others.size() - level + i) {
                i--;
            }
            if (i < 0) {
                return false;
            }
            idx[i]++;
            for (int t = i + 1; t < level; t++) {
                idx[t] = idx[t - 1] + 1;
            }
        }
    }
}
