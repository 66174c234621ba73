package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static dev.touchstone.core.graph.algorithms.PagTestGraphs.graph;
import static dev.touchstone.core.graph.algorithms.PagTestGraphs.hidden;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Worked examples of the true PAG and properties on random DAGs with hidden confounders.
 * Each worked example is also checked against the enumerated Markov equivalence class
 * (the definition of the PAG, Zhang 2008 §2) so the expected marks do not rest on the rules.
 */
class PagsTest {

    private static void assertPag(Graph expected, Graph dag) {
        Graph pag = Pags.of(dag);
        assertEquals(expected, pag);
        Graph mag = LatentProjection.mag(dag);
        assertEquals(expected, MarkovClasses.pagByDefinition(MarkovClasses.equivalenceClass(mag, false)),
                "the expected PAG must be the one the definition gives");
    }

    private static Graph withRules(PagRules rules, Graph dag) {
        return PagDefinitionTest.pagWith(rules, LatentProjection.mag(dag));
    }

    @Test
    @DisplayName("sprinkler network, nothing hidden: the CPDAG's skeleton with PAG marks (Pearl 2000, ch. 1)")
    void sprinkler() {
        Graph dag = graph("season sprinkler rain wet slippery",
                "season --> sprinkler; season --> rain; sprinkler --> wet; rain --> wet; wet --> slippery");
        // R0: sprinkler o→ wet ←o rain (the v-structure). R1: wet → slippery. R9: the
        // uncovered potentially directed path <sprinkler, season, rain, wet> (season not
        // adjacent to wet) turns sprinkler o→ wet into sprinkler → wet; likewise for rain.
        // So the PAG has tails where the CPDAG has the v-structure's tails, and circles on
        // the CPDAG's undirected edges.
        assertPag(graph("season sprinkler rain wet slippery",
                "season o-o sprinkler; season o-o rain; sprinkler --> wet; rain --> wet; wet --> slippery"), dag);
    }

    @Test
    @DisplayName("Y-structure: A → C ← B, C → D leaves C → D visible even with latents possible (Mani, Cooper and Spirtes 2006; from memory)")
    void yStructure() {
        Graph dag = graph("A B C D", "A --> C; B --> C; C --> D");
        assertPag(graph("A B C D", "A o-> C; B o-> C; C --> D"), dag);
    }

    @Test
    @DisplayName("a hidden common cause of B and C with A → B, D → C gives A o→ B ↔ C ←o D (Spirtes, Glymour and Scheines 2000, ch. 6; from memory)")
    void latentCommonCauseDetected() {
        // A → B ← H → C ← D, H hidden: MAG A → B <-> C ← D. Unshielded colliders at B
        // (A, C) and at C (B, D) put arrowheads at both ends of B–C; A and D keep circles.
        Graph dag = hidden("A B H C D", "H", "A --> B; H --> B; H --> C; D --> C");
        assertPag(graph("A B C D", "A o-> B; B <-> C; D o-> C"), dag);
        // With only one outside cause the arrowhead at C is not identified.
        Graph oneSided = hidden("A B H C", "H", "A --> B; H --> B; H --> C");
        assertPag(graph("A B C", "A o-> B; C o-> B"), oneSided);
    }

    @Test
    @DisplayName("R4, collider case: on the discriminating path <T, A, B, C> B is a collider, so A ↔ B ↔ C (Zhang 2008, R4; constructed, reasoned out)")
    void discriminatingPathCollider() {
        // DAG T → A ← H1 → B ← H2 → C, A → C, H1 and H2 hidden. MAG: T → A <-> B <-> C, A → C;
        // T is adjacent to neither B nor C. R0: T o→ A ←o B (unshielded at A). R1: A → C.
        // R2: B *→ A → C gives B o→ C. Then <T, A, B, C> is a discriminating path for B
        // (A a collider on it and a parent of C, T not adjacent to C), B is a collider in
        // the MAG, so R4 orients A <-> B <-> C.
        Graph dag = hidden("T A B C H1 H2", "H1 H2", "T --> A; H1 --> A; H1 --> B; H2 --> B; H2 --> C; A --> C");
        assertPag(graph("T A B C", "T o-> A; A <-> B; B <-> C; A --> C"), dag);
        // Without R4 the marks at B stay circles: the rule is what decides them.
        Graph noR4 = withRules(PagRules.withoutSelectionBias().without(PagRules.Rule.R4), dag);
        assertEquals(Mark.CIRCLE, noR4.markAt(noR4.index("B"), noR4.index("C")));
        assertEquals(Mark.CIRCLE, noR4.markAt(noR4.index("B"), noR4.index("A")));
    }

