package dev.touchstone.learners.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import dev.touchstone.learners.independence.FisherZTest;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.TreeSet;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The optimised order-independent search (reused scratch arrays, one ∅ test per pair at level 0,
 * parallel levels) and the collider rules' set enumeration (duplicates across the two sides skipped
 * without a set of seen sets) against a direct transcription of the order-independent skeleton of Colombo and
 * Maathuis (2014, Algorithm 4.1, "PC-stable", from memory) written with boxed lists: same adjacencies
 * and the same recorded separating set for every pair, on finite-sample Fisher z data where the
 * tests make mistakes (so that many sets are found late and both sides of a pair matter), and
 * the conservative and majority rules against their definitions with boxed sets.
 */
class AdjacencySearchReferenceTest {

    @Test
    @DisplayName("order-independent search = PC-stable written out (Colombo and Maathuis 2014, Alg. 4.1) and sequential search = PC's adjacency step written out (SGS 2000 §5.4.2): adjacencies and sepsets, 20 data sets, depth limits, 1 and 2 threads")
    void optimisedSearchEqualsTheDirectOne() {
        int removedWithSets = 0;
        int setsOfTwoOrMore = 0;
        for (int rep = 0; rep < 20; rep++) {
            boolean stable = rep < 12;
            Graph dag = rep % 2 == 0 ? RandomDags.erdosRenyi(30, 3.0, 310 + rep) : RandomDags.scaleFree(30, 2, 310 + rep);
            DataSet data = SmallData.linearGaussian(dag, 120 + 40 * (rep % 12), 330 + rep);
            FisherZTest test = FisherZTest.of(data, 0.05);
            int maxDepth = rep % 3 == 2 ? 1 : -1;
            Skeleton fast = new AdjacencySearch(test, KnowledgeIndex.of(Knowledge.none(), data.names()),
                    stable ? SkeletonVariant.ORDER_INDEPENDENT : SkeletonVariant.SEQUENTIAL, maxDepth,
                    RunContext.of(1, null, 1 + rep % 2)).run();
            List<Integer>[][] reference = reference(test, maxDepth, stable);
            for (int a = 0; a < 30; a++) {
                for (int b = a + 1; b < 30; b++) {
                    List<Integer> sep = reference[a][b] != null ? reference[a][b] : reference[b][a];
                    assertEquals(sep == null, fast.adjacent(a, b), "data " + rep + " pair " + a + "," + b);
                    if (sep != null) {
                        int[] expected = sep.stream().mapToInt(Integer::intValue).toArray();
                        assertArrayEquals(expected, fast.sepset(a, b), "data " + rep + " pair " + a + "," + b);
                        removedWithSets++;
                        setsOfTwoOrMore += expected.length >= 2 ? 1 : 0;
                    }
                }
            }
        }
        assertTrue(removedWithSets > 3500 && setsOfTwoOrMore > 30, removedWithSets + " removed, " + setsOfTwoOrMore);
    }

    @Test
    @DisplayName("conservative and majority rules = their definitions with every distinct separating set collected in a boxed set (Ramsey, Zhang and Spirtes 2006; Colombo and Maathuis 2014): colliders, ambiguous triples, tests")
    void colliderRulesEqualTheDirectOnes() {
        int ambiguousSeen = 0;
        for (int rep = 0; rep < 6; rep++) {
            Graph dag = RandomDags.erdosRenyi(25, 3.0, 360 + rep);
            DataSet data = SmallData.linearGaussian(dag, 100 + 30 * rep, 370 + rep);
            FisherZTest test = FisherZTest.of(data, 0.05);
            KnowledgeIndex none = KnowledgeIndex.of(Knowledge.none(), data.names());
            Skeleton s = new AdjacencySearch(test, none, SkeletonVariant.ORDER_INDEPENDENT, -1,
                    RunContext.of(1, null, 1)).run();
            for (ColliderRule rule : List.of(ColliderRule.CONSERVATIVE, ColliderRule.MAJORITY)) {
                RunContext ctx = RunContext.of(1, null, 1);
                ColliderOrientation fast = new ColliderOrientation(s, test, none, rule, ConflictRule.KEEP_FIRST, -1, ctx);
                fast.orient(data.names());
                long[] expected = directColliderCounts(s, test, rule);
                assertEquals(expected[0], fast.counts().colliders(), "data " + rep + " " + rule);
                assertEquals(expected[1], fast.counts().ambiguous(), "data " + rep + " " + rule);
                assertEquals(expected[2], ctx.tests(), "data " + rep + " " + rule);
                ambiguousSeen += fast.counts().ambiguous();
            }
        }
        assertTrue(ambiguousSeen > 0, "no ambiguous triple: the case the rules differ on never occurred");
    }

    /** {colliders, ambiguous triples, tests}: every distinct subset of adj(x)\{y} or adj(y)\{x} tested once per pair. */
    private static long[] directColliderCounts(Skeleton s, IndependenceTest test, ColliderRule rule) {
        int p = s.size();
        long colliders = 0;
        long ambiguous = 0;
        java.util.Map<List<Integer>, List<List<Integer>>> cache = new java.util.HashMap<>();
        long[] tests = new long[1];
        for (int z = 0; z < p; z++) {
            for (int x = 0; x < p; x++) {
                for (int y = x + 1; y < p; y++) {
                    if (!s.adjacent(x, z) || !s.adjacent(y, z) || s.adjacent(x, y)) {
                        continue;
                    }
                    List<List<Integer>> sets = cache.computeIfAbsent(List.of(x, y), k -> separating(s, test, k.get(0), k.get(1), tests));
                    Integer middle = z;
                    long with = sets.stream().filter(set -> set.contains(middle)).count();
                    Boolean collider;
                    if (sets.isEmpty()) {
                        collider = null;
                    } else if (rule == ColliderRule.CONSERVATIVE) {
                        collider = with == 0 ? Boolean.TRUE : with == sets.size() ? Boolean.FALSE : null;
                    } else {
                        collider = 2 * with < sets.size() ? Boolean.TRUE : 2 * with > sets.size() ? Boolean.FALSE : null;
                    }
                    if (collider == null) {
                        ambiguous++;
                    } else if (collider) {
                        colliders++;
                    }
                }
            }
        }
        return new long[] {colliders, ambiguous, tests[0]};
    }

