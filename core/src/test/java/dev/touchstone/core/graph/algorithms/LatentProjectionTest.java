package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.List;

import static dev.touchstone.core.graph.algorithms.PagTestGraphs.graph;
import static dev.touchstone.core.graph.algorithms.PagTestGraphs.hidden;
import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The latent projection of Richardson and Spirtes (2002, §4.2), on worked cases and on random DAGs. */
class LatentProjectionTest {

    @Test
    @DisplayName("a hidden common cause of two observed variables gives a bidirected edge (Richardson and Spirtes 2002, §4.2; from memory)")
    void hiddenCommonCause() {
        Graph dag = hidden("A H B", "H", "H --> A; H --> B");
        assertEquals(graph("A B", "A <-> B"), LatentProjection.mag(dag));
    }

    @Test
    @DisplayName("a hidden variable on a directed chain gives a directed edge (Richardson and Spirtes 2002, §4.2; from memory)")
    void hiddenChain() {
        Graph dag = hidden("A H B C", "H", "A --> H; H --> B; B --> C");
        assertEquals(graph("A B C", "A --> B; B --> C"), LatentProjection.mag(dag));
    }

    @Test
    @DisplayName("inducing path X → Y ← H → Z with Y → Z joins non-adjacent X and Z (Richardson and Spirtes 2002, §4; reasoned out)")
    void inducingPathGivesDirectedEdge() {
        // Y is an observed collider on X → Y ← H → Z and an ancestor of Z, H is hidden: the
        // path is inducing, so no set separates X from Z (given Y the collider opens, without
        // Y the chain X → Y → Z is open). X is an ancestor of Z, Z is not one of X: X → Z.
        Graph dag = hidden("X Y H Z", "H", "X --> Y; H --> Y; H --> Z; Y --> Z");
        assertEquals(graph("X Y Z", "X --> Y; Y --> Z; X --> Z"), LatentProjection.mag(dag));
    }

    @Test
    @DisplayName("inducing path through two hidden confounders gives a bidirected edge (Richardson and Spirtes 2002, §4; reasoned out)")
    void inducingPathGivesBidirectedEdge() {
        // X ← H1 → Y ← H2 → Z: Y is an observed collider and an ancestor of Z (Y → Z), so X
        // and Z are adjacent; neither is an ancestor of the other: X <-> Z. X <-> Y from H1.
        // Y and Z share H2 but Y is an ancestor of Z, so that edge is Y → Z.
        Graph dag = hidden("X H1 Y H2 Z", "H1 H2", "H1 --> X; H1 --> Y; H2 --> Y; H2 --> Z; Y --> Z");
        assertEquals(graph("X Y Z", "X <-> Y; Y --> Z; X <-> Z"), LatentProjection.mag(dag));
        // Without Y → Z the collider Y is no ancestor of X or Z: X and Z stay separated (by the empty set).
        Graph noInducing = hidden("X H1 Y H2 Z", "H1 H2", "H1 --> X; H1 --> Y; H2 --> Y; H2 --> Z");
        assertEquals(graph("X Y Z", "X <-> Y; Y <-> Z"), LatentProjection.mag(noInducing));
    }

    @Test
    @DisplayName("with nothing hidden the MAG is the DAG (Richardson and Spirtes 2002, §4.2)")
    void nothingHidden() {
        for (long seed = 1; seed <= 20; seed++) {
            Graph dag = RandomDags.erdosRenyi(15, 3, seed);
            assertEquals(dag, LatentProjection.mag(dag));
        }
    }

