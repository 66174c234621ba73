package dev.touchstone.learners.score;

import dev.touchstone.core.learner.ParallelLoop;
import dev.touchstone.core.learner.RunContext;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.function.IntConsumer;

/**
 * Best order score search (Andrews, Ramsey, Sanchez-Romero, Camchong and Kummerfeld 2023,
 * "Fast scalable and accurate discovery of DAGs using the best order score search and
 * grow-shrink trees", NeurIPS; its move and loop as we recall them, from memory): a local search over variable orders in
 * which one move takes a variable out of the order and puts it back where the DAG the order
 * induces scores best.
 *
 * <p><b>One move</b> ("better mutation"). Take v out of the order π, leaving σ. Putting v at
 * index i of σ changes only two kinds of terms: v's own score, with σ[0..i) as predecessors,
 * and, for each w = σ[j], whether v is among w's predecessors (j ≥ i) or not (j &lt; i). So
 * every w is scored twice, with and without v (d_w = with − without), and v once per index;
 * the gain of index i over v's current index c is then
 * s_v(i) − s_v(c) + Σ_{i ≤ j &lt; c} d_σ[j] (for i &lt; c) or − Σ_{c ≤ j &lt; i} d_σ[j] (for i &gt; c),
 * about 2p grow-shrink queries per move and one walk of v's tree that answers for every index at
 * once ({@link GrowShrinkTree#scoresAlongOrder}); the query with v is skipped when the one without v
 * never asked whether v precedes w (v then cannot change w's path through the tree). Summing differences rather than totals keeps the
 * comparison exact where nothing changed (d_w is exactly 0 when v does not enter w's
 * parents), which matters with the oracle's scores of order 10⁹. v moves to the best index
 * when its gain exceeds the rounding tolerance; indices that would put a required parent
 * after v or a required child before it are not tried.
 *
 * <p><b>Passes and starts.</b> A pass moves every variable once, in the order they stand at
 * its start; passes repeat until one improves nothing. Each start begins from a seeded random
 * order ({@link RunContext#random(String)}); the best-scoring final order over the starts is
 * kept (ties: the earlier start). The grow-shrink trees are shared by all of it.
 *
 * <p><b>Threads.</b> The 2(p − 1) with/without queries of a move touch each w's own tree
 * only, so they run in parallel across {@link RunContext#threads()}; the walk of v's tree, which
 * expands the nodes v reaches at every index and was about half of a move's work in a profile at
 * p = 1,000, hands its subtrees to the same pool. The result does not depend on the thread count
 * (every query is a pure function of its tree).
 */
final class BossSearch {

    private final OrderScorer scorer;
    private final RunContext context;
    private final int starts;
    private final int p;
    private int passes;
    private int moves;
    /** Fewer variables than this search on the caller's thread: handing out would cost more than it saves. */
    private static final int MIN_PARALLEL = 64;
    private ParallelLoop pool = ParallelLoop.of(1);

    BossSearch(OrderScorer scorer, int starts, RunContext context) {
        this.scorer = scorer;
        this.context = context;
        this.starts = starts;
        this.p = scorer.variableCount();
    }

    int passes() {
        return passes;
    }

    int moves() {
        return moves;
    }

    /** The best order found over all starts. */
    int[] run() {
        UniformRandomProvider rng = context.random("boss starting orders");
        pool = ParallelLoop.of(p >= MIN_PARALLEL ? context.threads() : 1);
        try {
            int[] best = null;
            double bestScore = Double.NEGATIVE_INFINITY;
            for (int s = 0; s < starts; s++) {
                context.checkDeadline();
                int[] order = scorer.randomOrder(rng);
                climb(order);
                double total = scorer.score(order);
                if (best == null || total > bestScore + tolerance(bestScore)) {
                    best = order;
                    bestScore = total;
                }
            }
            return best;
        } finally {
            pool.close();
        }
    }

    /** Passes of better mutations until one improves nothing; {@code order} is changed in place. */
    void climb(int[] order) {
        boolean improved = true;
        while (improved) {
            improved = false;
            passes++;
            int[] snapshot = order.clone();
            for (int v : snapshot) {
                context.checkDeadline();
                if (betterMutation(order, v)) {
                    improved = true;
                    moves++;
                }
            }
        }
    }

    /** Moves v to the index where the order scores best, if that beats its current index; true if it moved. */
    boolean betterMutation(int[] order, int v) {
        int current = -1;
        int[] sigma = new int[p - 1];
        int k = 0;
        for (int x : order) {
            if (x == v) {
                current = k;
            } else {
                sigma[k++] = x;
            }
        }
        int[] pos = new int[p];
        for (int j = 0; j < p - 1; j++) {
            pos[sigma[j]] = j;
        }
        pos[v] = Integer.MIN_VALUE;
        int lo = 0;
        int hi = p - 1;
        for (int r : scorer.requiredParents(v)) {
            lo = Math.max(lo, pos[r] + 1);
        }
        for (int c : scorer.requiredChildren(v)) {
            hi = Math.min(hi, pos[c]);
        }
        double[] d = new double[p - 1];
        double[] own = new double[p];
        int from = lo;
        int to = hi;
        parallel(p, task -> {
            if (task == p - 1) {
                scorer.tree(v).scoresAlongOrder(pos, from, to, own);
                return;
            }
            int w = sigma[task];
            int at = task;
            GrowShrinkTree tree = scorer.tree(w);
            boolean[] asked = new boolean[1];
            double without = tree.score(x -> {
                if (x == v) {
                    asked[0] = true;
                    return false;
                }
                return pos[x] < at;
            });
            // a query that never asked about v follows the same path when v is allowed
            d[task] = asked[0] ? tree.score(x -> x == v || pos[x] < at) - without : 0.0;
        });
        double tol = tolerance(own[current]);
        int bestIndex = current;
        double bestGain = 0;
        double sum = 0;
        for (int i = current - 1; i >= lo; i--) {
            sum += d[i];
            double gain = own[i] - own[current] + sum;
            if (gain > bestGain + tol) {
                bestGain = gain;
                bestIndex = i;
            }
        }
        sum = 0;
        for (int i = current + 1; i <= hi; i++) {
            sum -= d[i - 1];
            double gain = own[i] - own[current] + sum;
            if (gain > bestGain + tol) {
                bestGain = gain;
                bestIndex = i;
            }
        }
        if (bestIndex == current) {
            return false;
        }
        int j = 0;
        for (int i = 0; i < p; i++) {
            order[i] = i == bestIndex ? v : sigma[j++];
        }
        return true;
    }

    /** Rounding tolerance for comparing sums of local scores of this magnitude. */
    static double tolerance(double magnitude) {
        return GrowShrinkTree.tolerance(magnitude);
    }

    private void parallel(int count, IntConsumer body) {
        pool.run(count, 1, body);
    }
}
