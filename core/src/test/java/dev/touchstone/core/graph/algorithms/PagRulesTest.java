package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Set;

import static dev.touchstone.core.graph.algorithms.PagTestGraphs.graph;
import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * Each rule on the smallest partial graph its statement in Zhang (2008, §3, rules R0–R10)
 * describes, and on a variant where a premise fails and nothing may change.
 */
class PagRulesTest {

    private static final String NAMES = "A B C D T G";

    /** Information that must not be consulted (rules other than R0 and R4). */
    private static final SeparationInfo UNUSED = new SeparationInfo() {
        @Override
        public boolean unshieldedCollider(int a, int b, int c) {
            throw new AssertionError("R0 information asked");
        }

        @Override
        public boolean discriminatedCollider(int theta, int a, int b, int c) {
            throw new AssertionError("R4 information asked");
        }
    };

    private static Graph apply(PagRules rules, String edges, SeparationInfo info) {
        MutableGraph g = graph(NAMES, edges).toMutable();
        rules.close(g, info);
        return g.freeze();
    }

    private static void check(PagRules.Rule rule, String before, String after) {
        assertEquals(graph(NAMES, after), apply(PagRules.only(rule), before, UNUSED), rule + " on " + before);
    }

    private static void unchanged(PagRules.Rule rule, String before) {
        check(rule, before, before);
    }

    @Test
    @DisplayName("close calls its checkpoint before every pass, and a checkpoint that throws stops it (deadline seam)")
    void checkpoint() {
        int[] calls = {0};
        MutableGraph g = graph(NAMES, "A o-> B; B o-o C").toMutable();
        PagRules.only(PagRules.Rule.R1).close(g, UNUSED, () -> calls[0]++);
        // R1 fires in the first pass; a second pass confirms nothing changes any more.
        assertEquals(2, calls[0]);
        assertEquals(graph(NAMES, "A o-> B; B --> C"), g.freeze());
        MutableGraph h = graph(NAMES, "A o-> B; B o-o C").toMutable();
        org.junit.jupiter.api.Assertions.assertThrows(IllegalStateException.class,
                () -> PagRules.complete().close(h, UNUSED, () -> {
                    throw new IllegalStateException("deadline");
                }));
        assertEquals(graph(NAMES, "A o-> B; B o-o C"), h.freeze(), "stopped before the first pass");
    }

    @Test
    @DisplayName("R1: A *→ B o−* C, A and C not adjacent ⇒ B → C (Zhang 2008)")
    void r1() {
        check(PagRules.Rule.R1, "A o-> B; B o-o C", "A o-> B; B --> C");
        check(PagRules.Rule.R1, "A <-> B; B o-> C", "A <-> B; B --> C");
        unchanged(PagRules.Rule.R1, "A o-> B; B o-o C; A o-o C");
        // A conclusion that contradicts a mark already there is not applied.
        unchanged(PagRules.Rule.R1, "A o-> B; B o-- C");
    }

    @Test
    @DisplayName("R2: A → B *→ C or A *→ B → C, and A *−o C ⇒ A *→ C (Zhang 2008)")
    void r2() {
        check(PagRules.Rule.R2, "A --> B; B o-> C; A o-o C", "A --> B; B o-> C; A o-> C");
        check(PagRules.Rule.R2, "A <-> B; B --> C; A o-o C", "A <-> B; B --> C; A o-> C");
        unchanged(PagRules.Rule.R2, "A o-> B; B o-> C; A o-o C");
    }

    @Test
    @DisplayName("R3: A *→ B ←* C, A *−o T o−* C, A and C not adjacent, T *−o B ⇒ T *→ B (Zhang 2008)")
    void r3() {
        check(PagRules.Rule.R3, "A o-> B; C o-> B; A o-o T; T o-o C; T o-o B",
                "A o-> B; C o-> B; A o-o T; T o-o C; T o-> B");
        unchanged(PagRules.Rule.R3, "A o-> B; C o-> B; A o-o T; T o-o C; T o-o B; A o-o C");
    }