    @Test
    @DisplayName("R4, non-collider case: T → A ← B → C, A → C gives B → C (Zhang 2008, R4; constructed, reasoned out)")
    void discriminatingPathNonCollider() {
        // Nothing hidden. R0: T o→ A ←o B; R1: A → C; R2: B o→ C. <T, A, B, C> discriminates
        // B, which is a non-collider (in every separating set of T and C), so B → C.
        Graph dag = graph("T A B C", "T --> A; B --> A; B --> C; A --> C");
        assertPag(graph("T A B C", "T o-> A; B o-> A; B --> C; A --> C"), dag);
        Graph noR4 = withRules(PagRules.withoutSelectionBias().without(PagRules.Rule.R4), dag);
        assertEquals(Mark.CIRCLE, noR4.markAt(noR4.index("B"), noR4.index("C")));
    }

    @Test
    @DisplayName("R9 yields tails: A → B, A → C, B → D ← C gives B → D ← C (Zhang 2008, R9; constructed, reasoned out)")
    void r9Tails() {
        // R0 gives B o→ D ←o C. <B, A, C, D> is an uncovered potentially directed path
        // (B o−o A o−o C o→ D; B, C and A, D not adjacent) with A not adjacent to D, so R9
        // turns B o→ D into B → D; likewise C → D. (B <-> D would make A → B <-> D a
        // collider at B and open A–D given {B, C}.)
        Graph dag = graph("A B C D", "A --> B; A --> C; B --> D; C --> D");
        assertPag(graph("A B C D", "A o-o B; A o-o C; B --> D; C --> D"), dag);
        Graph noR9 = withRules(PagRules.withoutSelectionBias().without(PagRules.Rule.R9), dag);
        assertEquals(Mark.CIRCLE, noR9.markAt(noR9.index("B"), noR9.index("D")));
    }

    @Test
    @DisplayName("R10 yields a tail: two uncovered p.d. paths from A into the parents of G (Zhang 2008, R10; constructed, reasoned out)")
    void r10Tail() {
        // Nothing hidden. U → B ← M ← A → W → C ← V, B → G ← C, M → G ← W, A → G.
        // R0: U o→ B ←o M, V o→ C ←o W, and arrowheads at G on every edge (each pair of G's
        // neighbours but M–B and W–C is non-adjacent). R1: B → G and C → G (U, V not
        // adjacent to G). For A o→ G, R10 applies: B → G ← C, <A, M, B> and <A, W, C> are
        // uncovered potentially directed paths, and M, W are distinct and not adjacent: A → G.
        // R8 cannot (no tail at A), R9 cannot (every neighbour of A is adjacent to G), R4
        // cannot (no edge into A).
        Graph dag = graph("U V A M W B C G",
                "U --> B; M --> B; A --> M; B --> G; M --> G; V --> C; W --> C; A --> W; C --> G; W --> G; A --> G");
        assertPag(graph("U V A M W B C G", "U o-> B; M o-> B; A o-o M; B --> G; M --> G; V o-> C; W o-> C; A o-o W;"
                + " C --> G; W --> G; A --> G"), dag);
        Graph noR10 = withRules(PagRules.withoutSelectionBias().without(PagRules.Rule.R10), dag);
        assertEquals(Mark.CIRCLE, noR10.markAt(noR10.index("A"), noR10.index("G")));
    }

    @Test
    @DisplayName("R4 and R10 each decide A → G when <U, B, A, G> discriminates A (Zhang 2008, R4 and R10; constructed, reasoned out)")
    void r4DecidesTail() {
        // U → B ← A, V → C ← A, B → G ← C, A → G. R0/R1 give U o→ B ←o A and B → G; B is a
        // collider on <U, B, A> and a parent of G, U is not adjacent to G, so <U, B, A, G> is
        // a discriminating path for A, which is a non-collider: A → G.
        Graph dag = graph("U V A B C G", "U --> B; A --> B; V --> C; A --> C; B --> G; C --> G; A --> G");
        assertPag(graph("U V A B C G", "U o-> B; A o-> B; V o-> C; A o-> C; B --> G; C --> G; A --> G"), dag);
        // R10 reaches the same tail on its own (B → G ← C, paths <A, B> and <A, C>); without
        // both rules the mark stays a circle.
        PagRules rules = PagRules.withoutSelectionBias();
        Graph noR4 = withRules(rules.without(PagRules.Rule.R4), dag);
        Graph noR10 = withRules(rules.without(PagRules.Rule.R10), dag);
        Graph neither = withRules(rules.without(PagRules.Rule.R4, PagRules.Rule.R10), dag);
        assertEquals(Mark.TAIL, noR4.markAt(noR4.index("A"), noR4.index("G")));
        assertEquals(Mark.TAIL, noR10.markAt(noR10.index("A"), noR10.index("G")));
        assertEquals(Mark.CIRCLE, neither.markAt(neither.index("A"), neither.index("G")));
    }

