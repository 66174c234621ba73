package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.learners.independence.OracleTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * With a d-separation oracle the adjacency search finds exactly the skeleton of the true DAG,
 * and every collider rule finds exactly its v-structures (Spirtes, Glymour and Scheines 2000,
 * Theorem 5.1, the correctness of PC's first two phases).
 */
class OracleSkeletonTest {

    /**
     * The i-th seeded truth: Erdős–Rényi (mean degree 1.5 … 3) or scale-free, 5 … 30 nodes.
     * Scale-free graphs with two links per node are kept to ≤ 20 nodes because PC with the
     * oracle tests every subset of a hub's neighbours for each of its true edges (2^degree).
     */
    static Graph truth(int i) {
        int n = 5 + i % 26;
        return i % 2 == 0 ? RandomDags.erdosRenyi(n, 1.5 + (i % 4) * 0.5, 7000 + i)
                : RandomDags.scaleFree(n, n <= 20 ? 1 + (i / 2) % 2 : 1, 8000 + i);
    }

    @Test
    @DisplayName("oracle skeleton and colliders equal the true skeleton and v-structures, 100 random DAGs")
    void skeletonAndCollidersFromTheOracle() {
        for (int i = 0; i < 100; i++) {
            Graph dag = truth(i);
            OracleTest test = new OracleTest(new Oracle(dag, null));
            KnowledgeIndex none = KnowledgeIndex.of(Knowledge.none(), dag.names());
            for (SkeletonVariant v : SkeletonVariant.values()) {
                Skeleton s = new AdjacencySearch(test, none, v, -1, RunContext.of(1, null, 2)).run();
                for (int a = 0; a < dag.size(); a++) {
                    for (int b = a + 1; b < dag.size(); b++) {
                        assertEquals(dag.adjacent(a, b), s.adjacent(a, b), "DAG " + i + " " + v + " pair " + a + "," + b);
                    }
                }
                for (ColliderRule rule : ColliderRule.values()) {
                    MutableGraph g = new ColliderOrientation(s, test, none, rule, ConflictRule.KEEP_FIRST, -1,
                            RunContext.unlimited(1)).orient(dag.names());
                    assertEquals(vStructureArrowheads(dag), arrowheads(g.freeze()), "DAG " + i + " " + v + " " + rule);
                }
            }
        }
    }

    /** The arrowheads of v-structures a → c ← b with a, b non-adjacent, as a canonical string. */
    static String vStructureArrowheads(Graph dag) {
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < dag.size(); c++) {
            int[] pa = dag.parents(c);
            for (int a : pa) {
                boolean inV = false;
                for (int b : pa) {
                    if (a != b && !dag.adjacent(a, b)) {
                        inV = true;
                    }
                }
                if (inV) {
                    sb.append(a).append("->").append(c).append(' ');
                }
            }
        }
        return sb.toString();
    }

    static String arrowheads(Graph g) {
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < g.size(); c++) {
            for (int k = 0; k < g.degree(c); k++) {
                int a = g.neighbour(c, k);
                if (g.markHere(c, k) == Mark.ARROW) {
                    sb.append(a).append("->").append(c).append(' ');
                }
            }
        }
        return sb.toString();
    }
}
