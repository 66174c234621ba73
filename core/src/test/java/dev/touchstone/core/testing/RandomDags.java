package dev.touchstone.core.testing;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.List;

/**
 * Seeded random DAGs for tests in every module (the real graph families live in the
 * generators module). Each DAG is drawn over a random causal order, so index order never
 * equals causal order by construction.
 */
public final class RandomDags {

    private RandomDags() {
    }

    /** Names X1 … Xn. */
    public static List<String> names(int n) {
        List<String> out = new ArrayList<>(n);
        for (int i = 1; i <= n; i++) {
            out.add("X" + i);
        }
        return out;
    }

    /**
     * An Erdős–Rényi DAG: each pair is joined with probability meanDegree / (n − 1),
     * oriented along a random permutation (Erdős and Rényi 1959; common practice for DAGs).
     */
    public static Graph erdosRenyi(int n, double meanDegree, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int[] order = permutation(n, rng);
        double p = n > 1 ? Math.min(1.0, meanDegree / (n - 1)) : 0;
        MutableGraph g = Graph.builder(names(n));
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                if (rng.nextDouble() < p) {
                    g.addDirected(order[i], order[j]);
                }
            }
        }
        return g.freeze();
    }

    /**
     * A scale-free DAG by preferential attachment (Barabási and Albert 1999): each new
     * node in the causal order attaches to {@code m} earlier nodes chosen with probability
     * proportional to degree + 1, the earlier node being the cause.
     */
    public static Graph scaleFree(int n, int m, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int[] order = permutation(n, rng);
        MutableGraph g = Graph.builder(names(n));
        int[] degree = new int[n];
        for (int i = 1; i < n; i++) {
            int targets = Math.min(m, i);
            int added = 0;
            while (added < targets) {
                long total = 0;
                for (int j = 0; j < i; j++) {
                    total += degree[j] + 1;
                }
                long pick = (long) (rng.nextDouble() * total);
                int j = 0;
                for (long acc = degree[0] + 1; acc <= pick; acc += degree[++j] + 1) {
                    // walk to the chosen earlier node
                }
                if (!g.adjacent(order[j], order[i])) {
                    g.addDirected(order[j], order[i]);
                    degree[j]++;
                    degree[i]++;
                    added++;
                }
            }
        }
        return g.freeze();
    }

    /**
     * The same DAG with up to {@code k} of its confounders (nodes with at least two
     * children) flagged hidden, chosen at random.
     */
    public static Graph hideConfounders(Graph dag, int k, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        List<Integer> candidates = new ArrayList<>();
        for (int v = 0; v < dag.size(); v++) {
            if (dag.children(v).length >= 2) {
                candidates.add(v);
            }
        }
        MutableGraph g = dag.toMutable();
        for (int i = 0; i < k && !candidates.isEmpty(); i++) {
            int v = candidates.remove(rng.nextInt(candidates.size()));
            g.setHidden(v, true);
        }
        return g.freeze();
    }

    /** A uniformly random permutation of 0 … n−1 (Fisher–Yates). */
    public static int[] permutation(int n, UniformRandomProvider rng) {
        int[] p = new int[n];
        for (int i = 0; i < n; i++) {
            p[i] = i;
        }
        for (int i = n - 1; i > 0; i--) {
            int j = rng.nextInt(i + 1);
            int t = p[i];
            p[i] = p[j];
            p[j] = t;
        }
        return p;
    }
}
