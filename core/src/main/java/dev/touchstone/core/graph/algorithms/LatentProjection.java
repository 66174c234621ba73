package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;

import java.util.ArrayList;
import java.util.List;

/**
 * The latent projection of a DAG with hidden variables: the maximal ancestral graph (MAG)
 * over its observed variables (Richardson and Spirtes 2002, "Ancestral graph Markov
 * models", Annals of Statistics 30, §4.2; no selection variables here).
 *
 * <p>Observed {@code a} and {@code b} are adjacent in the MAG iff the DAG has an inducing
 * path between them relative to the hidden set (every observed non-end vertex a collider,
 * every collider an ancestor of {@code a} or {@code b}); the mark at {@code a} is a tail
 * iff {@code a} is an ancestor of {@code b} in the DAG, an arrow otherwise. No path is
 * enumerated: with {@code A = an({a, b})}, an inducing path exists iff {@code a} and
 * {@code b} are d-connected given {@code Z = (A ∩ observed) \ {a, b}}. (If an inducing path
 * exists no set separates them, Richardson and Spirtes 2002, inducing-path theorem. Conversely every
 * vertex of a path d-connecting given {@code Z} lies in {@code an({a, b} ∪ Z) = A}, so its
 * observed non-end vertices, lying in {@code Z}, must be colliders, and its colliders lie in
 * {@code an(Z) ⊆ A}: it is an inducing path.) Because every relevant path lies in
 * {@code A}, the search never leaves {@code A}.
 *
 * <p>Cost: ancestor sets as bit sets, O(|V| · |E| / 64); then per observed pair a search
 * restricted to {@code A}, at most O(|V| + |E|); in all O(|O|² · (|V| + |E|)) worst case,
 * much less when ancestor sets are small.
 */
public final class LatentProjection {

    private LatentProjection() {
    }

    /**
     * The MAG over the observed variables of {@code dag} (in graph order, none flagged
     * hidden). With nothing hidden it is the DAG itself.
     *
     * @throws IllegalArgumentException if {@code dag} has a non-directed edge or a directed
     *     cycle, naming it
     */
    public static Graph mag(Graph dag) {
        requireDag(dag);
        if (!dag.hasHidden()) {
            // With nothing hidden every inner vertex of an inducing path is a collider. Two
            // colliders cannot be adjacent in a DAG (their edge would need two arrowheads), so
            // the path is a → c ← b, and c, an ancestor of a or b, would close a directed
            // cycle. No inducing path joins non-adjacent vertices: the projection is the DAG
            // itself (Richardson and Spirtes 2002), and the O(p²) pair search is skipped.
            return dag;
        }
        return bySearch(dag);
    }

    /** The MAG by the pair search of the class comment, whatever is hidden (for tests of the shortcut). */
    static Graph bySearch(Graph dag) {
        int n = dag.size();
        int[] order = Ancestry.topologicalOrder(dag);
        int[][] parents = new int[n][];
        int[][] children = new int[n][];
        for (int v = 0; v < n; v++) {
            parents[v] = dag.parents(v);
            children[v] = dag.children(v);
        }
        int words = (n + 63) >>> 6;
        long[][] anc = new long[n][words];
        for (int v : order) {
            anc[v][v >>> 6] |= 1L << v;
            for (int p : parents[v]) {
                long[] row = anc[v];
                long[] from = anc[p];
                for (int w = 0; w < words; w++) {
                    row[w] |= from[w];
                }
            }
        }

        int[] observed = dag.observedIndices();
        int[] position = new int[n];
        List<String> names = new ArrayList<>(observed.length);
        for (int i = 0; i < observed.length; i++) {
            position[observed[i]] = i;
            names.add(dag.name(observed[i]));
        }
        MutableGraph mag = Graph.builder(names);
        Search search = new Search(dag, parents, children, anc);
        for (int i = 0; i < observed.length; i++) {
            for (int j = i + 1; j < observed.length; j++) {
                int a = observed[i];
                int b = observed[j];
                if (search.inducingPath(a, b)) {
                    Mark atA = isSet(anc[b], a) ? Mark.TAIL : Mark.ARROW;
                    Mark atB = isSet(anc[a], b) ? Mark.TAIL : Mark.ARROW;
                    mag.addEdge(position[a], position[b], atA, atB);
                }
            }
        }
        return mag.freeze();
    }

