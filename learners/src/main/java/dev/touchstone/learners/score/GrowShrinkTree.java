package dev.touchstone.learners.score;

import java.util.Arrays;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * A grow-shrink tree of one variable (Andrews, Ramsey, Sanchez-Romero, Camchong and
 * Kummerfeld 2023, "Fast scalable and accurate discovery of DAGs using the best order score
 * search and grow-shrink trees", NeurIPS; the structure as we recall it): a memo of every grow-shrink parent search of
 * that variable made so far, shared by all the orders a permutation search visits.
 *
 * <p><b>What it answers.</b> Given the set Z of variables that precede the variable y in an
 * order, the grow-shrink parents of y within Z: <em>grow</em> — starting from the required
 * parents, repeatedly add the member of Z whose addition raises the local score the most,
 * while some addition raises it; then <em>shrink</em> — repeatedly remove the parent whose
 * removal raises the score the most, while some removal raises it (required parents are
 * never removed). With a consistent score this is the set of parents of y in the minimal
 * I-map of the order (Margaritis and Thrun 2000 for grow-shrink; Raskutti and Uhler 2018 for
 * the minimal I-map of an order).
 *
 * <p><b>Why a tree.</b> A node stands for the parent set grown so far (the path from the
 * root). When first reached it scores every admissible addition once and keeps the ones that
 * raise the score, sorted best first; the best addition within Z is then the first kept child
 * whose variable is in Z, and the child's subtree is shared by every Z that makes the same
 * choice. The shrink result depends only on the grown set, so it is kept in the node too.
 * A query costs the length of its path times the children skipped on it; the scoring is done
 * once per node, not once per query.
 *
 * <p>Knowledge: forbidden parents are never children; required parents form the root. The
 * optional parent limit stops growth at that many parents. Not thread-safe: one tree is
 * used by one thread at a time.
 */
final class GrowShrinkTree {

    /**
     * Score changes at or below this, relative to the score's magnitude, count as no
     * improvement: rounding of local scores, which reach 10⁹ with the oracle's row count.
     */
    static double tolerance(double score) {
        return 1e-9 * (1.0 + Math.abs(score));
    }

    private final LocalScore score;
    private final int y;
    private final boolean[] admissible;
    private final int maxParents;
    private final Node root;
    private final AtomicInteger nodes = new AtomicInteger();

    /**
     * @param score      the local score
     * @param y          the variable whose parents the tree finds
     * @param admissible admissible[x]: x may be a parent of y (false for y itself and forbidden parents)
     * @param required   parents y must have (they must precede y in every order queried)
     * @param maxParents largest parent set, or a negative number for none
     */
    GrowShrinkTree(LocalScore score, int y, boolean[] admissible, int[] required, int maxParents) {
        this.score = score;
        this.y = y;
        this.admissible = admissible.clone();
        this.maxParents = maxParents < 0 ? Integer.MAX_VALUE : Math.max(maxParents, required.length);
        int[] base = required.clone();
        Arrays.sort(base);
        for (int r : base) {
            this.admissible[r] = false;
        }
        this.root = new Node(base, score.localScore(y, base));
        this.nodes.set(1);
    }

    /** Nodes created so far (for the cost figures). */
    int nodeCount() {
        return nodes.get();
    }

    /** A membership test for the variables that precede y. */
    @FunctionalInterface
    interface Prefix {
        boolean contains(int x);
    }

    /** The local score of y with its grow-shrink parents within the prefix. */
    double score(Prefix prefix) {
        return shrunk(grow(prefix)).score;
    }

    /** The grow-shrink parents of y within the prefix (sorted) — the required ones included. */
    int[] parents(Prefix prefix) {
        return shrunk(grow(prefix)).parents.clone();
    }

    /**
     * The scores of y at every index of an order in one walk of the tree: for each i in
     * [{@code from}, {@code to}], {@code out[i]} is {@link #score(Prefix)} with the prefix
     * {x : position[x] &lt; i}. The indices that reach a node form an interval, and at each node
     * the interval splits among its children by where their variables stand, so every node on
     * some index's path is visited once instead of once per index (the same nodes are expanded
     * as by the separate queries, so the tree and its answers are the same).
     */
    void scoresAlongOrder(int[] position, int from, int to, double[] out) {
        walk(root, position, from, to, out);
    }

    private void walk(Node node, int[] position, int from, int to, double[] out) {
        node.expand();
        int open = to;
        int[] vars = node.childVars;
        // child k takes the indices above where its variable stands that no earlier child took
        for (int k = 0; k < vars.length && open >= from; k++) {
            int first = Math.max(from, position[vars[k]] + 1);
            if (first <= open) {
                walk(node.child(k), position, first, open, out);
                open = first - 1;
            }
        }
        if (open >= from) {
            double s = shrunk(node).score;
            for (int i = from; i <= open; i++) {
                out[i] = s;
            }
        }
    }

    private Node grow(Prefix prefix) {
        Node node = root;
        while (true) {
            node.expand();
            int next = -1;
            int[] vars = node.childVars;
            for (int i = 0; i < vars.length; i++) {
                if (prefix.contains(vars[i])) {
                    next = i;
                    break;
                }
            }
            if (next < 0) {
                return node;
            }
            node = node.child(next);
        }
    }

    private Result shrunk(Node node) {
        if (node.shrunk == null) {
            node.shrunk = shrink(node.parents, node.score, root.parents.length == 0 ? null : root.parents);
        }
        return node.shrunk;
    }

    /** Backward elimination from the grown set, never removing a required parent. */
    private Result shrink(int[] grown, double start, int[] required) {
        int[] current = grown;
        double best = start;
        while (current.length > 0) {
            int drop = -1;
            double dropScore = best;
            int[] candidate = new int[current.length - 1];
            for (int i = 0; i < current.length; i++) {
                if (required != null && Arrays.binarySearch(required, current[i]) >= 0) {
                    continue;
                }
                without(current, i, candidate);
                double s = score.localScore(y, candidate);
                if (s > dropScore + tolerance(dropScore)) {
                    dropScore = s;
                    drop = i;
                }
            }
            if (drop < 0) {
                break;
            }
            int[] next = new int[current.length - 1];
            without(current, drop, next);
            current = next;
            best = dropScore;
        }
        return new Result(current, best);
    }

    private static void without(int[] from, int skip, int[] into) {
        int k = 0;
        for (int i = 0; i < from.length; i++) {
            if (i != skip) {
                into[k++] = from[i];
            }
        }
    }

    /**
     * The indices 0 … n−1 sorted by {@code scores} from highest to lowest, equal scores keeping
     * their order (a merge sort on primitives: the boxed sort it replaces was a visible part of
     * expanding a node).
     */
    static int[] byScoreDescending(double[] scores, int n) {
        int[] a = new int[n];
        for (int i = 0; i < n; i++) {
            a[i] = i;
        }
        int[] b = new int[n];
        for (int width = 1; width < n; width *= 2) {
            for (int lo = 0; lo < n; lo += 2 * width) {
                int mid = Math.min(lo + width, n);
                int hi = Math.min(lo + 2 * width, n);
                int i = lo;
                int j = mid;
                for (int k = lo; k < hi; k++) {
                    // take from the right run only when strictly higher, which keeps the sort stable
                    if (j < hi && (i >= mid || Double.compare(scores[a[j]], scores[a[i]]) > 0)) {
                        b[k] = a[j++];
                    } else {
                        b[k] = a[i++];
                    }
                }
            }
            int[] t = a;
            a = b;
            b = t;
        }
        return a;
    }

    /** Per-thread work arrays of {@code Node.expand}, one set per thread instead of four new arrays of p per node. */
    private static final ThreadLocal<Scratch> SCRATCH = ThreadLocal.withInitial(Scratch::new);

    private static final class Scratch {
        boolean[] candidates = new boolean[0];
        double[] scores = new double[0];
        int[] vars = new int[0];
        double[] gains = new double[0];

        Scratch sized(int p) {
            if (candidates.length != p) {
                candidates = new boolean[p];
                scores = new double[p];
                vars = new int[p];
                gains = new double[p];
            }
            return this;
        }
    }

    /** A parent set and its local score. */
    private static final class Result {
        final int[] parents;
        final double score;

        Result(int[] parents, double score) {
            this.parents = parents;
            this.score = score;
        }
    }

    private final class Node {
        /** The grown set, sorted. */
        final int[] parents;
        final double score;
        /** Additions that raise the score, best first (ties: smaller variable first); null until expanded. */
        int[] childVars;
        double[] childScores;
        Node[] children;
        Result shrunk;

        Node(int[] parents, double score) {
            this.parents = parents;
            this.score = score;
        }

        void expand() {
            if (childVars != null) {
                return;
            }
            if (parents.length >= maxParents) {
                childVars = new int[0];
                childScores = new double[0];
                children = new Node[0];
                return;
            }
            int p = admissible.length;
            Scratch scratch = SCRATCH.get().sized(p);
            boolean[] candidates = scratch.candidates;
            System.arraycopy(admissible, 0, candidates, 0, p);
            for (int x : parents) {
                candidates[x] = false;
            }
            double[] scores = scratch.scores;
            GrowShrinkTree.this.score.scoreAdditions(y, parents, candidates, scores);
            int[] vars = scratch.vars;
            double[] gains = scratch.gains;
            int kept = 0;
            double tol = tolerance(score);
            for (int x = 0; x < p; x++) {
                if (candidates[x] && scores[x] > score + tol) {
                    vars[kept] = x;
                    gains[kept] = scores[x];
                    kept++;
                }
            }
            // vars are in increasing order, so a stable sort by score gives the ties' order
            int[] order = byScoreDescending(gains, kept);
            childVars = new int[kept];
            childScores = new double[kept];
            for (int i = 0; i < kept; i++) {
                childVars[i] = vars[order[i]];
                childScores[i] = gains[order[i]];
            }
            children = new Node[kept];
        }

        Node child(int i) {
            if (children[i] == null) {
                int x = childVars[i];
                int at = -Arrays.binarySearch(parents, x) - 1;
                int[] grown = new int[parents.length + 1];
                System.arraycopy(parents, 0, grown, 0, at);
                grown[at] = x;
                System.arraycopy(parents, at, grown, at + 1, parents.length - at);
                children[i] = new Node(grown, childScores[i]);
                nodes.incrementAndGet();
            }
            return children[i];
        }
    }
}
