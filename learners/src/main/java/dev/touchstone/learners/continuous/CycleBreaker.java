package dev.touchstone.learners.continuous;

/**
 * Makes a thresholded weight matrix acyclic by removing, one at a time, the edge of
 * smallest absolute weight among the edges that lie on a directed cycle (an edge i → j
 * lies on one exactly when j reaches i). NOTEARS' augmented Lagrangian ends with h(W)
 * small but not always zero, so a few weak cycle edges can survive the threshold; this is
 * the repair common practice applies (Zheng et al. 2018 threshold only; the repair is ours).
 *
 * <p>Cost: O(d · (d + m)) per removed edge for m edges.
 */
final class CycleBreaker {

    private CycleBreaker() {
    }

    /** Zeroes weak cycle edges of the row-major d × d matrix {@code w} in place; returns how many. */
    static int breakCycles(double[] w, int d) {
        int removed = 0;
        while (true) {
            boolean[][] reach = reachability(w, d);
            int weakest = -1;
            for (int i = 0; i < d; i++) {
                for (int j = 0; j < d; j++) {
                    int k = i * d + j;
                    if (w[k] != 0 && reach[j][i]
                            && (weakest < 0 || Math.abs(w[k]) < Math.abs(w[weakest]))) {
                        weakest = k;
                    }
                }
            }
            if (weakest < 0) {
                return removed;
            }
            w[weakest] = 0;
            removed++;
        }
    }

    /** reach[a][b]: a directed path of length ≥ 0 leads from a to b. */
    private static boolean[][] reachability(double[] w, int d) {
        boolean[][] reach = new boolean[d][d];
        int[] stack = new int[d];
        for (int a = 0; a < d; a++) {
            int top = 0;
            stack[top++] = a;
            reach[a][a] = true;
            while (top > 0) {
                int v = stack[--top];
                for (int u = 0; u < d; u++) {
                    if (w[v * d + u] != 0 && !reach[a][u]) {
                        reach[a][u] = true;
                        stack[top++] = u;
                    }
                }
            }
        }
        return reach;
    }
}
