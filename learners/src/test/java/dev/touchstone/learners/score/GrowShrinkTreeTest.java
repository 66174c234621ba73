package dev.touchstone.learners.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.random.Shuffles;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GrowShrinkTreeTest {

    /** Grow-shrink straight from its definition (Margaritis and Thrun 2000; Andrews et al. 2023), no tree. */
    static int[] bruteForceParents(LocalScore s, int y, boolean[] prefix) {
        int[] current = new int[0];
        double best = s.localScore(y, current);
        while (true) {
            int add = -1;
            double addScore = best;
            for (int x = 0; x < prefix.length; x++) {
                if (!prefix[x] || x == y || contains(current, x)) {
                    continue;
                }
                int[] with = Arrays.copyOf(current, current.length + 1);
                with[current.length] = x;
                double v = s.localScore(y, with);
                if (v > addScore + GrowShrinkTree.tolerance(addScore)) {
                    addScore = v;
                    add = x;
                }
            }
            if (add < 0) {
                break;
            }
            current = Arrays.copyOf(current, current.length + 1);
            current[current.length - 1] = add;
            best = addScore;
        }
        while (current.length > 0) {
            int drop = -1;
            double dropScore = best;
            for (int i = 0; i < current.length; i++) {
                double v = s.localScore(y, without(current, i));
                if (v > dropScore + GrowShrinkTree.tolerance(dropScore)) {
                    dropScore = v;
                    drop = i;
                }
            }
            if (drop < 0) {
                break;
            }
            current = without(current, drop);
            best = dropScore;
        }
        int[] sorted = current.clone();
        Arrays.sort(sorted);
        return sorted;
    }

    private static boolean contains(int[] a, int x) {
        for (int v : a) {
            if (v == x) {
                return true;
            }
        }
        return false;
    }

    private static int[] without(int[] a, int skip) {
        int[] out = new int[a.length - 1];
        for (int i = 0, k = 0; i < a.length; i++) {
            if (i != skip) {
                out[k++] = a[i];
            }
        }
        return out;
    }

    @Test
    @DisplayName("batched single additions equal the from-scratch local score (BIC and EBIC, sample and population;"
            + " Schur complement identity, Golub and Van Loan §4.2)")
    void batchedAdditionsEqualLocalScores() {
        Graph dag = RandomDags.erdosRenyi(12, 3.0, 21);
        DataSet data = ScoreData.linearGaussian(dag, 300, 5);
        CovarianceMatrix population = PopulationCovariance.of(dag, 0.5, 2.0, 4);
        LocalScore[] scores = {BicScore.of(data.covariance(), 1.0), EbicScore.of(BicScore.of(data.covariance(), 2.0), 0.5),
                BicScore.of(population, 1.0)};
        UniformRandomProvider rng = Seeds.random(8);
        int checked = 0;
        for (LocalScore s : scores) {
            for (int trial = 0; trial < 40; trial++) {
                int y = rng.nextInt(12);
                boolean[] inSet = new boolean[12];
                int k = rng.nextInt(6);
                int[] parents = new int[0];
                while (parents.length < k) {
                    int x = rng.nextInt(12);
                    if (x != y && !inSet[x]) {
                        inSet[x] = true;
                        parents = Arrays.copyOf(parents, parents.length + 1);
                        parents[parents.length - 1] = x;
                    }
                }
                boolean[] candidates = new boolean[12];
                for (int x = 0; x < 12; x++) {
                    candidates[x] = x != y && !inSet[x];
                }
                double[] out = new double[12];
                s.scoreAdditions(y, parents, candidates, out);
                for (int x = 0; x < 12; x++) {
                    if (candidates[x]) {
                        int[] with = Arrays.copyOf(parents, parents.length + 1);
                        with[parents.length] = x;
                        double expected = s.localScore(y, with);
                        assertEquals(expected, out[x], 1e-9 * (1 + Math.abs(expected)), "y=" + y + " S=" + Arrays.toString(parents) + " x=" + x);
                        checked++;
                    }
                }
            }
        }
        assertTrue(checked > 500);
    }

    @Test
    @DisplayName("batched additions after earlier calls on the same thread (rows of shared leading parents reused)"
            + " equal, to the last bit, those of a fresh score that computes every row")
    void reusedRowsGiveTheSameBits() {
        int p = 16;
        Graph dag = RandomDags.erdosRenyi(p, 3.0, 44);
        CovarianceMatrix cov = ScoreData.linearGaussian(dag, 400, 45).covariance();
        BicScore reused = BicScore.of(cov, 1.0);
        UniformRandomProvider rng = Seeds.random(46);
        int[] parents = new int[0];
        int shared = 0;
        for (int call = 0; call < 400; call++) {
            // the next set: keep a random number of the current leading parents, then add or change some
            int keep = parents.length == 0 ? 0 : rng.nextInt(parents.length + 1);
            boolean[] in = new boolean[p];
            int[] next = Arrays.copyOf(parents, keep);
            for (int x : next) {
                in[x] = true;
            }
            int y = rng.nextInt(p);
            int extra = rng.nextInt(4);
            while (extra-- > 0) {
                int x = rng.nextInt(p);
                if (!in[x] && x != y) {
                    in[x] = true;
                    next = Arrays.copyOf(next, next.length + 1);
                    next[next.length - 1] = x;
                }
            }
            int[] sorted = next.clone();
            Arrays.sort(sorted);
            int[] use = rng.nextBoolean() ? sorted : next;
            if (Arrays.stream(use).anyMatch(x -> x == y)) {
                continue;
            }
            for (int i = 0; i < Math.min(use.length, parents.length) && use[i] == parents[i]; i++) {
                shared++;
            }
            boolean[] candidates = new boolean[p];
            for (int x = 0; x < p; x++) {
                int cx = x;
                candidates[x] = x != y && Arrays.stream(use).noneMatch(v -> v == cx);
            }
            double[] got = new double[p];
            double[] want = new double[p];
            reused.scoreAdditions(y, use, candidates, got);
            BicScore.of(cov, 1.0).scoreAdditions(y, use, candidates, want);
            for (int x = 0; x < p; x++) {
                if (candidates[x]) {
                    assertEquals(Double.doubleToLongBits(want[x]), Double.doubleToLongBits(got[x]),
                            "call " + call + " y=" + y + " S=" + Arrays.toString(use) + " x=" + x);
                }
            }
            parents = use;
        }
        assertTrue(shared > 200, "too few reused rows to test anything: " + shared);
    }

    @Test
    @DisplayName("the tree's answers equal grow-shrink from its definition on 300 random prefixes per variable,"
            + " queried in turn on one tree (so later answers come from the memo)")
    void treeEqualsBruteForceGrowShrink() {
        Graph dag = RandomDags.erdosRenyi(10, 4.0, 3);
        DataSet data = ScoreData.linearGaussian(dag, 200, 7);
        LocalScore s = BicScore.of(data.covariance(), 1.0);
        UniformRandomProvider rng = Seeds.random(99);
        for (int y = 0; y < 10; y++) {
            boolean[] admissible = new boolean[10];
            Arrays.fill(admissible, true);
            admissible[y] = false;
            GrowShrinkTree tree = new GrowShrinkTree(s, y, admissible, new int[0], -1);
            for (int q = 0; q < 300; q++) {
                boolean[] prefix = new boolean[10];
                for (int x = 0; x < 10; x++) {
                    prefix[x] = x != y && rng.nextBoolean();
                }
                int[] expected = bruteForceParents(s, y, prefix);
                assertArrayEquals(expected, tree.parents(x -> prefix[x]), "y=" + y + " prefix " + Arrays.toString(prefix));
                assertEquals(s.localScore(y, expected), tree.score(x -> prefix[x]), 1e-9 * (1 + Math.abs(s.localScore(y, expected))));
            }
            assertTrue(tree.nodeCount() > 1);
        }
    }

    @Test
    @DisplayName("oracle: along a causal order the tree returns exactly the true parents (the minimal I-map of a causal"
            + " order is the DAG itself, Verma and Pearl 1988; Raskutti and Uhler 2018)")
    void oracleCausalOrderGivesTrueParents() {
        for (long seed = 1; seed <= 20; seed++) {
            Graph dag = RandomDags.erdosRenyi(15, 4.0, seed);
            LocalScore s = BicScore.of(PopulationCovariance.of(dag, 0.5, 2.0, seed), 1.0);
            int[] order = topological(dag);
            int[] pos = OrderScorer.positions(order);
            for (int y = 0; y < 15; y++) {
                boolean[] admissible = new boolean[15];
                Arrays.fill(admissible, true);
                admissible[y] = false;
                GrowShrinkTree tree = new GrowShrinkTree(s, y, admissible, new int[0], -1);
                int at = pos[y];
                int[] truth = dag.parents(y).clone();
                Arrays.sort(truth);
                assertArrayEquals(truth, tree.parents(x -> pos[x] < at), "seed " + seed + " y=" + y);
            }
        }
    }

    @Test
    @DisplayName("one walk along an order gives at every index the score of grow-shrink from its definition with the"
            + " variables before that index")
    void walkAlongOrderEqualsOneQueryPerIndex() {
        int p = 14;
        Graph dag = RandomDags.erdosRenyi(p, 4.0, 12);
        LocalScore s = BicScore.of(ScoreData.linearGaussian(dag, 250, 13).covariance(), 1.0);
        UniformRandomProvider rng = Seeds.random(31);
        for (int y = 0; y < p; y++) {
            boolean[] admissible = new boolean[p];
            Arrays.fill(admissible, true);
            admissible[y] = false;
            GrowShrinkTree tree = new GrowShrinkTree(s, y, admissible, new int[0], -1);
            for (int trial = 0; trial < 25; trial++) {
                // y out of the order: the others at positions 0 .. p-2 in a random order, y before all of them
                int[] others = new int[p - 1];
                for (int x = 0, k = 0; x < p; x++) {
                    if (x != y) {
                        others[k++] = x;
                    }
                }
                Shuffles.shuffle(rng, others);
                int[] pos = new int[p];
                for (int i = 0; i < others.length; i++) {
                    pos[others[i]] = i;
                }
                pos[y] = Integer.MIN_VALUE;
                int from = rng.nextInt(p / 2);
                int to = p - 1 - rng.nextInt(p / 2);
                double[] walked = new double[p];
                tree.scoresAlongOrder(pos, from, to, walked);
                for (int i = from; i <= to; i++) {
                    int at = i;
                    boolean[] prefix = new boolean[p];
                    for (int x = 0; x < p; x++) {
                        prefix[x] = x != y && pos[x] < at;
                    }
                    double expected = s.localScore(y, bruteForceParents(s, y, prefix));
                    assertEquals(expected, walked[i], 1e-9 * (1 + Math.abs(expected)), "y=" + y + " index " + i);
                }
            }
        }
    }

    @Test
    @DisplayName("children are sorted best first, equal scores in the order given, as a boxed sort with that comparator"
            + " does (java.util.Arrays.sort, a general-purpose library)")
    void primitiveSortMatchesBoxedSort() {
        UniformRandomProvider rng = Seeds.random(77);
        for (int trial = 0; trial < 300; trial++) {
            int n = rng.nextInt(60);
            double[] scores = new double[n];
            for (int i = 0; i < n; i++) {
                // few distinct values, so ties are common
                scores[i] = rng.nextInt(6) - 2.5;
            }
            Integer[] boxed = new Integer[n];
            for (int i = 0; i < n; i++) {
                boxed[i] = i;
            }
            Arrays.sort(boxed, (a, b) -> {
                int c = Double.compare(scores[b], scores[a]);
                return c != 0 ? c : Integer.compare(a, b);
            });
            assertArrayEquals(Arrays.stream(boxed).mapToInt(Integer::intValue).toArray(),
                    GrowShrinkTree.byScoreDescending(scores, n), "n=" + n);
        }
    }

    /** A topological order by repeatedly taking a node whose parents are all placed (Kahn 1962). */
    static int[] topological(Graph dag) {
        int p = dag.size();
        int[] order = new int[p];
        boolean[] placed = new boolean[p];
        for (int k = 0; k < p; k++) {
            for (int v = 0; v < p; v++) {
                if (!placed[v] && Arrays.stream(dag.parents(v)).allMatch(u -> placed[u])) {
                    placed[v] = true;
                    order[k] = v;
                    break;
                }
            }
        }
        return order;
    }
}
