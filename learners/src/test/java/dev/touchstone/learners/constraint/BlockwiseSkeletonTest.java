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

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The two ways Fisher z holds its correlations give the same search: the p × p matrix (what
 * {@code FisherZTest.of} uses up to {@code DENSE_LIMIT} variables) and the centred columns with
 * level 0 screened in tiles and later correlations computed on demand (above it). Same
 * adjacencies, same recorded separating set for every pair, same number of tests, on seeded
 * finite-sample cases where the tests err (p up to 200, several alphas, both skeleton variants,
 * depth limits, knowledge, missing cells). The outside reference for the search itself is
 * {@link AdjacencySearchReferenceTest} (Colombo and Maathuis 2014, Alg. 4.1); this test pins the
 * exactness of the blockwise arithmetic, which is what lets the decisions agree to the bit.
 */
class BlockwiseSkeletonTest {

    @Test
    @DisplayName("blockwise Fisher z = matrix Fisher z: adjacencies, sepsets and test counts, p 12…200, alpha 0.001…0.2, both variants, knowledge, missing cells, 1 and 2 threads")
    void sameSkeletonAsTheMatrix() {
        int[] sizes = {12, 40, 90, 200, 150, 60};
        double[] alphas = {0.001, 0.01, 0.05, 0.2};
        int removed = 0;
        int withSets = 0;
        for (int c = 0; c < 12; c++) {
            int p = sizes[c % sizes.length];
            double alpha = alphas[c % alphas.length];
            Graph dag = c % 3 == 0 ? RandomDags.scaleFree(p, 2, 510 + c) : RandomDags.erdosRenyi(p, 2.5, 510 + c);
            DataSet data = SmallData.linearGaussian(dag, 150 + 53 * c, 530 + c);
            if (c % 4 == 3) {
                data = withMissingCells(data, 550 + c);
            }
            Knowledge knowledge = c % 2 == 1 ? knowledge(data.names(), 570 + c) : Knowledge.none();
            KnowledgeIndex ki = KnowledgeIndex.of(knowledge, data.names());
            SkeletonVariant variant = c % 2 == 0 ? SkeletonVariant.ORDER_INDEPENDENT : SkeletonVariant.SEQUENTIAL;
            int depth = c % 5 == 4 ? 1 : -1;
            RunContext denseContext = RunContext.of(1, null, 1 + c % 2);
            RunContext blockContext = RunContext.of(1, null, 2 - c % 2);
            Skeleton dense = new AdjacencySearch(FisherZTest.of(data, alpha), ki, variant, depth, denseContext).run();
            Skeleton blockwise = new AdjacencySearch(FisherZTest.fromColumns(data, alpha), ki, variant, depth,
                    blockContext).run();
            assertEquals(denseContext.tests(), blockContext.tests(), "case " + c + ": tests");
            for (int a = 0; a < p; a++) {
                assertArrayEquals(dense.neighbours(a), blockwise.neighbours(a), "case " + c + ": neighbours of " + a);
                for (int b = a + 1; b < p; b++) {
                    assertArrayEquals(dense.sepset(a, b), blockwise.sepset(a, b), "case " + c + ": sepset " + a + "," + b);
                    if (!dense.adjacent(a, b)) {
                        removed++;
                        withSets += dense.sepset(a, b) != null && dense.sepset(a, b).length > 0 ? 1 : 0;
                    }
                }
            }
        }
        // Enough removals at levels above 0 that the on-demand correlations were really exercised.
        assertTrue(removed > 50_000 && withSets > 500, removed + " removed, " + withSets + " with a non-empty set");
    }

    /** About 2 % of the cells set missing, so list-wise deletion drops a good share of the rows. */
    private static DataSet withMissingCells(DataSet data, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        DataSet.Builder b = DataSet.builder(data.rows());
        for (int j = 0; j < data.columns(); j++) {
            double[] v = data.continuous(j).clone();
            for (int r = 0; r < v.length; r++) {
                if (rng.nextDouble() < 0.02 / Math.max(1, data.columns() / 20)) {
                    v[r] = Double.NaN;
                }
            }
            b.continuous(data.names().get(j), v);
        }
        return b.build();
    }

    /** A few required and forbidden pairs and two tiers over the first variables. */
    private static Knowledge knowledge(List<String> names, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int p = names.size();
        Knowledge.Builder kb = Knowledge.builder();
        for (int k = 0; k < 4; k++) {
            int a = rng.nextInt(p);
            int b = rng.nextInt(p);
            if (a != b) {
                kb.require(names.get(Math.min(a, b)), names.get(Math.max(a, b)));
            }
            int c = rng.nextInt(p);
            int d = rng.nextInt(p);
            if (c != d && c != a && c != b && d != a && d != b) {
                kb.forbid(names.get(c), names.get(d)).forbid(names.get(d), names.get(c));
            }
        }
        return kb.build();
    }
}
