package dev.touchstone.learners.score;

import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.random.Shuffles;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Scores variable orders for the permutation searches: one {@link GrowShrinkTree} per
 * variable, the DAG an order induces (each variable's grow-shrink parents among its
 * predecessors: the minimal I-map of the order under a consistent score, Raskutti and Uhler
 * 2018, and the "DAG(π)" of Andrews et al. 2023) and its score, and the orders the background
 * knowledge allows (required edges keep their tail before their head).
 *
 * <p>The trees persist for the whole search, across moves and restarts, which is what makes
 * re-scoring an order cheap (Andrews et al. 2023). Not thread-safe as a whole; distinct
 * trees may be queried from distinct threads at once.
 */
final class OrderScorer {

    private final LocalScore score;
    private final KnowledgeIndex knowledge;
    private final GrowShrinkTree[] trees;
    private final int[][] requiredParents;
    private final int[][] requiredChildren;
    private final int p;

    OrderScorer(LocalScore score, KnowledgeIndex knowledge, int maxParents) {
        this.score = score;
        this.knowledge = knowledge;
        this.p = score.variableCount();
        this.trees = new GrowShrinkTree[p];
        List<List<Integer>> pa = new ArrayList<>();
        List<List<Integer>> ch = new ArrayList<>();
        for (int v = 0; v < p; v++) {
            pa.add(new ArrayList<>());
            ch.add(new ArrayList<>());
        }
        for (int[] e : knowledge.requiredEdges()) {
            pa.get(e[1]).add(e[0]);
            ch.get(e[0]).add(e[1]);
        }
        this.requiredParents = new int[p][];
        this.requiredChildren = new int[p][];
        for (int v = 0; v < p; v++) {
            requiredParents[v] = pa.get(v).stream().mapToInt(Integer::intValue).sorted().toArray();
            requiredChildren[v] = ch.get(v).stream().mapToInt(Integer::intValue).sorted().toArray();
        }
        boolean[] admissible = new boolean[p];
        for (int y = 0; y < p; y++) {
            for (int x = 0; x < p; x++) {
                admissible[x] = x != y && !knowledge.isForbidden(x, y);
            }
            trees[y] = new GrowShrinkTree(score, y, admissible, requiredParents[y], maxParents);
        }
    }

    int variableCount() {
        return p;
    }

    GrowShrinkTree tree(int v) {
        return trees[v];
    }

    int[] requiredParents(int v) {
        return requiredParents[v];
    }

    int[] requiredChildren(int v) {
        return requiredChildren[v];
    }

    /** Total nodes of all trees (for the cost figures). */
    long treeNodes() {
        long n = 0;
        for (GrowShrinkTree t : trees) {
            n += t.nodeCount();
        }
        return n;
    }

    /** position[v] = index of v in the order. */
    static int[] positions(int[] order) {
        int[] pos = new int[order.length];
        for (int i = 0; i < order.length; i++) {
            pos[order[i]] = i;
        }
        return pos;
    }

    /** The score of the DAG the order induces: the sum of each variable's grow-shrink score. */
    double score(int[] order) {
        int[] pos = positions(order);
        double total = 0;
        for (int v : order) {
            total += localScore(v, pos);
        }
        return total;
    }

    /** v's grow-shrink score with the variables before it in the order whose positions are {@code pos}. */
    double localScore(int v, int[] pos) {
        int at = pos[v];
        return trees[v].score(x -> pos[x] < at);
    }

    /** v's grow-shrink parents (sorted) among the variables before it in the order whose positions are {@code pos}. */
    int[] parents(int v, int[] pos) {
        int at = pos[v];
        return trees[v].parents(x -> pos[x] < at);
    }

    /** The DAG the order induces, as a PDAG with directed edges only. */
    Pdag dag(int[] order) {
        int[] pos = positions(order);
        Pdag dag = new Pdag(p);
        for (int v : order) {
            for (int parent : parents(v, pos)) {
                dag.addDirected(parent, v);
            }
        }
        return dag;
    }

    /**
     * A uniformly random order (from {@code rng}) rearranged as little as needed to put the
     * tail of every required edge before its head: repeatedly the first variable of the
     * shuffled order whose required parents are all placed.
     *
     * @throws LearnerException when the required edges form a cycle
     */
    int[] randomOrder(UniformRandomProvider rng) {
        int[] shuffled = Shuffles.permutation(rng, p);
        if (knowledge.requiredEdges().isEmpty()) {
            return shuffled;
        }
        int[] order = new int[p];
        boolean[] placed = new boolean[p];
        for (int k = 0; k < p; k++) {
            int chosen = -1;
            for (int v : shuffled) {
                if (!placed[v] && Arrays.stream(requiredParents[v]).allMatch(r -> placed[r])) {
                    chosen = v;
                    break;
                }
            }
            if (chosen < 0) {
                throw new LearnerException("the required edges form a directed cycle; no order satisfies them");
            }
            placed[chosen] = true;
            order[k] = chosen;
        }
        return order;
    }
}