    private static boolean isSet(long[] bits, int v) {
        return (bits[v >>> 6] & (1L << v)) != 0;
    }

    private static void requireDag(Graph dag) {
        for (Edge e : dag.edges()) {
            if (!e.isDirected()) {
                throw new IllegalArgumentException("latent projection needs a DAG, but edge "
                        + GraphText.edge(dag, e) + " is not directed");
            }
        }
        int[] cycle = AncestralGraphs.directedCycle(dag);
        if (cycle != null) {
            throw new IllegalArgumentException("latent projection needs a DAG, but it has the directed cycle "
                    + GraphText.directedPath(dag, cycle));
        }
    }

    /** Reusable work arrays for the per-pair d-connection search; stamps avoid clearing them. */
    private static final class Search {
        private final Graph dag;
        private final int[][] parents;
        private final int[][] children;
        private final long[][] anc;
        private final int[] anZStamp;
        private final int[] upStamp;
        private final int[] downStamp;
        private final int[] stack;
        private final int[] queue;
        private int stamp;

        Search(Graph dag, int[][] parents, int[][] children, long[][] anc) {
            this.dag = dag;
            this.parents = parents;
            this.children = children;
            this.anc = anc;
            int n = dag.size();
            this.anZStamp = new int[n];
            this.upStamp = new int[n];
            this.downStamp = new int[n];
            this.stack = new int[n];
            this.queue = new int[2 * n];
        }

        private boolean inA(int v, long[] ancA, long[] ancB) {
            long bit = 1L << v;
            int w = v >>> 6;
            return ((ancA[w] | ancB[w]) & bit) != 0;
        }

        /** Whether a and b are d-connected given the observed ancestors of {a, b} other than a and b. */
        boolean inducingPath(int a, int b) {
            stamp++;
            long[] ancA = anc[a];
            long[] ancB = anc[b];
            // an(Z): Z is every observed vertex of A other than a, b; its ancestors stay inside A.
            int top = 0;
            int words = ancA.length;
            for (int w = 0; w < words; w++) {
                long bits = ancA[w] | ancB[w];
                while (bits != 0) {
                    int v = (w << 6) + Long.numberOfTrailingZeros(bits);
                    bits &= bits - 1;
                    if (v != a && v != b && !dag.isHidden(v) && anZStamp[v] != stamp) {
                        anZStamp[v] = stamp;
                        stack[top++] = v;
                    }
                }
            }
            while (top > 0) {
                int v = stack[--top];
                for (int p : parents[v]) {
                    if (anZStamp[p] != stamp) {
                        anZStamp[p] = stamp;
                        stack[top++] = p;
                    }
                }
            }
            // Bayes-ball from a inside A: "up" = entered from a child, "down" = entered from a parent.
            int head = 0;
            int tail = 0;
            upStamp[a] = stamp;
            queue[tail++] = (a << 1) | 1;
            while (head < tail) {
                int s = queue[head++];
                int v = s >>> 1;
                if (v == b) {
                    return true;
                }
                boolean up = (s & 1) == 1;
                boolean inZ = v != a && !dag.isHidden(v);
                if (!inZ) {
                    for (int c : children[v]) {
                        if (downStamp[c] != stamp && inA(c, ancA, ancB)) {
                            downStamp[c] = stamp;
                            queue[tail++] = c << 1;
                        }
                    }
                }
                if (up ? !inZ : anZStamp[v] == stamp) {
                    for (int p : parents[v]) {
                        if (upStamp[p] != stamp) {
                            upStamp[p] = stamp;
                            queue[tail++] = (p << 1) | 1;
                        }
                    }
                }
            }
            return false;
        }
    }
}
