package dev.touchstone.learners.score;

import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * The highest-scoring DAG under a decomposable score, found exactly by dynamic programming
 * over subsets of the variables (Koivisto and Sood 2004, JMLR 5; Silander and Myllymäki
 * 2006, UAI). Two stages:
 *
 * <ol>
 *   <li><b>Candidate parent sets.</b> For each node v, every parent set S of at most
 *       {@code parentLimit} other variables is scored once. A set is kept only when it scores
 *       strictly more than every proper subset of it; a superset that does not beat one of its
 *       subsets is never the best choice among any candidates containing it (pruning of this
 *       kind: Teyssier and Koller 2005; de Campos and Ji 2011). The kept sets are sorted by
 *       score, so the best parents of v within candidates C are the first kept set contained in
 *       C ("best parent set" of Silander and Myllymäki, here without their 2^(p−1) table per
 *       node).</li>
 *   <li><b>Best sink order.</b> For every subset W of the variables, best(W) = max over v in W
 *       of best(W \ {v}) + bestParents(v, W \ {v}): the best DAG on W has some sink v whose
 *       parents come from the rest (Silander and Myllymäki 2006, eq. 5). The sink chosen for W
 *       is kept (one byte), and the optimum is read back from W = all variables down.</li>
 * </ol>
 *
 * <p>Knowledge: a forbidden parent never enters a candidate set; a set lacking a required
 * parent of v is not a candidate of v (so orders that put a required parent after its child
 * are infeasible).
 *
 * <p>Ties. Score-equivalent scores give every DAG of an equivalence class the same score, so
 * tied sink choices are normal. To tell whether different classes tie, {@link #optimalDags}
 * walks every tied decision (sink, or non-nested parent sets, within {@code tolerance} of the
 * optimum) from the top, remembering visited states (subset left, parents chosen so far), up
 * to a budget of states; the caller maps the DAGs found to classes. Ties between nested
 * parent sets are settled for the smaller set by the pruning.
 *
 * <p>Cost: Σ_{j≤k} C(p−1, j) local scores per node; 2^p doubles and bytes for the order stage
 * (p = 24: 150 MB) and per node one array of 2^(p−1) doubles while its candidates are pruned;
 * time of the order stage 2^p · p/2 scans of the kept lists. Not thread-safe; one per run.
 */
final class ExactSearch {

    private final LocalScore score;
    private final KnowledgeIndex knowledge;
    private final int parentLimit;
    private final RunContext context;
    private final int p;

    /** Per node: kept parent sets as masks over all variables, sorted by descending score. */
    private int[][] keptMasks;
    private double[][] keptScores;
    private double[] best;
    private byte[] sink;
    private long localScores;

    ExactSearch(LocalScore score, KnowledgeIndex knowledge, int parentLimit, RunContext context) {
        this.score = score;
        this.knowledge = knowledge;
        this.p = score.variableCount();
        this.parentLimit = parentLimit < 0 ? p - 1 : Math.min(parentLimit, p - 1);
        this.context = context;
    }

    /** Runs both stages; returns the parents of each node in one optimal DAG, as bit masks. */
    int[] run() {
        keptMasks = new int[p][];
        keptScores = new double[p][];
        double[] bestWithin = new double[1 << (p - 1)];
        for (int v = 0; v < p; v++) {
            pruneCandidates(v, bestWithin);
        }
        orderStage();
        if (best[(1 << p) - 1] == Double.NEGATIVE_INFINITY) {
            throw new IllegalStateException("no DAG satisfies the knowledge within the parent limit");
        }
        int[] parents = new int[p];
        int w = (1 << p) - 1;
        while (w != 0) {
            int v = sink[w];
            int c = w & ~(1 << v);
            parents[v] = keptMasks[v][firstFitting(v, c)];
            w = c;
        }
        return parents;
    }

    /** The optimal score (after {@link #run}). */
    double optimum() {
        return best[(1 << p) - 1];
    }

    /** The number of local scores evaluated. */
    long localScoresEvaluated() {
        return localScores;
    }

    /** The number of candidate parent sets kept over all nodes. */
    long candidatesKept() {
        long n = 0;
        for (int[] m : keptMasks) {
            n += m.length;
        }
        return n;
    }

    /** Fills the kept candidates of v; {@code bestWithin} is scratch of 2^(p−1) entries. */
    private void pruneCandidates(int v, double[] bestWithin) {
        int[] others = new int[p - 1];
        for (int i = 0, j = 0; i < p; i++) {
            if (i != v) {
                others[j++] = i;
            }
        }
        int requiredMask = 0;
        for (int u : others) {
            if (knowledge.isRequired(u, v)) {
                requiredMask |= 1 << u;
            }
        }
        int size = 1 << (p - 1);
        // bestWithin[m]: best score of a valid candidate inside m (indices into others), for |m| ≤ limit
        long evaluated = 0;
        List<double[]> kept = new ArrayList<>();
        int[] buffer = new int[p];
        for (int m = 0; m < size; m++) {
            int k = Integer.bitCount(m);
            if (k > parentLimit) {
                continue;
            }
            if ((m & 0xFFF) == 0) {
                context.checkDeadline();
            }
            double inside = Double.NEGATIVE_INFINITY;
            for (int rest = m; rest != 0; rest &= rest - 1) {
                inside = Math.max(inside, bestWithin[m & ~Integer.lowestOneBit(rest)]);
            }
            int full = 0;
            boolean valid = true;
            for (int rest = m, j = 0; rest != 0; rest &= rest - 1, j++) {
                int u = others[Integer.numberOfTrailingZeros(rest)];
                buffer[j] = u;
                full |= 1 << u;
                valid &= !knowledge.isForbidden(u, v);
            }
            valid &= (full & requiredMask) == requiredMask;
            double own = Double.NEGATIVE_INFINITY;
            if (valid) {
                own = score.localScore(v, Arrays.copyOf(buffer, k));
                evaluated++;
                if (own > inside) {
                    kept.add(new double[] {own, full});
                }
            }
            bestWithin[m] = Math.max(own, inside);
        }
        localScores += evaluated;
        context.countScores(evaluated);
        kept.sort((a, b) -> Double.compare(b[0], a[0]));
        keptMasks[v] = new int[kept.size()];
        keptScores[v] = new double[kept.size()];
        for (int i = 0; i < kept.size(); i++) {
            keptScores[v][i] = kept.get(i)[0];
            keptMasks[v][i] = (int) kept.get(i)[1];
        }
    }

    /** Index of the best kept parent set of v inside the candidates c, or −1 when none is. */
    private int firstFitting(int v, int c) {
        int[] masks = keptMasks[v];
        int outside = ~c;
        for (int i = 0; i < masks.length; i++) {
            if ((masks[i] & outside) == 0) {
                return i;
            }
        }
        return -1;
    }

    private double bestParentsScore(int v, int c) {
        int i = firstFitting(v, c);
        return i < 0 ? Double.NEGATIVE_INFINITY : keptScores[v][i];
    }

    private void orderStage() {
        int size = 1 << p;
        best = new double[size];
        sink = new byte[size];
        best[0] = 0;
        for (int w = 1; w < size; w++) {
            if ((w & 0xFFFF) == 0) {
                context.checkDeadline();
            }
            double top = Double.NEGATIVE_INFINITY;
            int topSink = Integer.numberOfTrailingZeros(w);
            for (int rest = w; rest != 0; rest &= rest - 1) {
                int v = Integer.numberOfTrailingZeros(rest);
                int c = w & ~(1 << v);
                double below = best[c];
                if (below == Double.NEGATIVE_INFINITY) {
                    continue;
                }
                double total = below + bestParentsScore(v, c);
                if (total > top) {
                    top = total;
                    topSink = v;
                }
            }
            best[w] = top;
            sink[w] = (byte) topSink;
        }
    }

    /**
     * Optimal DAGs reachable through tied decisions (after {@link #run}): each as parent masks.
     *
     * @param tolerance    absolute slack below the optimum that still counts as a tie
     * @param stateBudget  the most states (subset left, parents chosen) visited
     * @return the DAGs found and whether the walk finished within the budget
     */
    TieWalk optimalDags(double tolerance, int stateBudget) {
        TieWalk walk = new TieWalk(stateBudget);
        walk.visit((1 << p) - 1, new int[p], 0.0, tolerance);
        return walk;
    }

    /** The result of walking the tied decisions: the distinct optimal DAGs met and whether the walk was complete. */
    final class TieWalk {
        private final int budget;
        private final Set<Key> seen = new HashSet<>();
        private final Set<Key> dags = new LinkedHashSet<>();
        private boolean complete = true;

        private TieWalk(int budget) {
            this.budget = budget;
        }

        /** The optimal DAGs found, as parent masks per node. */
        List<int[]> dags() {
            List<int[]> out = new ArrayList<>();
            for (Key k : dags) {
                out.add(k.parents.clone());
            }
            return out;
        }

        /** Whether every tied decision was followed (the budget was not reached). */
        boolean complete() {
            return complete;
        }

        /**
         * Visits subset w with the parents chosen above; {@code above} is the score of those
         * choices, so a decision ties when above + its score + best below ≥ optimum − tolerance.
         */
        private void visit(int w, int[] parents, double above, double tolerance) {
            if (!complete) {
                return;
            }
            Key key = new Key(w, parents.clone());
            if (!seen.add(key)) {
                return;
            }
            if (seen.size() > budget) {
                complete = false;
                return;
            }
            if ((seen.size() & 0xFF) == 0) {
                context.checkDeadline();
            }
            if (w == 0) {
                dags.add(new Key(0, parents.clone()));
                return;
            }
            double floor = optimum() - tolerance;
            for (int rest = w; rest != 0; rest &= rest - 1) {
                int v = Integer.numberOfTrailingZeros(rest);
                int c = w & ~(1 << v);
                if (best[c] == Double.NEGATIVE_INFINITY) {
                    continue;
                }
                int[] masks = keptMasks[v];
                double[] scores = keptScores[v];
                for (int i = 0; i < masks.length; i++) {
                    if ((masks[i] & ~c) != 0) {
                        continue;
                    }
                    if (above + scores[i] + best[c] < floor) {
                        break;
                    }
                    parents[v] = masks[i];
                    visit(c, parents, above + scores[i], tolerance);
                    parents[v] = 0;
                }
            }
        }
    }

    private record Key(int w, int[] parents) {
        @Override
        public boolean equals(Object o) {
            return o instanceof Key k && k.w == w && Arrays.equals(k.parents, parents);
        }

        @Override
        public int hashCode() {
            return 31 * w + Arrays.hashCode(parents);
        }
    }
}
