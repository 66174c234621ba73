package dev.touchstone.learners.hybrid;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.learners.independence.OracleTest;
import dev.touchstone.learners.score.PopulationCovariance;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * MMPC and MMHC with the oracle. Tsamardinos, Brown and Aliferis (2006, Machine Learning 65, §3;
 * theorem from memory) prove that with a perfect independence test and a faithful distribution
 * MMPC with the symmetry correction returns exactly the parents and children of every variable,
 * so the MMHC skeleton is the true skeleton; without the correction a variable's set may also
 * hold spouses reached through a common child (their §3 example, from memory), which the
 * {@code or} rule keeps.
 */
class MmhcOracleTest {

    static Graph truth(long seed) {
        int n = 5 + (int) (seed % 12);
        return seed % 5 == 4 ? RandomDags.scaleFree(n, 2, seed) : RandomDags.erdosRenyi(n, 2 + seed % 3, seed);
    }

    @Test
    @DisplayName("oracle MMPC with the symmetry correction gives exactly the true skeleton on 150 random DAGs; the"
            + " sets before it contain the true parents and children")
    void skeletonIsTheTrueOne() {
        int oneSided = 0;
        for (long seed = 1; seed <= 150; seed++) {
            Graph dag = truth(seed);
            List<int[]> pc = MmhcLearner.candidateSets(new OracleTest(new Oracle(dag, null)), -1,
                    RunContext.of(1, null, 1));
            for (int x = 0; x < dag.size(); x++) {
                for (int y = x + 1; y < dag.size(); y++) {
                    assertEquals(dag.adjacent(x, y), Mmpc.joined(pc, x, y, true), "seed " + seed + ": pair "
                            + dag.name(x) + ", " + dag.name(y));
                    if (dag.adjacent(x, y)) {
                        assertTrue(Mmpc.joined(pc, x, y, false), "seed " + seed);
                    } else if (Mmpc.joined(pc, x, y, false)) {
                        oneSided++;
                    }
                }
            }
        }
        System.out.println("MMPC oracle: " + oneSided + " pairs in one candidate set only, removed by the correction");
    }

    @Test
    @DisplayName("oracle MMHC returns a DAG inside the MMPC skeleton; with the exact covariance its class is the"
            + " true CPDAG on most of 100 random DAGs (hill climbing is greedy: misses counted)")
    void climbStaysInTheSkeleton() {
        MmhcLearner mmhc = new MmhcLearner();
        int exact = 0;
        for (long seed = 1; seed <= 100; seed++) {
            Graph dag = truth(seed);
            ParameterValues values = ParameterValues.resolve("test", mmhc.description().parameters(), Map.of());
            Estimate e = mmhc.learn(LearnerInput.of(new Oracle(dag,
                    PopulationCovariance.observed(dag, 0.5, 2.0, seed + 31))), Knowledge.none(), values,
                    RunContext.of(1, null, 1));
            assertEquals(GraphClass.DAG, e.graphClass());
            assertTrue(e.graph().isFullyDirected(), "seed " + seed);
            for (Edge edge : e.graph().edges()) {
                assertTrue(dag.adjacent(edge.a(), edge.b()), "seed " + seed + ": " + edge + " outside the skeleton");
            }
            exact += Cpdags.of(e.graph()).equals(Cpdags.of(dag)) ? 1 : 0;
        }
        System.out.println("MMHC oracle: true CPDAG in " + exact + " of 100");
    }
}