    @Test
    @DisplayName("R4: on a discriminating path for B, B → C if B is in the separating set of its ends, else A ↔ B ↔ C (Zhang 2008)")
    void r4() {
        // <T, A, B, C>: A is a collider on it and a parent of C; T is not adjacent to C.
        String path = "T o-> A; B o-> A; A --> C; B o-o C";
        Graph g = graph(NAMES, path);
        int t = g.index("T");
        int b = g.index("B");
        int c = g.index("C");
        SeparationInfo inSepset = SeparationInfo.fromSeparatingSets(
                (x, y, v) -> Set.of(x, y).equals(Set.of(t, c)) && v == b);
        SeparationInfo notInSepset = SeparationInfo.fromSeparatingSets((x, y, v) -> false);
        PagRules r4 = PagRules.only(PagRules.Rule.R4);
        assertEquals(graph(NAMES, "T o-> A; B o-> A; A --> C; B --> C"), apply(r4, path, inSepset));
        assertEquals(graph(NAMES, "T o-> A; B <-> A; A --> C; B <-> C"), apply(r4, path, notInSepset));
        // A longer path <T, D, A, B, C>: D and A colliders on it and parents of C.
        String longer = "T o-> D; D <-> A; B o-> A; D --> C; A --> C; B o-o C";
        assertEquals(graph(NAMES, "T o-> D; D <-> A; B o-> A; D --> C; A --> C; B --> C"),
                apply(r4, longer, inSepset));
        // D not a parent of C: no discriminating path, nothing changes.
        String broken = "T o-> D; D <-> A; B o-> A; D <-> C; A --> C; B o-o C";
        assertEquals(graph(NAMES, broken), apply(r4, broken, inSepset));
        // T adjacent to C: not discriminating either.
        String shielded = path + "; T o-o C";
        assertEquals(graph(NAMES, shielded), apply(r4, shielded, inSepset));
    }

    @Test
    @DisplayName("R5: an uncovered circle cycle becomes undirected (Zhang 2008)")
    void r5() {
        check(PagRules.Rule.R5, "A o-o B; B o-o C; C o-o D; D o-o A", "A --- B; B --- C; C --- D; D --- A");
        unchanged(PagRules.Rule.R5, "A o-o B; B o-o C; C o-o D; D o-o A; A o-o C");
        unchanged(PagRules.Rule.R5, "A o-o B; B o-o C; C o-> D; D o-o A");
    }

    @Test
    @DisplayName("R6: A − B and B o−* C ⇒ B −* C (Zhang 2008)")
    void r6() {
        check(PagRules.Rule.R6, "A --- B; B o-> C", "A --- B; B --> C");
        // Applied to closure: B − A also turns A o−o C into A −o C.
        check(PagRules.Rule.R6, "A --- B; B o-o C; A o-o C", "A --- B; B --o C; A --o C");
    }

    @Test
    @DisplayName("R7: A −o B o−* C, A and C not adjacent ⇒ B −* C (Zhang 2008)")
    void r7() {
        check(PagRules.Rule.R7, "A --o B; B o-o C", "A --o B; B --o C");
        unchanged(PagRules.Rule.R7, "A --o B; B o-o C; A o-o C");
    }

    @Test
    @DisplayName("R8: A → B → C or A −o B → C, and A o→ C ⇒ A → C (Zhang 2008)")
    void r8() {
        check(PagRules.Rule.R8, "A --> B; B --> C; A o-> C", "A --> B; B --> C; A --> C");
        check(PagRules.Rule.R8, "A --o B; B --> C; A o-> C", "A --o B; B --> C; A --> C");
        unchanged(PagRules.Rule.R8, "A o-> B; B --> C; A o-> C");
    }

    @Test
    @DisplayName("R9: A o→ C with an uncovered potentially directed path <A, B, ..., C>, B and C not adjacent ⇒ A → C (Zhang 2008)")
    void r9() {
        // Symmetric: <C, B, A, D> turns C o→ D into C → D as well.
        check(PagRules.Rule.R9, "A o-> D; A o-o B; B o-o C; C o-> D", "A --> D; A o-o B; B o-o C; C --> D");
        check(PagRules.Rule.R9, "A o-> G; A o-o B; B --> C; C o-o D; D o-> G",
                "A --> G; A o-o B; B --> C; C o-o D; D o-> G");
        // Covered (A adjacent to C), or not potentially directed (B <-> C, either way): no change.
        unchanged(PagRules.Rule.R9, "A o-> D; A o-o B; B o-o C; C o-> D; A o-o C");
        unchanged(PagRules.Rule.R9, "A o-> D; A o-o B; B <-> C; C o-> D");
    }

