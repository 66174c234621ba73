package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
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
 * The completeness theorem for FCI with Zhang's rules: given a perfect independence oracle
 * (d-separation in a DAG with hidden variables, which is m-separation in its latent
 * projection), FCI returns the PAG of the true MAG, every non-circle mark of which is shared
 * by every MAG of the class (Zhang 2008, Artificial Intelligence 172, Theorem 4; Spirtes,
 * Glymour and Scheines 2000, §6.7 for the skeleton; theorem numbers from memory). The PAG is
 * the one core builds independently from the latent projection ({@code Pags.of}).
 */
class FciOracleTest {

    static final FciLearner FCI = new FciLearner();

    static Estimate run(Graph dag, Map<String, Object> raw, int threads) {
        ParameterValues values = ParameterValues.resolve("learner fci", FCI.description().parameters(), raw);
        return FCI.learn(LearnerInput.of(new Oracle(dag, null)), Knowledge.none(), values,
                RunContext.of(7, null, threads));
    }

    /**
     * A DAG of 8–17 nodes with 1–4 of its confounders hidden (so 5–16 observed variables, mean
     * degree 2–4). Every third one is smaller (6–10 nodes) and also contains the structure of
     * {@link FciWorkedExamplesTest#possibleDsepRemovesASpuriousEdge} with random extra parents, because
     * random truths of this size rarely need the Possible-D-Sep step (7 in 3,000 in a trial run).
     */
    static Graph truth(long seed) {
        int n = seed % 3 == 0 ? 6 + (int) (seed % 5) : 8 + (int) (seed % 10);
        Graph dag = seed % 5 == 4 ? RandomDags.scaleFree(n, 2, seed) : RandomDags.erdosRenyi(n, 2 + seed % 3, seed);
        Graph hidden = RandomDags.hideConfounders(dag, 1 + (int) (seed % 4), seed * 7 + 1);
        return seed % 3 == 0 ? withGadget(hidden, seed) : hidden;
    }

    /** Adds the 8-node Possible-D-Sep structure (3 hidden) and 1–3 edges from random nodes of {@code dag} into it. */
    static Graph withGadget(Graph dag, long seed) {
        org.apache.commons.rng.UniformRandomProvider rng = dev.touchstone.core.random.Seeds.random(seed * 13 + 5);
        java.util.List<String> names = new java.util.ArrayList<>(dag.names());
        String[] gadget = {"gx", "gy", "ga", "gb", "gv", "gl1", "gl2", "gl3"};
        names.addAll(java.util.List.of(gadget));
        dev.touchstone.core.graph.MutableGraph g = Graph.builder(names);
        int base = dag.size();
        for (int v = 0; v < base; v++) {
            g.setHidden(v, dag.isHidden(v));
        }
        for (Edge e : dag.edges()) {
            g.addEdge(e);
        }
        int x = base, y = base + 1, a = base + 2, b = base + 3, v = base + 4;
        int l1 = base + 5, l2 = base + 6, l3 = base + 7;
        g.setHidden(l1, true).setHidden(l2, true).setHidden(l3, true);
        g.addDirected(b, x).addDirected(a, y).addDirected(v, b).addDirected(l1, x).addDirected(l1, a)
                .addDirected(l2, a).addDirected(l2, v).addDirected(l3, b).addDirected(l3, y);
        int extra = 1 + rng.nextInt(3);
        for (int i = 0; i < extra; i++) {
            int from = rng.nextInt(base);
            int to = base + rng.nextInt(5);
            if (!g.adjacent(from, to)) {
                g.addDirected(from, to);
            }
        }
        return g.freeze();
    }

    @Test
    @DisplayName("FCI with the d-separation oracle returns exactly Pags.of(truth) on 240 random DAGs with hidden "
            + "confounders; skeleton = MAG skeleton; every tail and arrowhead agrees with the MAG (Zhang 2008)")
    void oracleReturnsTheTruePag() {
        int removedByPossibleDsep = 0;
        int casesNeedingPossibleDsep = 0;
        int arrows = 0;
        int tails = 0;
        int hiddenCases = 0;
        for (long seed = 1; seed <= 240; seed++) {
            Graph dag = truth(seed);
            hiddenCases += dag.hasHidden() ? 1 : 0;
            Graph pag = Pags.of(dag);
            Graph mag = LatentProjection.mag(dag);
            Map<String, Object> raw = seed % 4 == 1 ? Map.of("skeleton", "sequential")
                    : seed % 4 == 2 ? Map.of("selection_bias", "possible") : Map.of();
            Estimate e = run(dag, raw, 1 + (int) (seed % 2));
            Graph g = e.graph();
            assertEquals(pag, g, "seed " + seed + " " + raw + "\n truth " + pag + "\n estimate " + g);
            // Soundness and skeleton against the MAG directly, not only through Pags.of.
            assertEquals(mag.edgeCount(), g.edgeCount(), "seed " + seed + ": skeleton");
            for (Edge edge : g.edges()) {
                Edge inMag = mag.edge(edge.a(), edge.b());
                assertNotNull(inMag, "seed " + seed + ": " + edge + " not in the MAG");
                for (int end : new int[] {edge.a(), edge.b()}) {
                    Mark m = edge.markAt(end);
                    if (m != Mark.CIRCLE) {
                        assertEquals(inMag.markAt(end), m, "seed " + seed + ": mark at " + g.name(end));
                        arrows += m == Mark.ARROW ? 1 : 0;
                        tails += m == Mark.TAIL ? 1 : 0;
                    }
                }
            }
            double removed = e.extras().get("possible_dsep_removed");
            removedByPossibleDsep += (int) removed;
            if (removed > 0) {
                casesNeedingPossibleDsep++;
                // Without the step the spurious adjacencies stay: the step is what makes the skeleton right.
                Estimate without = run(dag, Map.of("possible_dsep", false), 1);
                assertEquals(g.edgeCount() + (int) removed, without.graph().edgeCount(), "seed " + seed);
            }
        }
        assertTrue(hiddenCases >= 200, "DAGs with hidden variables: " + hiddenCases);
        assertTrue(arrows > 500 && tails > 200, "orientations exercised: arrows " + arrows + ", tails " + tails);
        assertTrue(casesNeedingPossibleDsep > 0, "the Possible-D-Sep step must remove edges in some cases, removed "
                + removedByPossibleDsep);
        System.out.println("FCI oracle: Possible-D-Sep removed " + removedByPossibleDsep + " edges in "
                + casesNeedingPossibleDsep + " of 240 truths; marks checked: " + arrows + " arrows, " + tails + " tails");
    }

    @Test
    @DisplayName("on data, 1 and 2 threads give the same PAG (every edge is tested before any removal; common practice)")
    void threadsDoNotMatter() {
        for (long seed = 300; seed < 312; seed++) {
            Graph dag = truth(seed);
            dev.touchstone.core.data.DataSet data = dev.touchstone.core.testing.SmallData.linearGaussian(dag, 500, seed);
            Graph[] out = new Graph[2];
            for (int threads = 1; threads <= 2; threads++) {
                ParameterValues values = ParameterValues.resolve("learner fci", FCI.description().parameters(),
                        Map.of("alpha", 0.05));
                out[threads - 1] = FCI.learn(LearnerInput.of(data), Knowledge.none(), values,
                        RunContext.of(7, null, threads)).graph();
            }
            assertEquals(out[0], out[1], "seed " + seed);
        }
    }
}