    @Test
    @DisplayName("ofMag refuses a graph that is not a MAG, naming why")
    void ofMagBadInput() {
        String why = assertThrows(IllegalArgumentException.class,
                () -> Pags.ofMag(graph("A B C", "A --> C; C --> B; A <-> B"))).getMessage();
        assertTrue(why.contains("almost directed cycle"), why);
        assertEquals(graph("A B", "A o-o B"), Pags.ofMag(graph("A B", "A <-> B")));
    }

    @Test
    @DisplayName("on 200 random DAGs with hidden confounders: PAG skeleton = MAG skeleton, every tail/arrow agrees with the MAG (soundness, Zhang 2008), covered-edge reversals of the full DAG (Chickering 1995) give the same PAG, FCI-style separating sets give the same PAG, complete rules change nothing")
    void randomProperties() {
        int arrows = 0;
        int tails = 0;
        int differentMags = 0;
        for (long seed = 1; seed <= 200; seed++) {
            int n = 10 + (int) (seed % 16);
            Graph dag = RandomDags.hideConfounders(RandomDags.erdosRenyi(n, 2 + seed % 3, seed), 1 + (int) (seed % 4), seed);
            Graph mag = LatentProjection.mag(dag);
            Graph pag = Pags.of(dag);
            assertEquals(mag.names(), pag.names());
            assertEquals(mag.edgeCount(), pag.edgeCount(), "seed " + seed);
            for (Edge e : pag.edges()) {
                Edge inMag = mag.edge(e.a(), e.b());
                assertTrue(inMag != null, "seed " + seed + ": skeleton");
                for (int end : new int[] {e.a(), e.b()}) {
                    Mark mark = e.markAt(end);
                    if (mark != Mark.CIRCLE) {
                        assertEquals(inMag.markAt(end), mark, "seed " + seed + ": mark at " + pag.name(end) + " on " + e);
                        if (mark == Mark.ARROW) {
                            arrows++;
                        } else {
                            tails++;
                        }
                    }
                }
            }
            Graph equivalentDag = PagTestGraphs.reverseCoveredEdges(dag, 6, Seeds.random(seed + 1));
            Graph equivalentMag = LatentProjection.mag(equivalentDag);
            if (!equivalentMag.equals(mag)) {
                differentMags++;
            }
            assertEquals(pag, Pags.of(equivalentDag), "seed " + seed + ": Markov equivalent DAGs");
            assertEquals(pag, fciStyle(dag, mag), "seed " + seed + ": separating sets");
            if (seed % 4 == 0) {
                assertEquals(pag, PagDefinitionTest.pagWith(PagRules.complete(), mag), "seed " + seed + ": R5–R7");
            }
        }
        assertTrue(arrows > 800 && tails > 200, "orientations exercised: arrows " + arrows + ", tails " + tails);
        assertTrue(differentMags > 50, "reversals must produce different MAGs, got " + differentMags);
    }

    @Test
    @DisplayName("nothing hidden: DAGs of one CPDAG (covered-edge reversals, Chickering 1995) give one PAG, with the DAG's skeleton")
    void markovEquivalentDagsNothingHidden() {
        int distinctDags = 0;
        for (long seed = 1; seed <= 200; seed++) {
            Graph dag = RandomDags.erdosRenyi(8 + (int) (seed % 15), 2 + seed % 3, seed);
            Graph pag = Pags.of(dag);
            assertEquals(dag.edgeCount(), pag.edgeCount());
            for (Edge e : dag.edges()) {
                assertTrue(pag.adjacent(e.a(), e.b()));
            }
            Graph other = PagTestGraphs.reverseCoveredEdges(dag, 5, Seeds.random(seed * 31));
            if (!other.equals(dag)) {
                distinctDags++;
            }
            assertEquals(pag, Pags.of(other), "seed " + seed);
        }
        assertTrue(distinctDags > 100, "distinct equivalent DAGs: " + distinctDags);
        // A DAG outside the class (a new v-structure) must give a different PAG.
        assertNotEquals(Pags.of(graph("A B C", "A --> B; B --> C")), Pags.of(graph("A B C", "A --> B; C --> B")));
    }

