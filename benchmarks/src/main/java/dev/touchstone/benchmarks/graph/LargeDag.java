package dev.touchstone.benchmarks.graph;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.testing.RandomDags;

/** The benchmark graphs: seeded Erdős–Rényi DAGs over a random causal order (core's test fixture). */
final class LargeDag {

    private LargeDag() {
    }

    static Graph erdosRenyi(int nodes, double meanDegree, long seed) {
        return RandomDags.erdosRenyi(nodes, meanDegree, seed);
    }

    /** One breadth-first search over all edges from {@code start}: the floor of any traversal. */
    static int breadthFirst(Graph g, int start, int[] seen, int stamp, int[] queue) {
        int head = 0;
        int tail = 0;
        queue[tail++] = start;
        seen[start] = stamp;
        while (head < tail) {
            int v = queue[head++];
            for (int k = 0, d = g.degree(v); k < d; k++) {
                int w = g.neighbour(v, k);
                if (seen[w] != stamp) {
                    seen[w] = stamp;
                    queue[tail++] = w;
                }
            }
        }
        return tail;
    }
}