    @Test
    @DisplayName("on 200 random DAGs with hidden confounders the MAG is ancestral and maximal, m-separation in it equals d-separation in the DAG (Richardson and Spirtes 2002, theorem on the Markov property of the projection; from memory), marks follow ancestry")
    void markovPropertyOnRandomDags() {
        UniformRandomProvider rng = Seeds.random(2024);
        int bidirected = 0;
        int queries = 0;
        for (long seed = 1; seed <= 200; seed++) {
            int n = 10 + (int) (seed % 21);
            Graph dag = RandomDags.hideConfounders(RandomDags.erdosRenyi(n, 2 + seed % 3, seed), 1 + (int) (seed % 4), seed);
            Graph mag = LatentProjection.mag(dag);
            assertDoesNotThrow(() -> AncestralGraphs.checkMag(mag), "seed " + seed);
            int[] obs = dag.observedIndices();
            assertEquals(obs.length, mag.size());
            for (int i = 0; i < obs.length; i++) {
                assertEquals(dag.name(obs[i]), mag.name(i));
            }
            // Marks: tail at a iff a is an ancestor of b in the DAG.
            for (var e : mag.edges()) {
                assertEquals(Ancestry.isAncestor(dag, obs[e.a()], obs[e.b()]), e.atA() == Mark.TAIL, "seed " + seed);
                assertEquals(Ancestry.isAncestor(dag, obs[e.b()], obs[e.a()]), e.atB() == Mark.TAIL, "seed " + seed);
                if (e.isBidirected()) {
                    bidirected++;
                }
            }
            MSeparation m = new MSeparation(mag);
            DSeparation d = new DSeparation(dag);
            for (int q = 0; q < 30; q++) {
                int[] xyz = MSeparationTest.randomQuery(obs.length, rng);
                int[] z = Arrays.copyOfRange(xyz, 2, xyz.length);
                int[] zInDag = Arrays.stream(z).map(v -> obs[v]).toArray();
                assertEquals(d.separated(obs[xyz[0]], obs[xyz[1]], zInDag), m.separated(xyz[0], xyz[1], z),
                        "seed " + seed + " query " + Arrays.toString(xyz));
                queries++;
            }
        }
        assertTrue(bidirected > 100, "the sample must have confounded pairs, got " + bidirected);
        assertEquals(6000, queries);
    }

    @Test
    @DisplayName("with nothing hidden the MAG is the DAG itself (Richardson and Spirtes 2002: no inducing path joins non-adjacent vertices of a DAG), and the shortcut equals the general pair search on 100 random DAGs")
    void nothingHiddenGivesTheDagItself() {
        int edges = 0;
        for (long seed = 1; seed <= 100; seed++) {
            Graph dag = seed % 2 == 0 ? RandomDags.erdosRenyi(5 + (int) (seed % 30), 1 + seed % 4, seed)
                    : RandomDags.scaleFree(5 + (int) (seed % 30), 1 + (int) (seed % 3), seed);
            Graph searched = LatentProjection.bySearch(dag);
            assertEquals(dag, searched, "seed " + seed);
            assertEquals(searched, LatentProjection.mag(dag), "seed " + seed);
            edges += dag.edges().size();
        }
        assertTrue(edges > 500, "the DAGs have edges: " + edges);
    }

    @Test
    @DisplayName("adjacent in the MAG iff no subset of the observed variables d-separates the pair (Richardson and Spirtes 2002, inducing-path theorem; from memory), exhaustively on small DAGs")
    void adjacencyMeansNoSeparatingSet() {
        int pairs = 0;
        for (long seed = 1; seed <= 60; seed++) {
            Graph dag = RandomDags.hideConfounders(RandomDags.erdosRenyi(8, 2.5, seed), 2, seed + 100);
            Graph mag = LatentProjection.mag(dag);
            int[] obs = dag.observedIndices();
            DSeparation d = new DSeparation(dag);
            for (int a = 0; a < obs.length; a++) {
                for (int b = a + 1; b < obs.length; b++) {
                    int[] rest = new int[obs.length - 2];
                    int k = 0;
                    for (int v = 0; v < obs.length; v++) {
                        if (v != a && v != b) {
                            rest[k++] = obs[v];
                        }
                    }
                    boolean separable = false;
                    for (int mask = 0; mask < (1 << rest.length) && !separable; mask++) {
                        separable = d.separated(obs[a], obs[b], MarkovClasses.subset(rest, mask));
                    }
                    assertEquals(!separable, mag.adjacent(a, b), "seed " + seed + " pair " + mag.name(a) + "," + mag.name(b));
                    pairs++;
                }
            }
        }
        assertTrue(pairs > 600, "pairs " + pairs);
    }

    @Test
    @DisplayName("bad input: a non-DAG is refused naming the edge or cycle")
    void badInput() {
        String undirected = assertThrows(IllegalArgumentException.class,
                () -> LatentProjection.mag(graph("A B", "A --- B"))).getMessage();
        assertTrue(undirected.contains("'A' --- 'B'") && undirected.contains("not directed"), undirected);
        String cycle = assertThrows(IllegalArgumentException.class,
                () -> LatentProjection.mag(graph("A B C", "A --> B; B --> C; C --> A"))).getMessage();
        assertTrue(cycle.contains("'A' --> 'B' --> 'C' --> 'A'"), cycle);
        assertEquals(List.of("A", "B"), LatentProjection.mag(graph("A B", "A --> B")).names());
    }
}
