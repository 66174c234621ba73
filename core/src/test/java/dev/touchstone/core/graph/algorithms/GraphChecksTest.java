package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GraphChecksTest {

    @Test
    @DisplayName("a cycle where a DAG is required is refused with the cycle named")
    void cycleIsNamed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> GraphChecks.checkDag(TestGraphs.of("p q r s", "p->q, q->r, r->s, s->q")));
        assertEquals("not a DAG: directed cycle q -> r -> s -> q", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> GraphChecks.checkDag(TestGraphs.of("p q", "p--q")));
        assertEquals("not a DAG: edge p --- q is not directed", e.getMessage());
        GraphChecks.checkDag(TestGraphs.asia());
        assertTrue(GraphChecks.isDag(TestGraphs.asia()));
    }

    @Test
    @DisplayName("checkPdag accepts directed and undirected edges, refuses circles, bidirected edges and cycles")
    void pdag() {
        GraphChecks.checkPdag(TestGraphs.of("a b c", "a->b, b--c"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> GraphChecks.checkPdag(TestGraphs.of("a b c", "a<>b, b--c")));
        assertTrue(e.getMessage().contains("edge a <-> b is neither directed nor undirected"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> GraphChecks.checkPdag(TestGraphs.of("a b c", "a->b, b->c, c->a")));
        assertEquals("directed cycle a -> b -> c -> a", e.getMessage());
    }

    @Test
    @DisplayName("of all 4096 PDAGs on 4 nodes, isCpdag holds exactly for the 185 CPDAGs of the enumerated DAGs (OEIS A007984)")
    void isCpdagOnEveryPdagOfFourNodes() {
        List<String> names = DagEnumeration.defaultNames(4);
        Set<Graph> cpdags = new HashSet<>();
        for (Graph d : SmallDags.dags(4)) {
            cpdags.add(Cpdags.meek(d));
        }
        int yes = 0;
        for (int code = 0; code < 4096; code++) {
            MutableGraph g = Graph.builder(names);
            int c = code;
            for (int i = 0; i < 4; i++) {
                for (int j = i + 1; j < 4; j++) {
                    int digit = c & 3;
                    c >>>= 2;
                    if (digit == 1) {
                        g.addDirected(i, j);
                    } else if (digit == 2) {
                        g.addDirected(j, i);
                    } else if (digit == 3) {
                        g.addUndirected(i, j);
                    }
                }
            }
            Graph pdag = g.freeze();
            boolean is = GraphChecks.isCpdag(pdag);
            assertEquals(cpdags.contains(pdag), is, pdag::toString);
            yes += is ? 1 : 0;
        }
        assertEquals(185, yes);
    }

    @Test
    @DisplayName("checkCpdag says which edge is wrong")
    void checkCpdagNamesTheEdge() {
        // Sprinkler with season -> sprinkler directed: not a CPDAG, that edge is reversible.
        Graph g = TestGraphs.of("season sprinkler rain wet slippery",
                "season->sprinkler, season--rain, sprinkler->wet, rain->wet, wet->slippery");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> GraphChecks.checkCpdag(g));
        assertEquals("not a CPDAG: edge season --> sprinkler should be season --- sprinkler in the CPDAG of its"
                + " equivalence class", e.getMessage());
        assertFalse(GraphChecks.isCpdag(TestGraphs.of("a b c d", "a--b, b--c, c--d, d--a")));
        e = assertThrows(IllegalArgumentException.class,
                () -> GraphChecks.checkCpdag(TestGraphs.of("a b c d", "a--b, b--c, c--d, d--a")));
        assertTrue(e.getMessage().startsWith("not a CPDAG: it has no consistent DAG extension"), e.getMessage());
        GraphChecks.checkCpdag(Cpdags.of(TestGraphs.asia()));
    }
}
