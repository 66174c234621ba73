package dev.touchstone.learners.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import dev.touchstone.learners.independence.FisherZTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Set;
import java.util.TreeSet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The order-independent skeleton does not depend on the order of the variables (Colombo and Maathuis 2014, Theorem 1). */
class OrderIndependenceTest {

    static Set<String> adjacencies(DataSet data, SkeletonVariant variant, int threads) {
        FisherZTest test = FisherZTest.of(data, 0.05);
        Skeleton s = new AdjacencySearch(test, KnowledgeIndex.of(Knowledge.none(), data.names()), variant, -1,
                RunContext.of(1, null, threads)).run();
        Set<String> out = new TreeSet<>();
        List<String> names = data.names();
        for (int a = 0; a < names.size(); a++) {
            for (int b = a + 1; b < names.size(); b++) {
                if (s.adjacent(a, b)) {
                    String x = names.get(a);
                    String y = names.get(b);
                    out.add(x.compareTo(y) < 0 ? x + "~" + y : y + "~" + x);
                }
            }
        }
        return out;
    }

    @Test
    @DisplayName("order-independent skeleton identical for 20 random column orders, finite sample, 1 and 2 threads")
    void skeletonIndependentOfColumnOrder() {
        Graph dag = RandomDags.erdosRenyi(25, 3.0, 41);
        DataSet data = SmallData.linearGaussian(dag, 150, 42);
        Set<String> reference = adjacencies(data, SkeletonVariant.ORDER_INDEPENDENT, 1);
        UniformRandomProvider rng = Seeds.random(43);
        boolean originalDiffered = false;
        Set<String> originalReference = adjacencies(data, SkeletonVariant.SEQUENTIAL, 1);
        for (int rep = 0; rep < 20; rep++) {
            int[] perm = RandomDags.permutation(data.columns(), rng);
            DataSet shuffled = data.select(perm);
            assertEquals(reference, adjacencies(shuffled, SkeletonVariant.ORDER_INDEPENDENT, 1 + rep % 2), "order " + rep);
            originalDiffered |= !originalReference.equals(adjacencies(shuffled, SkeletonVariant.SEQUENTIAL, 1));
        }
        // Not a theorem, but the reason the variant exists: at n = 150 the sequential search usually depends on order.
        assertTrue(originalDiffered, "expected the sequential search to depend on the order at least once");
    }
}
