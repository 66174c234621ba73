package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class MeekRulesTest {

    // --- Each rule on its smallest example (Meek 1995, Figure 1). -------------------------

    @Test
    @DisplayName("R1: a -> b -- c with a, c not adjacent gives b -> c (Meek 1995)")
    void ruleOne() {
        assertEquals(TestGraphs.of("a b c", "a->b, b->c"), MeekRules.apply(TestGraphs.of("a b c", "a->b, b--c")));
    }

    @Test
    @DisplayName("R2: a -> b -> c with a -- c gives a -> c (Meek 1995)")
    void ruleTwo() {
        assertEquals(TestGraphs.of("a b c", "a->b, b->c, a->c"),
                MeekRules.apply(TestGraphs.of("a b c", "a->b, b->c, a--c")));
    }

    @Test
    @DisplayName("R3: a -- c -> b, a -- d -> b, c, d not adjacent, a -- b gives a -> b (Meek 1995)")
    void ruleThree() {
        assertEquals(TestGraphs.of("a b c d", "a--c, a--d, c->b, d->b, a->b"),
                MeekRules.apply(TestGraphs.of("a b c d", "a--c, a--d, c->b, d->b, a--b")));
    }

    @Test
    @DisplayName("R4: a -- c -> d -> b, a -- d, c, b not adjacent, a -- b gives a -> b, and only R4 applies (Meek 1995)")
    void ruleFour() {
        // By hand: if b -> a, then a -- c must be c -> a (a -> c closes a -> c -> d -> b -> a),
        // and c -> a <- b is a new v-structure (c, b not adjacent). So a -> b. No other edge
        // is forced: R1 needs a parent of a or of d not adjacent to the other end (c -> d, but
        // c is adjacent to a), R2 a directed path of length two alongside an undirected edge.
        Graph in = TestGraphs.of("a b c d", "a--c, c->d, d->b, a--b, a--d");
        assertEquals(TestGraphs.of("a b c d", "a--c, c->d, d->b, a->b, a--d"), MeekRules.apply(in));
        // The same closure from brute force: the orientations of a -- c, a -- b, a -- d that
        // are acyclic and add no v-structure all have a -> b, and differ on the other two.
        assertEquals(MeekRules.apply(in), BruteForce.maximalOrientation(in));
    }

    @Test
    @DisplayName("a PDAG without undirected edges is returned unchanged; nothing to do is no conflict")
    void nothingToDo() {
        MutableGraph g = TestGraphs.mutable("a b c", "a->b, c->b");
        MeekRules.Outcome out = MeekRules.apply(g, Knowledge.none());
        assertEquals(0, out.oriented());
        assertTrue(out.consistent());
        assertEquals(TestGraphs.of("a b c", "a->b, c->b"), g.freeze());
    }

    // --- Background knowledge, reasoned by hand. -----------------------------------------

    @Test
    @DisplayName("a required direction is oriented and propagated (Meek 1995, rules with background knowledge)")
    void requiredDirectionPropagates() {
        // The chain a - b - c - d is the CPDAG of a -> b -> c -> d (no v-structure). Requiring
        // b -> c forces c -> d by R1 (b, d not adjacent; d -> c would make b -> c <- d a new
        // v-structure). a - b stays undirected: a -> b -> c -> d and a <- b -> c -> d are both
        // in the class and both honour the knowledge.
        MutableGraph g = TestGraphs.mutable("a b c d", "a--b, b--c, c--d");
        MeekRules.Outcome out = MeekRules.apply(g, Knowledge.builder().require("b", "c").build());
        assertEquals(TestGraphs.of("a b c d", "a--b, b->c, c->d"), g.freeze());
        assertEquals(2, out.oriented());
        assertTrue(out.consistent(), out.conflicts()::toString);
    }

    @Test
    @DisplayName("a forbidden direction forces the other one, which is propagated")
    void forbiddenDirectionForcesTheOther() {
        // Forbidding c -> b on the chain leaves only b -> c, hence the same closure as above.
        MutableGraph g = TestGraphs.mutable("a b c d", "a--b, b--c, c--d");
        MeekRules.apply(g, Knowledge.builder().forbid("c", "b").build());
        assertEquals(TestGraphs.of("a b c d", "a--b, b->c, c->d"), g.freeze());
    }

    @Test
    @DisplayName("tiers forbid edges from a later tier into an earlier one, and the rules propagate them")
    void tiersPropagate() {
        // c alone in the first tier: b -> c and d -> c are forbidden, so c -> b and c -> d.
        // Then c -> b - a with c, a not adjacent gives b -> a (R1).
        MutableGraph g = TestGraphs.mutable("a b c d", "a--b, b--c, c--d");
        MeekRules.apply(g, Knowledge.builder().tier(List.of("c")).tier(List.of("a", "b", "d")).build());
        assertEquals(TestGraphs.of("a b c d", "b->a, c->b, c->d"), g.freeze());
    }

    @Test
    @DisplayName("required c -> d on a chordal class propagates by R1 then R4, as brute force over the class confirms")
    void knowledgeThenRuleFour() {
        // The DAG has no v-structure (b, c are the only non-adjacent pair and have no common
        // child), so its CPDAG is all undirected. Requiring c -> d: R1 on c -> d - b (c, b not
        // adjacent) gives d -> b; then a - c -> d -> b with a, d adjacent and c, b not adjacent
        // gives a -> b by R4. a - c and a - d stay undirected. Brute force: the members of the
        // class with c -> d are the no-v-structure acyclic orientations that keep c -> d.
        Graph cpdag = Cpdags.of(TestGraphs.of("a b c d", "a->b, a->c, a->d, c->d, d->b"));
        Knowledge k = Knowledge.builder().require("c", "d").build();
        MutableGraph g = cpdag.toMutable();
        MeekRules.apply(g, k);
        assertEquals(BruteForce.maximalOrientation(TestGraphs.of("a b c d",
                "a--b, a--c, a--d, c->d, b--d")), g.freeze());
    }

    // --- Conflicts: the documented choice is made and reported. --------------------------

    @Test
    @DisplayName("conflict: a required direction against a directed input edge keeps the input edge and says so")
    void requiredAgainstInput() {
        MutableGraph g = TestGraphs.mutable("a b", "a->b");
        MeekRules.Outcome out = MeekRules.apply(g, Knowledge.builder().require("b", "a").build());
        assertEquals(TestGraphs.of("a b", "a->b"), g.freeze());
        assertEquals(List.of("required b -> a but the graph has a -> b; kept a -> b"), out.conflicts());
    }

    @Test
    @DisplayName("conflict: a directed input edge the knowledge forbids is kept and reported")
    void forbiddenInput() {
        MutableGraph g = TestGraphs.mutable("a b", "a->b");
        MeekRules.Outcome out = MeekRules.apply(g, Knowledge.builder().forbid("a", "b").build());
        assertEquals(TestGraphs.of("a b", "a->b"), g.freeze());
        assertEquals(List.of("the graph has a -> b, which the knowledge forbids; kept it"), out.conflicts());
    }

    @Test
    @DisplayName("conflict: both directions forbidden leaves the edge undirected, untouched by the rules")
    void bothForbidden() {
        MutableGraph g = TestGraphs.mutable("a b c", "c->a, a--b");
        MeekRules.Outcome out = MeekRules.apply(g, Knowledge.builder().forbid("a", "b").forbid("b", "a").build());
        assertEquals(TestGraphs.of("a b c", "c->a, a--b"), g.freeze()); // R1 would give a -> b
        assertEquals(List.of("both directions of a --- b are forbidden; left undirected"), out.conflicts());
    }

    @Test
    @DisplayName("conflict: the rules imply both directions (R1 from each side) and the edge stays undirected")
    void rulesImplyBoth() {
        MutableGraph g = TestGraphs.mutable("a b c d", "c->a, a--b, d->b");
        MeekRules.Outcome out = MeekRules.apply(g, Knowledge.none());
        assertEquals(TestGraphs.of("a b c d", "c->a, a--b, d->b"), g.freeze());
        assertEquals(List.of("the rules imply both a -> b and b -> a; left a --- b undirected"), out.conflicts());
    }

    @Test
    @DisplayName("bad input: an edge with a circle or two arrows is refused, naming the edge")
    void refusesOtherMarks() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> MeekRules.apply(TestGraphs.of("a b c", "ao>b, b--c")));
        assertTrue(e.getMessage().startsWith("edge a o-> b is neither directed nor undirected"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> MeekRules.apply(TestGraphs.mutable("a b", "a<>b"), Knowledge.none()));
        assertTrue(e.getMessage().startsWith("edge a <-> b is neither"), e.getMessage());
    }

    // --- Completeness with knowledge, exhaustively. --------------------------------------

    @Test
    @DisplayName("with knowledge drawn from a member DAG, R1–R4 give exactly the edges shared by all class members honouring it, for every class on 4 and 5 nodes (Meek 1995, Theorem 4)")
    void completeWithKnowledgeOnAllSmallClasses() {
        UniformRandomProvider rng = Seeds.random(20261201L);
        int checked = 0;
        for (int n = 4; n <= 5; n++) {
            for (List<Graph> members : SmallDags.classes(n)) {
                Graph member = members.get(rng.nextInt(members.size()));
                Graph cpdag = SmallDags.essentialGraph(members);
                // (1) some of the member's edges required
                Knowledge.Builder req = Knowledge.builder();
                Knowledge.Builder forb = Knowledge.builder();
                List<Edge> chosen = new ArrayList<>();
                for (Edge e : member.edges()) {
                    if (rng.nextDouble() < 0.35) {
                        int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
                        int to = e.other(from);
                        chosen.add(Edge.directed(from, to));
                        req.require(member.name(from), member.name(to));
                        forb.forbid(member.name(to), member.name(from));
                    }
                }
                List<Graph> honouring = new ArrayList<>();
                for (Graph d : members) {
                    boolean ok = true;
                    for (Edge e : chosen) {
                        ok &= d.hasDirected(e.a(), e.b());
                    }
                    if (ok) {
                        honouring.add(d);
                    }
                }
                Graph expected = SmallDags.essentialGraph(honouring);
                assertEquals(expected, closeWith(cpdag, req.build()), () -> "required, class of " + member);
                assertEquals(expected, closeWith(cpdag, forb.build()), () -> "forbidden, class of " + member);
                // (2) tiers: a cut of the member's topological order
                int[] order = Ancestry.topologicalOrder(member);
                int cut = 1 + rng.nextInt(n - 1);
                List<String> early = new ArrayList<>();
                List<String> late = new ArrayList<>();
                for (int i = 0; i < n; i++) {
                    (i < cut ? early : late).add(member.name(order[i]));
                }
                Knowledge tiers = Knowledge.builder().tier(early).tier(late).build();
                List<Graph> inTierOrder = new ArrayList<>();
                for (Graph d : members) {
                    boolean ok = true;
                    for (Edge e : d.edges()) {
                        int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
                        ok &= !tiers.isForbidden(d.name(from), d.name(e.other(from)));
                    }
                    if (ok) {
                        inTierOrder.add(d);
                    }
                }
                assertEquals(SmallDags.essentialGraph(inTierOrder), closeWith(cpdag, tiers),
                        () -> "tiers " + early + " | " + late + ", class of " + member);
                checked++;
            }
        }
        assertEquals(185 + 8782, checked);
    }

    private static Graph closeWith(Graph cpdag, Knowledge k) {
        MutableGraph g = cpdag.toMutable();
        MeekRules.Outcome out = MeekRules.apply(g, k);
        assertTrue(out.consistent(), out.conflicts()::toString);
        return g.freeze();
    }

    // --- The worklist reaches the same closure as plain repeated sweeps. -----------------

    @Test
    @DisplayName("on 120 seeded random CPDAGs (30–150 nodes) with random required edges, the worklist closure equals naive repeated sweeps")
    void worklistEqualsRepeatedSweeps() {
        UniformRandomProvider rng = Seeds.random(7L);
        for (int i = 0; i < 120; i++) {
            int n = 30 + (i * 41) % 121;
            Graph dag = i % 3 == 2 ? RandomDags.scaleFree(n, 2 + i % 3, 300 + i)
                    : RandomDags.erdosRenyi(n, 2 + i % 5, 300 + i);
            Graph cpdag = Cpdags.of(dag);
            Knowledge.Builder kb = Knowledge.builder();
            MutableGraph sweep = cpdag.toMutable();
            for (Edge e : cpdag.edges()) {
                if (e.isUndirected() && rng.nextDouble() < 0.1) {
                    int from = dag.hasDirected(e.a(), e.b()) ? e.a() : e.b();
                    kb.require(dag.name(from), dag.name(e.other(from)));
                    sweep.orient(from, e.other(from));
                }
            }
            BruteForce.sweepToClosure(sweep);
            assertEquals(sweep.freeze(), closeWith(cpdag, kb.build()), "seed " + (300 + i));
        }
    }
}