    @Test
    @DisplayName("R10: A o→ G, B → G ← C, uncovered p.d. paths from A to B and to C starting with non-adjacent vertices ⇒ A → G (Zhang 2008)")
    void r10() {
        check(PagRules.Rule.R10, "A o-> G; B --> G; C --> G; A o-> B; A o-> C",
                "A --> G; B --> G; C --> G; A o-> B; A o-> C");
        // <A, D, B> and <A, C>; then for D o→ G also <D, B> and <D, A, C> (B, A not adjacent).
        check(PagRules.Rule.R10, "A o-> G; B --> G; C --> G; A o-o D; D o-> B; A o-> C; D o-> G",
                "A --> G; B --> G; C --> G; A o-o D; D o-> B; A o-> C; D --> G");
        unchanged(PagRules.Rule.R10, "A o-> G; B --> G; C --> G; A o-> B; A o-> C; B o-o C");
        unchanged(PagRules.Rule.R10, "A o-> G; B --> G; C o-> G; A o-> B; A o-> C");
    }

    @Test
    @DisplayName("R0: unshielded colliders from the separating sets (Spirtes, Glymour and Scheines 2000; Zhang 2008)")
    void r0() {
        Graph g = graph(NAMES, "A o-o B; B o-o C");
        int b = g.index("B");
        MutableGraph collider = g.toMutable();
        PagRules.complete().orientColliders(collider, SeparationInfo.fromSeparatingSets((x, y, v) -> false));
        assertEquals(graph(NAMES, "A o-> B; C o-> B"), collider.freeze());
        MutableGraph chain = g.toMutable();
        PagRules.complete().orientColliders(chain, SeparationInfo.fromSeparatingSets((x, y, v) -> v == b));
        assertEquals(g, chain.freeze());
    }

    @Test
    @DisplayName("with arbitrary (inconsistent) collider answers, as finite-sample tests give, the rules terminate and only replace circles (design of PagRules)")
    void inconsistentInformation() {
        for (long seed = 1; seed <= 100; seed++) {
            UniformRandomProvider rng = Seeds.random(seed);
            Graph skeleton = RandomDags.erdosRenyi(15, 3.5, seed);
            MutableGraph g = Graph.builder(skeleton.names());
            for (Edge e : skeleton.edges()) {
                Mark[] marks = Mark.values();
                g.addEdge(e.a(), e.b(), rng.nextInt(4) == 0 ? marks[rng.nextInt(3)] : Mark.CIRCLE,
                        rng.nextInt(4) == 0 ? marks[rng.nextInt(3)] : Mark.CIRCLE);
            }
            Graph before = g.freeze();
            long salt = rng.nextLong();
            SeparationInfo coin = new SeparationInfo() {
                @Override
                public boolean unshieldedCollider(int a, int b, int c) {
                    return ((a * 31L + b * 17L + c + salt) & 4) == 0;
                }

                @Override
                public boolean discriminatedCollider(int theta, int a, int b, int c) {
                    return ((theta * 7L + b * 13L + c + salt) & 8) == 0;
                }
            };
            PagRules.complete().orient(g, coin);
            Graph after = g.freeze();
            for (Edge e : before.edges()) {
                for (int end : new int[] {e.a(), e.b()}) {
                    if (e.markAt(end) != Mark.CIRCLE) {
                        assertEquals(e.markAt(end), after.markAt(end, e.other(end)), "seed " + seed);
                    }
                }
            }
            assertEquals(before.edgeCount(), after.edgeCount());
        }
    }

    @Test
    @DisplayName("rule sets: without selection bias leaves out R5–R7")
    void ruleSets() {
        assertEquals(10, PagRules.complete().rules().size());
        assertEquals(Set.of(PagRules.Rule.R1, PagRules.Rule.R2, PagRules.Rule.R3, PagRules.Rule.R4, PagRules.Rule.R8,
                PagRules.Rule.R9, PagRules.Rule.R10), PagRules.withoutSelectionBias().rules());
        assertEquals(Set.of(), PagRules.only().rules());
    }
}
