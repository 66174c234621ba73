package dev.touchstone.benchmarks.metrics;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.List;

/**
 * Seeded sparse random DAGs for the benchmarks: each node after the first picks about
 * meanDegree / 2 distinct earlier nodes of a random order as parents, so the expected mean degree
 * is meanDegree at any size in O(p · meanDegree) time (the generators module's families are not
 * needed for a benchmark input).
 */
final class SparseDags {

    private SparseDags() {
    }

    static List<String> names(int p) {
        List<String> out = new ArrayList<>(p);
        for (int i = 0; i < p; i++) {
            out.add("v" + i);
        }
        return out;
    }

    static Graph dag(int p, double meanDegree, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int[] order = new int[p];
        for (int i = 0; i < p; i++) {
            order[i] = i;
        }
        for (int i = p - 1; i > 0; i--) {
            int j = rng.nextInt(i + 1);
            int t = order[i];
            order[i] = order[j];
            order[j] = t;
        }
        MutableGraph g = Graph.builder(names(p));
        double half = meanDegree / 2;
        for (int i = 1; i < p; i++) {
            int parents = (int) half + (rng.nextDouble() < half - (int) half ? 1 : 0);
            parents = Math.min(parents, i);
            for (int k = 0; k < parents; k++) {
                int j = order[rng.nextInt(i)];
                if (!g.adjacent(j, order[i])) {
                    g.addDirected(j, order[i]);
                }
            }
        }
        return g.freeze();
    }
}
