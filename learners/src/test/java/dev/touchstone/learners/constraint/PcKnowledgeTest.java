package dev.touchstone.learners.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Background knowledge as in Spirtes, Glymour and Scheines (2000, §5.8) and Meek (1995): a
 * required edge is always present with its direction, a forbidden one never, and no edge
 * points from a later tier to an earlier one, whatever the data say.
 */
class PcKnowledgeTest {

    private static Graph learn(LearnerInput input, Knowledge k, String skeleton) {
        return learnWith(input, k, skeleton, "sepset");
    }

    @Test
    @DisplayName("required edges present and directed, forbidden ones absent, tiers respected, 40 seeded cases")
    void knowledgeIsHonoured() {
        for (int rep = 0; rep < 40; rep++) {
            Graph dag = RandomDags.erdosRenyi(12, 2.5, 500 + rep);
            UniformRandomProvider rng = Seeds.random(600 + rep);
            List<String> names = dag.names();
            Knowledge.Builder kb = Knowledge.builder();
            int[] perm = RandomDags.permutation(12, rng);
            // Tiers: three groups in a random order (often against the causal order).
            kb.tier(List.of(names.get(perm[0]), names.get(perm[1]), names.get(perm[2]), names.get(perm[3])));
            kb.tier(List.of(names.get(perm[4]), names.get(perm[5]), names.get(perm[6]), names.get(perm[7])));
            // Required: a pair the data give no reason to join, from tier 1 to tier 2.
            String reqFrom = names.get(perm[0]);
            String reqTo = names.get(perm[5]);
            kb.require(reqFrom, reqTo);
            // Forbidden: the direction of a true edge between untiered variables, both ways.
            String fa = names.get(perm[8]);
            String fb = names.get(perm[9]);
            kb.forbid(fa, fb).forbid(fb, fa);
            Knowledge k = kb.build();
            LearnerInput input = rep % 2 == 0 ? LearnerInput.of(new Oracle(dag, null))
                    : LearnerInput.of(SmallData.linearGaussian(dag, 300, 700 + rep));
            Graph g = learn(input, k, rep % 4 < 2 ? "order-independent" : "sequential");
            assertTrue(g.hasDirected(g.index(reqFrom), g.index(reqTo)), "required " + reqFrom + " -> " + reqTo + ": " + g);
            assertFalse(g.adjacent(g.index(fa), g.index(fb)), "forbidden " + fa + " ~ " + fb);
            for (Edge e : g.edges()) {
                checkTier(k, g, e.a(), e.b(), e.atB());
                checkTier(k, g, e.b(), e.a(), e.atA());
            }
        }
    }

    /** An edge with an arrowhead at {@code to} and a tail at {@code from} must not go back in time. */
    private static void checkTier(Knowledge k, Graph g, int from, int to, Mark atTo) {
        if (atTo == Mark.ARROW && g.markAt(from, to) == Mark.TAIL) {
            assertFalse(k.isForbidden(g.name(from), g.name(to)), "edge " + g.name(from) + " -> " + g.name(to)
                    + " is forbidden by the knowledge");
        }
        if (atTo == Mark.TAIL && g.markAt(from, to) == Mark.TAIL) {
            // An undirected edge across tiers would allow the backward direction.
            int tf = k.tierOf(g.name(from));
            int tt = k.tierOf(g.name(to));
            assertFalse(tf >= 0 && tt >= 0 && tf != tt, "undirected edge across tiers " + g.name(from) + " — " + g.name(to));
        }
    }

    @Test
    @DisplayName("a required edge survives data that show independence")
    void requiredAdjacencyIsNeverRemoved() {
        Graph dag = Graph.builder(List.of("A", "B", "C")).addDirected(0, 1).freeze();
        DataSet data = SmallData.linearGaussian(dag, 500, 1);
        Graph g = learn(LearnerInput.of(data), Knowledge.builder().require("C", "A").build(), "sequential");
        assertTrue(g.hasDirected(g.index("C"), g.index("A")));
        List<String> none = new ArrayList<>();
        assertTrue(none.isEmpty());
    }

