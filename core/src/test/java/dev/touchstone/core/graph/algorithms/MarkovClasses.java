package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;

import java.util.ArrayList;
import java.util.List;

/**
 * Test oracle that applies definitions directly, with no orientation rule: the Markov
 * equivalence class of a small MAG by enumerating every mark assignment on its skeleton,
 * keeping the maximal ancestral graphs with exactly the same m-separations over all pairs
 * and all conditioning sets (Richardson and Spirtes 2002, definition of Markov
 * equivalence), and the PAG read off it (Zhang 2008, §2: a mark is kept where all members
 * agree, a circle elsewhere). Exponential; for graphs of up to about 6 variables and 9 edges.
 */
final class MarkovClasses {

    private MarkovClasses() {
    }

    /** The m-separation answers of {@code g} for every pair x &lt; y and every subset of the rest, as bits. */
    static boolean[] separations(Graph g) {
        return separations(g, null);
    }

    /** As {@link #separations(Graph)}, but stops with null at the first answer differing from {@code reference}. */
    static boolean[] separations(Graph g, boolean[] reference) {
        int n = g.size();
        MSeparation msep = new MSeparation(g);
        List<Boolean> out = new ArrayList<>();
        for (int x = 0; x < n; x++) {
            for (int y = x + 1; y < n; y++) {
                int[] rest = new int[n - 2];
                int k = 0;
                for (int v = 0; v < n; v++) {
                    if (v != x && v != y) {
                        rest[k++] = v;
                    }
                }
                for (int mask = 0; mask < (1 << rest.length); mask++) {
                    boolean sep = msep.separated(x, y, subset(rest, mask));
                    if (reference != null && reference[out.size()] != sep) {
                        return null;
                    }
                    out.add(sep);
                }
            }
        }
        boolean[] bits = new boolean[out.size()];
        for (int i = 0; i < bits.length; i++) {
            bits[i] = out.get(i);
        }
        return bits;
    }

    static int[] subset(int[] items, int mask) {
        int[] out = new int[Integer.bitCount(mask)];
        int k = 0;
        for (int i = 0; i < items.length; i++) {
            if ((mask & (1 << i)) != 0) {
                out[k++] = items[i];
            }
        }
        return out;
    }

    /**
     * Every MAG Markov equivalent to {@code mag}; with {@code undirectedAllowed} false only
     * those without undirected edges (no selection bias).
     */
    static List<Graph> equivalenceClass(Graph mag, boolean undirectedAllowed) {
        List<Edge> skeleton = mag.edges();
        boolean[] reference = separations(mag);
        Mark[][] options = undirectedAllowed
                ? new Mark[][] {{Mark.TAIL, Mark.ARROW}, {Mark.ARROW, Mark.TAIL}, {Mark.ARROW, Mark.ARROW},
                        {Mark.TAIL, Mark.TAIL}}
                : new Mark[][] {{Mark.TAIL, Mark.ARROW}, {Mark.ARROW, Mark.TAIL}, {Mark.ARROW, Mark.ARROW}};
        int m = skeleton.size();
        // An arrowhead of an unshielded collider is shared by the whole class, so only
        // options with it are tried (a filter; the full check below decides).
        Mark[][][] allowed = new Mark[m][][];
        long total = 1;
        for (int i = 0; i < m; i++) {
            Edge e = skeleton.get(i);
            boolean arrowAtA = inUnshieldedCollider(mag, e.b(), e.a());
            boolean arrowAtB = inUnshieldedCollider(mag, e.a(), e.b());
            allowed[i] = java.util.Arrays.stream(options)
                    .filter(o -> (!arrowAtA || o[0] == Mark.ARROW) && (!arrowAtB || o[1] == Mark.ARROW))
                    .toArray(Mark[][]::new);
            total *= allowed[i].length;
        }
        List<Graph> out = new ArrayList<>();
        int[] digits = new int[m];
        for (long code = 0; code < total; code++) {
            long c = code;
            for (int i = 0; i < m; i++) {
                digits[i] = (int) (c % allowed[i].length);
                c /= allowed[i].length;
            }
            MutableGraph g = Graph.builder(mag.names());
            for (int i = 0; i < m; i++) {
                Edge e = skeleton.get(i);
                g.addEdge(e.a(), e.b(), allowed[i][digits[i]][0], allowed[i][digits[i]][1]);
            }
            Graph candidate = g.freeze();
            // Equal unshielded colliders are necessary for equal separations (a cheap filter).
            // Same skeleton and same separations as a maximal graph imply maximality, so only
            // ancestrality needs its own check.
            if (sameUnshieldedColliders(mag, candidate) && AncestralGraphs.isAncestral(candidate)
                    && separations(candidate, reference) != null) {
                out.add(candidate);
            }
        }
        return out;
    }

    private static boolean sameUnshieldedColliders(Graph g, Graph h) {
        for (int b = 0; b < g.size(); b++) {
            int[] nb = g.neighbours(b);
            for (int i = 0; i < nb.length; i++) {
                for (int j = i + 1; j < nb.length; j++) {
                    if (!g.adjacent(nb[i], nb[j]) && collider(g, nb[i], b, nb[j]) != collider(h, nb[i], b, nb[j])) {
                        return false;
                    }
                }
            }
        }
        return true;
    }

    /** Whether {@code b} is the middle of an unshielded collider of {@code g} that uses the edge a–b. */
    private static boolean inUnshieldedCollider(Graph g, int a, int b) {
        for (int c : g.neighbours(b)) {
            if (c != a && !g.adjacent(a, c) && collider(g, a, b, c)) {
                return true;
            }
        }
        return false;
    }

    private static boolean collider(Graph g, int a, int b, int c) {
        return g.markAt(b, a) == Mark.ARROW && g.markAt(b, c) == Mark.ARROW;
    }

    /** The PAG by definition: the skeleton, with each mark kept where every member of the class agrees. */
    static Graph pagByDefinition(List<Graph> equivalenceClass) {
        Graph first = equivalenceClass.get(0);
        MutableGraph pag = Graph.builder(first.names());
        for (Edge e : first.edges()) {
            Mark atA = e.atA();
            Mark atB = e.atB();
            for (Graph member : equivalenceClass) {
                if (member.markAt(e.a(), e.b()) != atA) {
                    atA = Mark.CIRCLE;
                }
                if (member.markAt(e.b(), e.a()) != atB) {
                    atB = Mark.CIRCLE;
                }
            }
            pag.addEdge(e.a(), e.b(), atA, atB);
        }
        return pag.freeze();
    }
}
