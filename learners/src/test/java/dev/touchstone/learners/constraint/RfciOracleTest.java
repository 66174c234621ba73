package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.graph.algorithms.LatentProjection;
import dev.touchstone.core.graph.algorithms.Pags;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * RFCI with the d-separation oracle against what Colombo, Maathuis, Kalisch and Richardson
 * (2012, Annals of Statistics 40, Theorem 3.4 and the definition of an RFCI-PAG; from memory)
 * prove: the output is sound, possibly less informative than FCI's. Checked against the truth
 * itself, not against another learner: (a) every adjacency of the true MAG is kept, so the
 * skeleton contains FCI's, which is the MAG's (Zhang 2008, Theorem 4, checked in
 * {@link FciOracleTest}); (b) every arrowhead at b on a *→ b means b is no ancestor of a in the
 * generating DAG, every tail at a on a –* b means a is an ancestor of b; (c) when RFCI's skeleton
 * is the MAG's, the PAG is exactly the true PAG ({@code Pags.of}), since the rules then see the
 * same skeleton and, from the oracle, true separating sets, and it is the MAG's whenever the PC
 * skeleton already is (a removal needs a separation, which true adjacencies never have); (d) without hidden variables the PC
 * skeleton is the true one (Spirtes, Glymour and Scheines 2000, §5.4.2), so RFCI returns the
 * true PAG, the same as FCI.
 */
class RfciOracleTest {

    static final RfciLearner RFCI = new RfciLearner();

    static Estimate run(Graph dag, Map<String, Object> raw, int threads) {
        ParameterValues values = ParameterValues.resolve("learner rfci", RFCI.description().parameters(), raw);
        return RFCI.learn(LearnerInput.of(new Oracle(dag, null)), Knowledge.none(), values,
                RunContext.of(7, null, threads));
    }

    /**
     * The Possible-D-Sep structure of {@link FciOracleTest#withGadget} (gx and gy separated only given
     * {ga, gb, gv}, gv adjacent to neither) followed by a small random DAG that receives 2–7 edges from
     * the structure's observed nodes. A child k of gv and of gy or its neighbours can have a separating
     * set with gx that contains ga, gb and gv but not gy; the unshielded triple gx, gy, k is then checked
     * and the spurious edge gx – gy removed, which random truths of {@link FciOracleTest#truth} never
     * needed (none in 20,000 in a trial run).
     */
    static Graph gadgetWithChildren(long seed) {
        Graph base = RandomDags.erdosRenyi(2 + (int) (seed % 6), 1 + seed % 3, seed);
        base = RandomDags.hideConfounders(base, (int) (seed % 2), seed * 3 + 1);
        org.apache.commons.rng.UniformRandomProvider rng = dev.touchstone.core.random.Seeds.random(seed * 17 + 3);
        java.util.List<String> names = new java.util.ArrayList<>(
                java.util.List.of("gx", "gy", "ga", "gb", "gv", "gl1", "gl2", "gl3"));
        names.addAll(base.names());
        dev.touchstone.core.graph.MutableGraph g = Graph.builder(names);
        int x = 0, y = 1, a = 2, b = 3, v = 4, l1 = 5, l2 = 6, l3 = 7;
        g.setHidden(l1, true).setHidden(l2, true).setHidden(l3, true);
        g.addDirected(b, x).addDirected(a, y).addDirected(v, b).addDirected(l1, x).addDirected(l1, a)
                .addDirected(l2, a).addDirected(l2, v).addDirected(l3, b).addDirected(l3, y);
        for (int i = 0; i < base.size(); i++) {
            g.setHidden(8 + i, base.isHidden(i));
        }
        for (Edge e : base.edges()) {
            int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
            g.addDirected(8 + from, 8 + e.other(from));
        }
        int extra = 2 + rng.nextInt(6);
        for (int i = 0; i < extra; i++) {
            int from = rng.nextInt(5);
            int to = 8 + rng.nextInt(base.size());
            if (!g.adjacent(from, to)) {
                g.addDirected(from, to);
            }
        }
        return g.freeze();
    }

