package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagEnumeration;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ExactScoreLearnerTest {

    private static final ExactScoreLearner EXACT = new ExactScoreLearner();
    private static final GesLearner GES = new GesLearner();

    private static Estimate run(dev.touchstone.core.learner.Learner learner, LearnerInput input, Knowledge k,
                                Map<String, Object> raw) {
        ParameterValues values = ParameterValues.resolve("test", learner.description().parameters(), raw);
        return learner.learn(input, k, values, RunContext.unlimited(1));
    }

    /** The local scores of every node and parent set over p ≤ 5 variables, by parent mask, for fast enumeration. */
    private static double[][] table(LocalScore score) {
        int p = score.variableCount();
        double[][] t = new double[p][1 << p];
        for (int v = 0; v < p; v++) {
            for (int m = 0; m < 1 << p; m++) {
                if ((m >>> v & 1) == 0) {
                    t[v][m] = score.localScore(v, bits(m));
                }
            }
        }
        return t;
    }

    private static int[] bits(int m) {
        int[] out = new int[Integer.bitCount(m)];
        for (int rest = m, j = 0; rest != 0; rest &= rest - 1, j++) {
            out[j] = Integer.numberOfTrailingZeros(rest);
        }
        return out;
    }

    private static int mask(int[] parents) {
        int m = 0;
        for (int u : parents) {
            m |= 1 << u;
        }
        return m;
    }

    private static double dagScore(double[][] t, Graph dag) {
        double s = 0;
        for (int v = 0; v < dag.size(); v++) {
            s += t[v][mask(dag.parents(v))];
        }
        return s;
    }

    /** The maximum of the score over every labelled DAG on the variables (A003024), subject to a filter. */
    private static double enumeratedMaximum(double[][] t, List<String> names, java.util.function.Predicate<Graph> allowed) {
        double[] max = {Double.NEGATIVE_INFINITY};
        int[] count = {0};
        DagEnumeration.forEach(names, g -> {
            count[0]++;
            if (allowed.test(g)) {
                max[0] = Math.max(max[0], dagScore(t, g));
            }
        });
        assertEquals(List.of(1, 3, 25, 543, 29281).get(names.size() - 1), count[0], "OEIS A003024");
        return max[0];
    }

    private static void assertRelativelyEqual(double expected, double got, String what) {
        assertEquals(expected, got, 1e-9 * Math.abs(expected), what);
    }

    @Test
    @DisplayName("continuous BIC: the exact learner's score equals the maximum over all 29,281 DAGs on 5 nodes"
            + " (exhaustive enumeration, OEIS A003024) on 8 seeded data sets, to 1e-9 relative; its CPDAG's"
            + " members score that maximum")
    void bicEqualsExhaustiveMaximum() {
        for (long seed = 1; seed <= 8; seed++) {
            int p = seed <= 2 ? 3 + (int) seed : 5;
            DataSet data = ScoreData.linearGaussian(p, 1.5 + (seed % 3), 200 + 100 * (int) seed, seed);
            LocalScore score = BicScore.of(data.covariance(), 1.0);
            double[][] t = table(score);
            double max = enumeratedMaximum(t, data.names(), g -> true);
            Estimate e = run(EXACT, LearnerInput.of(data), Knowledge.none(), Map.of("score", "bic"));
            assertRelativelyEqual(max, e.extras().get("score"), "seed " + seed);
            assertRelativelyEqual(max, dagScore(t, DagExtension.of(e.graph())), "member of the CPDAG, seed " + seed);
            assertEquals(GraphClass.CPDAG, e.graphClass());
            assertEquals(Cpdags.of(DagExtension.of(e.graph())), e.graph(), "a CPDAG, seed " + seed);
        }
    }

    @Test
    @DisplayName("discrete BDeu: the exact learner's score equals the maximum over all DAGs on 4 and 5 nodes on 6"
            + " seeded binary data sets (exhaustive enumeration), to 1e-9 relative")
    void bdeuEqualsExhaustiveMaximum() {
        for (long seed = 1; seed <= 6; seed++) {
            int p = seed <= 2 ? 4 : 5;
            Graph truth = RandomDags.erdosRenyi(p, 2.0, seed + 100);
            DataSet data = ScoreData.binary(truth, 300 * (int) seed, seed);
            double ess = seed % 2 == 0 ? 1.0 : 10.0;
            double[][] t = table(BdeuScore.of(data, ess));
            double max = enumeratedMaximum(t, data.names(), g -> true);
            Estimate e = run(EXACT, LearnerInput.of(data), Knowledge.none(),
                    Map.of("score", "bdeu", "equivalent_sample_size", ess));
            assertRelativelyEqual(max, e.extras().get("score"), "seed " + seed);
            assertRelativelyEqual(max, dagScore(t, DagExtension.of(e.graph())), "member of the CPDAG, seed " + seed);
        }
    }

    @Test
    @DisplayName("parent_limit: equals the maximum over the 5-node DAGs whose in-degrees are within the limit"
            + " (exhaustive enumeration)")
    void parentLimitEqualsRestrictedMaximum() {
        for (int limit = 0; limit <= 2; limit++) {
            DataSet data = ScoreData.linearGaussian(5, 3.0, 2000, 40 + limit);
            double[][] t = table(BicScore.of(data.covariance(), 1.0));
            int k = limit;
            double max = enumeratedMaximum(t, data.names(), g -> {
                for (int v = 0; v < g.size(); v++) {
                    if (g.parents(v).length > k) {
                        return false;
                    }
                }
                return true;
            });
            Estimate e = run(EXACT, LearnerInput.of(data), Knowledge.none(), Map.of("parent_limit", limit));
            assertRelativelyEqual(max, e.extras().get("score"), "limit " + limit);
            Graph member = DagExtension.of(e.graph());
            for (int v = 0; v < 5; v++) {
                assertTrue(member.parents(v).length <= limit || limit == 0 && member.edgeCount() == 0,
                        "limit " + limit + ": " + member);
            }
        }
    }

    @Test
    @DisplayName("knowledge: equals the maximum over the 5-node DAGs with the required edge and without the"
            + " forbidden ones (exhaustive enumeration), and the estimate keeps them")
    void knowledgeEqualsRestrictedMaximum() {
        DataSet data = ScoreData.linearGaussian(5, 2.5, 1000, 77);
        List<String> n = data.names();
        Knowledge k = Knowledge.builder().require(n.get(4), n.get(0)).forbid(n.get(1), n.get(2))
                .forbid(n.get(2), n.get(1)).forbid(n.get(0), n.get(3)).build();
        double[][] t = table(BicScore.of(data.covariance(), 1.0));
        double max = enumeratedMaximum(t, n, g -> {
            if (!g.hasDirected(4, 0)) {
                return false;
            }
            for (int v = 0; v < g.size(); v++) {
                for (int u : g.parents(v)) {
                    if (k.isForbidden(n.get(u), n.get(v))) {
                        return false;
                    }
                }
            }
            return true;
        });
        Estimate e = run(EXACT, LearnerInput.of(data), k, Map.of());
        assertRelativelyEqual(max, e.extras().get("score"), "with knowledge");
        assertTrue(e.graph().hasDirected(4, 0), "required edge oriented: " + e.graph());
        assertFalse(e.graph().adjacent(1, 2), "forbidden adjacency: " + e.graph());
    }

    /** A score given by a table over parent masks: not score-equivalent, for checking the search alone. */
    private record TableScore(List<String> names, double[][] table) implements LocalScore {
        @Override
        public double localScore(int node, int[] parents) {
            return table[node][mask(parents)];
        }

        @Override
        public String describe() {
            return "table";
        }
    }

    private static TableScore randomTable(int p, long seed, boolean integers) {
        UniformRandomProvider rng = RunContext.unlimited(seed).random("score table");
        double[][] t = new double[p][1 << p];
        for (int v = 0; v < p; v++) {
            for (int m = 0; m < 1 << p; m++) {
                t[v][m] = integers ? rng.nextInt(4) : rng.nextDouble() * 10 - Integer.bitCount(m) * 2;
            }
        }
        return new TableScore(DagEnumeration.defaultNames(p), t);
    }

    @Test
    @DisplayName("search alone, 40 random score tables on 5 nodes (no score equivalence): the optimum equals the"
            + " exhaustive maximum over all 29,281 DAGs and the DAG read back scores it")
    void randomTablesEqualExhaustiveMaximum() {
        for (long seed = 1; seed <= 40; seed++) {
            TableScore s = randomTable(5, seed, false);
            ExactSearch search = new ExactSearch(s, KnowledgeIndex.of(Knowledge.none(), s.names()),
                    seed % 4 == 0 ? 2 : -1, RunContext.unlimited(1));
            int[] parents = search.run();
            boolean limited = seed % 4 == 0;
            double max = enumeratedMaximum(s.table(), s.names(), g -> !limited || maxInDegree(g) <= 2);
            assertEquals(max, search.optimum(), 1e-12, "seed " + seed);
            assertEquals(max, dagScore(s.table(), ExactScoreLearner.dagOf(parents, s.names())), 1e-12, "seed " + seed);
        }
    }

    private static int maxInDegree(Graph g) {
        int d = 0;
        for (int v = 0; v < g.size(); v++) {
            d = Math.max(d, g.parents(v).length);
        }
        return d;
    }

    @Test
    @DisplayName("ties: on 30 random integer score tables (many ties) on 4 and 5 nodes, the walk over tied"
            + " decisions finds exactly the optimal DAGs whose every parent set beats all its proper subsets"
            + " (by exhaustive enumeration)")
    void tieWalkFindsEveryOptimalDag() {
        int multiClass = 0;
        for (long seed = 1; seed <= 30; seed++) {
            int p = seed % 2 == 0 ? 4 : 5;
            TableScore s = randomTable(p, seed + 1000, true);
            ExactSearch search = new ExactSearch(s, KnowledgeIndex.of(Knowledge.none(), s.names()), -1,
                    RunContext.unlimited(1));
            search.run();
            double max = enumeratedMaximum(s.table(), s.names(), g -> true);
            Set<Graph> expected = new HashSet<>();
            DagEnumeration.forEach(s.names(), g -> {
                if (dagScore(s.table(), g) == max && everyParentSetBeatsItsSubsets(s.table(), g)) {
                    expected.add(g);
                }
            });
            ExactSearch.TieWalk walk = search.optimalDags(1e-9, 1_000_000);
            Set<Graph> found = new HashSet<>();
            for (int[] dag : walk.dags()) {
                found.add(ExactScoreLearner.dagOf(dag, s.names()));
            }
            assertTrue(walk.complete(), "seed " + seed);
            assertEquals(expected, found, "seed " + seed);
            Set<Graph> classes = new HashSet<>();
            for (Graph g : found) {
                classes.add(Cpdags.of(g));
            }
            if (classes.size() > 1) {
                multiClass++;
            }
        }
        assertTrue(multiClass >= 10, "too few cases with several tied classes to test the walk: " + multiClass);
    }

    private static boolean everyParentSetBeatsItsSubsets(double[][] t, Graph g) {
        for (int v = 0; v < g.size(); v++) {
            int m = mask(g.parents(v));
            if (m == 0) {
                continue;
            }
            for (int sub = (m - 1) & m; ; sub = (sub - 1) & m) {
                if (t[v][sub] >= t[v][m]) {
                    return false;
                }
                if (sub == 0) {
                    break;
                }
            }
        }
        return true;
    }

    @Test
    @DisplayName("ties reported: two independent pairs of identical-score DAG classes — chain and collider given the"
            + " same score by construction — give optimal-classes-found 2; a clear optimum gives 1")
    void reportsTiedClasses() {
        // Node scores: 1 → 0 and 1 → 2 (a fork) score 2; 0 → 1 ← 2 (a collider) also 2; no other DAG beats them.
        double[][] t = new double[3][8];
        t[0][0b010] = 1;
        t[2][0b010] = 1;
        t[1][0b101] = 2;
        TableScore s = new TableScore(DagEnumeration.defaultNames(3), t);
        ExactSearch search = new ExactSearch(s, KnowledgeIndex.of(Knowledge.none(), s.names()), -1, RunContext.unlimited(1));
        search.run();
        assertEquals(2.0, search.optimum());
        Set<Graph> classes = new HashSet<>();
        for (int[] dag : search.optimalDags(1e-9, 1000).dags()) {
            classes.add(Cpdags.of(ExactScoreLearner.dagOf(dag, s.names())));
        }
        assertEquals(2, classes.size(), classes.toString());

        DataSet data = ScoreData.linearGaussian(5, 2.0, 5000, 3);
        Estimate e = run(EXACT, LearnerInput.of(data), Knowledge.none(), Map.of());
        assertEquals(1.0, e.extras().get("optimal-classes-found"));
        assertEquals(1.0, e.extras().get("tie-walk-complete"));
    }

    @Test
    @DisplayName("its score is at least GES's on 12 seeded dense models of 6 to 8 nodes (it is the optimum)")
    void atLeastGes() {
        for (long seed = 1; seed <= 12; seed++) {
            int p = 6 + (int) (seed % 3);
            DataSet data = ScoreData.linearGaussian(p, 3.0, 20000, seed + 500);
            LocalScore bic = BicScore.of(data.covariance(), 1.0);
            double exact = run(EXACT, LearnerInput.of(data), Knowledge.none(), Map.of()).extras().get("score");
            Graph ges = DagExtension.of(run(GES, LearnerInput.of(data), Knowledge.none(), Map.of()).graph());
            double gesScore = ScoreTesting.dagScore(bic, ges);
            assertTrue(exact >= gesScore - 1e-9 * Math.abs(exact), "seed " + seed + ": exact " + exact + " < GES " + gesScore);
        }
    }

    @Test
    @DisplayName("refuses more variables than it states, in one line naming the limit")
    void refusesLargeInputs() {
        ExactScoreLearner.checkSize(20, -1);
        ExactScoreLearner.checkSize(24, 3);
        LearnerException wide = assertThrows(LearnerException.class, () -> ExactScoreLearner.checkSize(21, -1));
        assertTrue(wide.getMessage().contains("20") && !wide.getMessage().contains("\n"), wide.getMessage());
        LearnerException narrow = assertThrows(LearnerException.class, () -> ExactScoreLearner.checkSize(25, 2));
        assertTrue(narrow.getMessage().contains("24"), narrow.getMessage());
        DataSet data = ScoreData.linearGaussian(21, 1.0, 50, 1);
        assertThrows(LearnerException.class, () -> run(EXACT, LearnerInput.of(data), Knowledge.none(), Map.of()));
    }
}