    private static List<List<Integer>> separating(Skeleton s, IndependenceTest test, int x, int y, long[] tests) {
        java.util.Set<List<Integer>> distinct = new java.util.LinkedHashSet<>();
        for (int[] side : new int[][] {{x, y}, {y, x}}) {
            List<Integer> cand = new ArrayList<>();
            for (int v : s.neighbours(side[0])) {
                if (v != side[1]) {
                    cand.add(v);
                }
            }
            for (int size = 0; size <= cand.size(); size++) {
                distinct.addAll(subsets(cand, size));
            }
        }
        List<List<Integer>> out = new ArrayList<>();
        for (List<Integer> set : distinct) {
            tests[0]++;
            if (test.independent(x, y, set.stream().mapToInt(Integer::intValue).toArray())) {
                out.add(set);
            }
        }
        return out;
    }

    /**
     * The adjacency step as written. PC-stable ({@code stable}): per level, freeze every adjacency set;
     * for each adjacent pair x &lt; y try the ℓ-subsets of a(x) \ {y}, then of a(y) \ {x}, in lexicographic
     * order, record the first that separates and remove the level's separated pairs at its end. Original:
     * for x in order and each y adjacent to x when x's turn starts, try the ℓ-subsets of the current
     * adj(x) \ {y} and remove x − y at once. Both stop when no pair has ℓ candidates. Returns the
     * separating set of every removed pair at [x][y] as found (null: adjacent).
     */
    @SuppressWarnings("unchecked")
    private static List<Integer>[][] reference(IndependenceTest test, int maxDepth, boolean stable) {
        int p = test.variables();
        List<TreeSet<Integer>> adj = completeGraph(p);
        List<Integer>[][] sep = new List[p][p];
        for (int level = 0; maxDepth < 0 || level <= maxDepth; level++) {
            List<TreeSet<Integer>> seen = adj;
            if (stable) {
                seen = new ArrayList<>();
                for (TreeSet<Integer> a : adj) {
                    seen.add(new TreeSet<>(a));
                }
            }
            boolean any = false;
            for (int x = 0; x < p; x++) {
                for (int y : new ArrayList<>(seen.get(x))) {
                    if ((stable && y < x) || !adj.get(x).contains(y)) {
                        continue;
                    }
                    List<Integer> cx = new ArrayList<>(seen.get(x));
                    cx.remove(Integer.valueOf(y));
                    List<Integer> cy = new ArrayList<>(seen.get(y));
                    cy.remove(Integer.valueOf(x));
                    if (cx.size() < level && (!stable || cy.size() < level)) {
                        continue;
                    }
                    any = true;
                    List<Integer> found = firstSeparating(test, x, y, cx, level);
                    if (found == null && stable) {
                        found = firstSeparating(test, y, x, cy, level);
                    }
                    if (found != null) {
                        sep[x][y] = found;
                        adj.get(x).remove(y);
                        adj.get(y).remove(x);
                    }
                }
            }
            if (!any) {
                break;
            }
        }
        return sep;
    }

    private static List<TreeSet<Integer>> completeGraph(int p) {
        List<TreeSet<Integer>> adj = new ArrayList<>();
        for (int v = 0; v < p; v++) {
            TreeSet<Integer> all = new TreeSet<>();
            for (int w = 0; w < p; w++) {
                if (w != v) {
                    all.add(w);
                }
            }
            adj.add(all);
        }
        return adj;
    }

    private static List<Integer> firstSeparating(IndependenceTest test, int x, int y, List<Integer> cand, int size) {
        for (List<Integer> s : subsets(cand, size)) {
            if (test.independent(x, y, s.stream().mapToInt(Integer::intValue).toArray())) {
                return s;
            }
        }
        return null;
    }

    /** All subsets of the given size, in lexicographic order of positions (recursive, boxed). */
    private static List<List<Integer>> subsets(List<Integer> cand, int size) {
        List<List<Integer>> out = new ArrayList<>();
        extend(cand, size, 0, new ArrayList<>(), out);
        return out;
    }

    private static void extend(List<Integer> cand, int size, int from, List<Integer> prefix, List<List<Integer>> out) {
        if (prefix.size() == size) {
            out.add(new ArrayList<>(prefix));
            return;
        }
        for (int i = from; i < cand.size(); i++) {
            prefix.add(cand.get(i));
            extend(cand, size, i + 1, prefix, out);
            prefix.remove(prefix.size() - 1);
        }
    }

    @Test
    @DisplayName("the subsets helper of the reference enumerates C(5, 2) = 10 sets in lexicographic order (common practice)")
    void referenceSubsets() {
        List<List<Integer>> s = subsets(Arrays.asList(4, 7, 8, 9, 11), 2);
        assertEquals(10, s.size());
        assertEquals(List.of(4, 7), s.get(0));
        assertEquals(List.of(9, 11), s.get(9));
    }
}