    @Test
    @DisplayName("oracle RFCI on 480 random DAGs with hidden confounders (240 with a Possible-D-Sep structure feeding children): skeleton contains the MAG's, every tail and"
            + " arrowhead is sound against the DAG's ancestry, and the true PAG whenever the skeleton is the MAG's"
            + " (Colombo et al. 2012)")
    void soundOnHiddenVariableTruths() {
        int hiddenCases = 0;
        int exact = 0;
        int repairedByChecks = 0;
        int extraEdges = 0;
        int tripleRemovals = 0;
        int pathRemovals = 0;
        int arrows = 0;
        int tails = 0;
        for (long seed = 1; seed <= 480; seed++) {
            Graph dag = seed <= 240 ? FciOracleTest.truth(seed) : gadgetWithChildren(seed);
            hiddenCases += dag.hasHidden() ? 1 : 0;
            Graph mag = LatentProjection.mag(dag);
            Map<String, Object> raw = seed % 4 == 1 ? Map.of("skeleton", "sequential")
                    : seed % 4 == 2 ? Map.of("selection_bias", "possible") : Map.of();
            Estimate e = run(dag, raw, 1 + (int) (seed % 2));
            Graph g = e.graph();
            tripleRemovals += e.extras().get("triple_check_removed").intValue();
            pathRemovals += e.extras().get("path_check_removed").intValue();
            for (Edge edge : mag.edges()) {
                assertNotNull(g.edge(edge.a(), edge.b()), "seed " + seed + ": MAG edge " + edge + " removed");
            }
            extraEdges += g.edgeCount() - mag.edgeCount();
            for (Edge edge : g.edges()) {
                for (int end : new int[] {edge.a(), edge.b()}) {
                    int other = edge.other(end);
                    Mark m = edge.markAt(end);
                    boolean ancestor = Ancestry.isAncestor(dag, dag.index(g.name(end)), dag.index(g.name(other)));
                    if (m == Mark.ARROW) {
                        arrows++;
                        assertTrue(!ancestor, "seed " + seed + ": arrowhead at " + g.name(end) + " on " + edge
                                + " but it is an ancestor of " + g.name(other));
                    } else if (m == Mark.TAIL) {
                        tails++;
                        assertTrue(ancestor, "seed " + seed + ": tail at " + g.name(end) + " on " + edge
                                + " but it is no ancestor of " + g.name(other));
                    }
                }
            }
            // With the PC skeleton already the MAG's no true edge can go, so RFCI must end on the MAG's skeleton.
            boolean pcRight = FciOracleTest.run(dag, Map.of("possible_dsep", false), 1).graph().edgeCount()
                    == mag.edgeCount();
            assertTrue(!pcRight || g.edgeCount() == mag.edgeCount(), "seed " + seed + ": edges removed wrongly");
            if (!pcRight && g.edgeCount() == mag.edgeCount()) {
                repairedByChecks++;
            }
            if (g.edgeCount() == mag.edgeCount()) {
                assertEquals(Pags.of(dag), g, "seed " + seed + " " + raw + ": skeleton right, PAG wrong");
                exact++;
            }
        }
        System.out.println("RFCI oracle: true PAG in " + exact + " of 480 truths (" + repairedByChecks
                + " of them only after the checks removed edges); " + extraEdges
                + " edges FCI removes kept; triple check removed " + tripleRemovals + ", path check " + pathRemovals
                + "; marks checked: " + arrows + " arrows, " + tails + " tails");
        assertTrue(hiddenCases >= 400, "DAGs with hidden variables: " + hiddenCases);
        assertTrue(arrows > 500 && tails > 200, "orientations exercised: arrows " + arrows + ", tails " + tails);
        assertTrue(tripleRemovals > 0, "the unshielded-triple check must remove edges in some truths");
        assertTrue(repairedByChecks > 0, "some truths must get the MAG's skeleton only through the checks");
    }

    @Test
    @DisplayName("without hidden variables oracle RFCI returns the true PAG, the same as FCI, on 150 random DAGs")
    void equalsFciWithoutHiddenVariables() {
        for (long seed = 1; seed <= 150; seed++) {
            int n = 5 + (int) (seed % 12);
            Graph dag = seed % 5 == 4 ? RandomDags.scaleFree(n, 2, seed) : RandomDags.erdosRenyi(n, 2 + seed % 3, seed);
            Graph rfci = run(dag, Map.of(), 1).graph();
            assertEquals(Pags.of(dag), rfci, "seed " + seed);
            assertEquals(FciOracleTest.run(dag, Map.of(), 1).graph(), rfci, "seed " + seed);
        }
    }
}
