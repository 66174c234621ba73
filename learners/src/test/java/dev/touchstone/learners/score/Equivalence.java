package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;

/**
 * Markov equivalence of two DAGs by the theorem of Verma and Pearl (1990, "Equivalence and
 * synthesis of causal models"): same skeleton and same v-structures (unshielded colliders).
 * Used as a check independent of any CPDAG construction.
 */
final class Equivalence {

    private Equivalence() {
    }

    static boolean markovEquivalent(Graph a, Graph b) {
        int p = a.size();
        for (int x = 0; x < p; x++) {
            for (int y = x + 1; y < p; y++) {
                if (a.adjacent(x, y) != b.adjacent(x, y)) {
                    return false;
                }
            }
        }
        for (int z = 0; z < p; z++) {
            for (int x = 0; x < p; x++) {
                for (int y = x + 1; y < p; y++) {
                    if (isCollider(a, x, z, y) != isCollider(b, x, z, y)) {
                        return false;
                    }
                }
            }
        }
        return true;
    }

    private static boolean isCollider(Graph g, int x, int z, int y) {
        return g.hasDirected(x, z) && g.hasDirected(y, z) && !g.adjacent(x, y);
    }
}