    @Test
    @DisplayName("nothing hidden: PAG and CPDAG agree (every DAG of the class is a MAG of the class, Meek 1995 and Zhang 2008): CPDAG-undirected edges are o-o, PAG tails and arrows match the CPDAG's directed edges")
    void agreesWithCpdag() {
        int tails = 0;
        for (long seed = 1; seed <= 200; seed++) {
            Graph dag = RandomDags.erdosRenyi(10 + (int) (seed % 20), 2 + seed % 3, seed);
            Graph pag = Pags.of(dag);
            Graph cpdag = Cpdags.of(dag);
            assertEquals(cpdag.edgeCount(), pag.edgeCount());
            for (Edge e : cpdag.edges()) {
                Edge p = pag.edge(e.a(), e.b());
                if (e.isUndirected()) {
                    assertEquals(new Edge(e.a(), e.b(), Mark.CIRCLE, Mark.CIRCLE), p, "seed " + seed);
                } else {
                    for (int end : new int[] {e.a(), e.b()}) {
                        if (p.markAt(end) != Mark.CIRCLE) {
                            assertEquals(e.markAt(end), p.markAt(end), "seed " + seed + " on " + e);
                            tails += p.markAt(end) == Mark.TAIL ? 1 : 0;
                        }
                    }
                }
            }
        }
        assertTrue(tails > 200, "tails " + tails);
    }

    /**
     * The PAG as FCI would orient it with a d-separation oracle: R0 and R4 decided by
     * membership in a separating set, here {@code (an({x, y}) ∩ observed) \ {x, y}}, which
     * separates every non-adjacent pair (see {@link LatentProjection}).
     */
    private static Graph fciStyle(Graph dag, Graph mag) {
        int[] obs = dag.observedIndices();
        DSeparation d = new DSeparation(dag);
        Map<Long, boolean[]> sepsets = new HashMap<>();
        for (int x = 0; x < obs.length; x++) {
            for (int y = x + 1; y < obs.length; y++) {
                if (mag.adjacent(x, y)) {
                    continue;
                }
                boolean[] anc = Ancestry.ancestors(dag, obs[x], obs[y]);
                List<Integer> set = new ArrayList<>();
                boolean[] member = new boolean[obs.length];
                for (int v = 0; v < obs.length; v++) {
                    if (v != x && v != y && anc[obs[v]]) {
                        set.add(obs[v]);
                        member[v] = true;
                    }
                }
                assertTrue(d.separated(obs[x], obs[y], set.stream().mapToInt(Integer::intValue).toArray()));
                sepsets.put((long) x * obs.length + y, member);
            }
        }
        SeparationInfo info = SeparationInfo.fromSeparatingSets((x, y, v) -> {
            boolean[] s = sepsets.get((long) Math.min(x, y) * obs.length + Math.max(x, y));
            if (s == null) {
                throw new AssertionError("no separating set asked for an adjacent pair");
            }
            return s[v];
        });
        MutableGraph pag = Graph.builder(mag.names());
        for (Edge e : mag.edges()) {
            pag.addEdge(e.a(), e.b(), Mark.CIRCLE, Mark.CIRCLE);
        }
        PagRules.withoutSelectionBias().orient(pag, info);
        return pag.freeze();
    }

    @Test
    @DisplayName("the PAG does not depend on the order of the variables (Zhang 2008: the closure is unique)")
    void orderIndependent() {
        for (long seed = 1; seed <= 40; seed++) {
            Graph dag = RandomDags.hideConfounders(RandomDags.erdosRenyi(20, 3, seed), 3, seed);
            Graph pag = Pags.of(dag);
            int[] perm = RandomDags.permutation(dag.size(), Seeds.random(seed + 5));
            List<String> names = new ArrayList<>();
            for (int p : perm) {
                names.add(dag.name(p));
            }
            MutableGraph shuffled = Graph.builder(names);
            for (int i = 0; i < perm.length; i++) {
                shuffled.setHidden(i, dag.isHidden(perm[i]));
            }
            for (Edge e : dag.edges()) {
                shuffled.addEdge(shuffled.indexOf(dag.name(e.a())), shuffled.indexOf(dag.name(e.b())), e.atA(), e.atB());
            }
            Graph other = Pags.of(shuffled.freeze());
            for (Edge e : pag.edges()) {
                int a = other.index(pag.name(e.a()));
                int b = other.index(pag.name(e.b()));
                assertEquals(e.atA(), other.markAt(a, b), "seed " + seed);
                assertEquals(e.atB(), other.markAt(b, a), "seed " + seed);
            }
            assertEquals(pag.edgeCount(), other.edgeCount());
        }
    }
}
