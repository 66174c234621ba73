package dev.touchstone.metrics.sid;

import dev.touchstone.core.graph.Graph;

import java.util.ArrayList;
import java.util.List;

/**
 * Test reference: the SID straight from its definition (Peters and Bühlmann 2015), deciding each
 * pair with the adjustment criterion of Shpitser, VanderWeele and Robins (2010) applied literally
 * by enumerating every path from i to j: (a) no member of Z is a descendant of a node W ≠ i on a
 * proper causal path from i to j; (b) every proper non-causal path from i to j is blocked by Z.
 * Exponential in p: for small graphs only. Shares no code with the fast implementation.
 */
final class DirectSid {

    private final Graph g;
    private final int p;
    private final boolean[][] descendant; // descendant[a][b]: b is a descendant of a (a included)

    DirectSid(Graph trueDag) {
        g = trueDag;
        p = trueDag.size();
        descendant = new boolean[p][p];
        for (int a = 0; a < p; a++) {
            mark(a, a);
        }
    }

    private void mark(int root, int v) {
        if (descendant[root][v]) {
            return;
        }
        descendant[root][v] = true;
        for (int c : g.children(v)) {
            mark(root, c);
        }
    }

    /** SID of a DAG estimate H. */
    long sid(Graph h) {
        long n = 0;
        for (int i = 0; i < p; i++) {
            n += wrong(i, h.parents(i));
        }
        return n;
    }

    /** The number of j ≠ i whose intervention distribution is wrongly inferred when adjusting for z. */
    long wrong(int i, int[] z) {
        boolean[] inZ = new boolean[p];
        for (int v : z) {
            inZ[v] = true;
        }
        long n = 0;
        for (int j = 0; j < p; j++) {
            if (j != i && !correct(i, j, inZ)) {
                n++;
            }
        }
        return n;
    }

    boolean correct(int i, int j, boolean[] inZ) {
        if (inZ[j]) {
            return !(descendant[i][j]); // H claims j is unaffected by i
        }
        List<int[]> paths = new ArrayList<>();
        walk(i, j, new int[p], 0, new boolean[p], paths);
        boolean[] forbidden = new boolean[p];
        for (int[] path : paths) {
            if (causal(path)) {
                for (int k = 1; k < path.length; k++) {
                    for (int d = 0; d < p; d++) {
                        if (descendant[path[k]][d]) {
                            forbidden[d] = true;
                        }
                    }
                }
            }
        }
        for (int v = 0; v < p; v++) {
            if (inZ[v] && forbidden[v]) {
                return false; // (a) fails
            }
        }
        for (int[] path : paths) {
            if (!causal(path) && !blocked(path, inZ)) {
                return false; // (b) fails
            }
        }
        return true;
    }

    private void walk(int v, int target, int[] prefix, int len, boolean[] used, List<int[]> out) {
        prefix[len] = v;
        used[v] = true;
        if (v == target) {
            out.add(java.util.Arrays.copyOf(prefix, len + 1));
        } else {
            for (int w = 0; w < p; w++) {
                if (!used[w] && g.adjacent(v, w)) {
                    walk(w, target, prefix, len + 1, used, out);
                }
            }
        }
        used[v] = false;
    }

    private boolean causal(int[] path) {
        for (int k = 0; k + 1 < path.length; k++) {
            if (!g.hasDirected(path[k], path[k + 1])) {
                return false;
            }
        }
        return true;
    }

    private boolean blocked(int[] path, boolean[] inZ) {
        for (int k = 1; k + 1 < path.length; k++) {
            int m = path[k];
            boolean collider = g.hasDirected(path[k - 1], m) && g.hasDirected(path[k + 1], m);
            if (collider) {
                boolean open = false;
                for (int d = 0; d < p; d++) {
                    open |= descendant[m][d] && inZ[d];
                }
                if (!open) {
                    return true;
                }
            } else if (inZ[m]) {
                return true;
            }
        }
        return false;
    }
}