    /**
     * Truth a → x ← b, x → z ← y, with knowledge forbidding x – y both ways (true of the truth:
     * x and y are not adjacent). Removing x – y without a test leaves it no separating set;
     * guessing the triple x – z – y a non-collider, Meek's R1 then orients a → x – z into
     * x → z (a, z not adjacent) and x → z – y into z → y (x, y not adjacent), against the
     * truth's y → z. Testing the pair finds x ⊥ y given ∅, z is outside that set, so x → z ← y
     * is a collider and the result is the true CPDAG, every edge directed. Reasoned out from
     * the sepset collider rule (Spirtes, Glymour and Scheines 2000, §5.4.2) and R1 (Meek 1995);
     * knowledge that only forbids a true non-adjacency orients nothing, so the CPDAG is the
     * answer (Meek 1995, background knowledge).
     */
    @Test
    @DisplayName("a pair forbidden both ways is still tested: its collider is found and R1 does not orient z -> y (Meek 1995, reasoned out)")
    void forbiddenPairKeepsItsSeparatingSet() {
        Graph dag = Graph.builder(List.of("a", "b", "x", "y", "z"))
                .addDirected(0, 2).addDirected(1, 2).addDirected(2, 4).addDirected(3, 4).freeze();
        Knowledge k = Knowledge.builder().forbid("x", "y").forbid("y", "x").build();
        Graph cpdag = Cpdags.of(dag);
        assertEquals(4, cpdag.edgeCount());
        for (String skeleton : List.of("order-independent", "sequential")) {
            for (String colliders : List.of("sepset", "conservative", "majority")) {
                Graph g = learnWith(LearnerInput.of(new Oracle(dag, null)), k, skeleton, colliders);
                assertTrue(g.hasDirected(g.index("y"), g.index("z")), skeleton + "/" + colliders + ": " + g);
                assertTrue(g.sameEdges(cpdag), skeleton + "/" + colliders + ": " + g + " vs " + cpdag);
            }
        }
    }

    @Test
    @DisplayName("with the oracle, knowledge forbidding true non-adjacencies both ways leaves the true CPDAG, 60 DAGs (SGS 2000 Thm 5.1; Meek 1995)")
    void forbiddingTrueNonAdjacenciesChangesNothing() {
        int forbiddenColliderEnds = 0;
        for (int rep = 0; rep < 60; rep++) {
            Graph dag = RandomDags.erdosRenyi(10, 2.5, 900 + rep);
            UniformRandomProvider rng = Seeds.random(950 + rep);
            Knowledge.Builder kb = Knowledge.builder();
            int forbidden = 0;
            for (int tries = 0; tries < 200 && forbidden < 4; tries++) {
                int a = rng.nextInt(10);
                int b = rng.nextInt(10);
                if (a != b && !dag.adjacent(a, b)) {
                    kb.forbid(dag.name(a), dag.name(b)).forbid(dag.name(b), dag.name(a));
                    forbidden++;
                    forbiddenColliderEnds += commonChildren(dag, a, b);
                }
            }
            Graph cpdag = Cpdags.of(dag);
            String skeleton = rep % 2 == 0 ? "order-independent" : "sequential";
            Graph g = learnWith(LearnerInput.of(new Oracle(dag, null)), kb.build(), skeleton, "sepset");
            assertTrue(g.sameEdges(cpdag), "DAG " + rep + "\n truth " + cpdag + "\n estimate " + g);
        }
        // The case that matters (a forbidden pair with a common child, i.e. a collider's ends) must occur.
        assertTrue(forbiddenColliderEnds >= 10, "forbidden pairs with a common child: " + forbiddenColliderEnds);
    }

    private static int commonChildren(Graph dag, int a, int b) {
        int n = 0;
        for (int c = 0; c < dag.size(); c++) {
            if (dag.hasDirected(a, c) && dag.hasDirected(b, c)) {
                n++;
            }
        }
        return n;
    }

    private static Graph learnWith(LearnerInput input, Knowledge k, String skeleton, String colliders) {
        PcLearner pc = new PcLearner();
        return pc.learn(input, k, ParameterValues.resolve("pc", pc.description().parameters(),
                Map.of("skeleton", skeleton, "colliders", colliders, "alpha", 0.05)), RunContext.of(3, null, 2)).graph();
    }
}
