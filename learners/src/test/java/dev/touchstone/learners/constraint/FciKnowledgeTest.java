package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.graph.algorithms.LatentProjection;
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
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Background knowledge in FCI (Spirtes, Glymour and Scheines 2000, §5.8 for the kinds of
 * knowledge; the PAG reading of marks as ancestry is Zhang 2008, §2). What is enforced, read
 * about the returned PAG: a required edge a → b is present as a → b; a pair forbidden both ways
 * is never adjacent; for an adjacent pair with a in an earlier tier than b (or b → a forbidden)
 * the mark at b is an arrowhead, so no edge points from a later tier into an earlier one
 * (b is never marked as an ancestor of a).
 */
class FciKnowledgeTest {

    private static Graph learn(LearnerInput input, Knowledge k, Map<String, Object> raw) {
        FciLearner fci = new FciLearner();
        return fci.learn(input, k, ParameterValues.resolve("fci", fci.description().parameters(), raw),
                RunContext.of(3, null, 2)).graph();
    }

    /** Checks the three promises on every edge of {@code g}. */
    private static void checkHonoured(Knowledge k, Graph g, String reqFrom, String reqTo, String fa, String fb) {
        int from = g.index(reqFrom);
        int to = g.index(reqTo);
        assertTrue(g.adjacent(from, to), "required " + reqFrom + " -> " + reqTo + ": " + g);
        assertEquals(Mark.TAIL, g.markAt(from, to), "required edge tail: " + g);
        assertEquals(Mark.ARROW, g.markAt(to, from), "required edge arrowhead: " + g);
        assertFalse(g.adjacent(g.index(fa), g.index(fb)), "forbidden " + fa + " ~ " + fb);
        for (Edge e : g.edges()) {
            String a = g.name(e.a());
            String b = g.name(e.b());
            if (k.isForbidden(b, a)) {
                assertEquals(Mark.ARROW, e.atB(), "later/forbidden end " + b + " of " + e + " must be an arrowhead");
            }
            if (k.isForbidden(a, b)) {
                assertEquals(Mark.ARROW, e.atA(), "later/forbidden end " + a + " of " + e + " must be an arrowhead");
            }
        }
    }

    @Test
    @DisplayName("oracle, knowledge true of the truth: knowledge honoured and every non-circle mark still agrees with "
            + "the MAG (Zhang 2008 soundness), 40 seeded truths with hidden confounders")
    void trueKnowledgeWithTheOracle() {
        int tierArrows = 0;
        for (long seed = 1; seed <= 40; seed++) {
            Graph dag = RandomDags.hideConfounders(RandomDags.erdosRenyi(12, 2.5, 3000 + seed), 2, seed);
            Graph mag = LatentProjection.mag(dag);
            UniformRandomProvider rng = Seeds.random(4000 + seed);
            // Tiers: the observed variables in a causal order, cut in three.
            List<String> ordered = new ArrayList<>();
            for (int v : Ancestry.topologicalOrder(dag)) {
                if (!dag.isHidden(v)) {
                    ordered.add(dag.name(v));
                }
            }
            int third = ordered.size() / 3;
            Knowledge.Builder kb = Knowledge.builder().tier(ordered.subList(0, third))
                    .tier(ordered.subList(third, 2 * third)).tier(ordered.subList(2 * third, ordered.size()));
            // Required: a true edge between observed variables; forbidden: a pair the MAG does not join.
            List<Edge> observedEdges = new ArrayList<>();
            for (Edge e : dag.edges()) {
                if (!dag.isHidden(e.a()) && !dag.isHidden(e.b())) {
                    observedEdges.add(e);
                }
            }
            Edge req = observedEdges.get(rng.nextInt(observedEdges.size()));
            String reqFrom = dag.name(req.isDirectedFrom(req.a()) ? req.a() : req.b());
            String reqTo = dag.name(req.other(dag.index(reqFrom)));
            String fa = null;
            String fb = null;
            while (fa == null) {
                int a = rng.nextInt(mag.size());
                int b = rng.nextInt(mag.size());
                if (a != b && !mag.adjacent(a, b)) {
                    fa = mag.name(a);
                    fb = mag.name(b);
                }
            }
            Knowledge k = kb.require(reqFrom, reqTo).forbid(fa, fb).forbid(fb, fa).build();
            Graph g = learn(LearnerInput.of(new Oracle(dag, null)), k, Map.of("skeleton",
                    seed % 2 == 0 ? "sequential" : "order-independent"));
            checkHonoured(k, g, reqFrom, reqTo, fa, fb);
            assertEquals(mag.edgeCount(), g.edgeCount(), "seed " + seed + ": skeleton");
            for (Edge e : g.edges()) {
                Edge inMag = mag.edge(e.a(), e.b());
                for (int end : new int[] {e.a(), e.b()}) {
                    if (e.markAt(end) != Mark.CIRCLE) {
                        assertEquals(inMag.markAt(end), e.markAt(end), "seed " + seed + ": mark at " + g.name(end)
                                + " on " + e + "\n knowledge " + k.tiers());
                    }
                }
                int ta = k.tierOf(g.name(e.a()));
                int tb = k.tierOf(g.name(e.b()));
                tierArrows += ta != tb ? 1 : 0;
            }
        }
        assertTrue(tierArrows > 100, "edges across tiers exercised: " + tierArrows);
    }

    @Test
    @DisplayName("data and arbitrary knowledge (often against the truth): required present as from --> to, forbidden "
            + "absent, no edge from a later tier into an earlier one, 20 seeded cases")
    void arbitraryKnowledgeOnData() {
        for (int rep = 0; rep < 20; rep++) {
            Graph dag = RandomDags.hideConfounders(RandomDags.erdosRenyi(13, 2.5, 500 + rep), 1, rep);
            List<String> names = new ArrayList<>();
            for (int v : dag.observedIndices()) {
                names.add(dag.name(v));
            }
            UniformRandomProvider rng = Seeds.random(600 + rep);
            int[] perm = RandomDags.permutation(names.size(), rng);
            Knowledge.Builder kb = Knowledge.builder();
            kb.tier(List.of(names.get(perm[0]), names.get(perm[1]), names.get(perm[2]), names.get(perm[3])));
            kb.tier(List.of(names.get(perm[4]), names.get(perm[5]), names.get(perm[6]), names.get(perm[7])));
            String reqFrom = names.get(perm[0]);
            String reqTo = names.get(perm[5]);
            String fa = names.get(perm[8]);
            String fb = names.get(perm[9]);
            Knowledge k = kb.require(reqFrom, reqTo).forbid(fa, fb).forbid(fb, fa).build();
            Graph g = learn(LearnerInput.of(SmallData.linearGaussian(dag, 400, 700 + rep)), k,
                    Map.of("alpha", 0.05, "skeleton", rep % 2 == 0 ? "sequential" : "order-independent"));
            checkHonoured(k, g, reqFrom, reqTo, fa, fb);
            Graph free = learn(LearnerInput.of(SmallData.linearGaussian(dag, 400, 700 + rep)), Knowledge.none(),
                    Map.of("alpha", 0.05));
            if (rep == 0) {
                assertNotEquals(free, g, "the knowledge must change something");
            }
        }
    }
}
