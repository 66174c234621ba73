package dev.touchstone.learners.score;

import java.util.Arrays;

/**
 * The re-completion of a {@link Pdag} after a search move, done on a working copy of it in
 * sorted rows (compressed sparse rows, each edge a slot in both ends' rows with its twin), so
 * that no core {@code Graph} is built, frozen and converted back after every move. Two steps:
 *
 * <ul>
 *   <li>{@link #extendToDag}: a consistent DAG extension by the algorithm of Dor and Tarsi
 *       (1992, "A simple algorithm to construct a consistent extension of a partially oriented
 *       graph", technical report R-185, Cognitive Systems Laboratory, UCLA): repeatedly remove
 *       a variable that has no outgoing directed edge among the remaining ones and whose
 *       undirected neighbours are each adjacent to all its other remaining neighbours,
 *       orienting its undirected edges into it. Candidates are kept on a first-in first-out
 *       worklist scanned in the same order as core's {@code DagExtension}, so the extension is
 *       the same DAG, not only one of the same class. A count per variable of its directed
 *       edges to variables not yet removed makes the first condition one comparison.</li>
 *   <li>{@link #labelCompelled}: Chickering's labelling of each edge as compelled or
 *       reversible (Chickering 1995, "A transformational characterization of equivalent
 *       Bayesian network structures", UAI, procedures Order-Edges and Find-Compelled), with
 *       the same shortcut as core's {@code Cpdags.chickering}: only the first edge into each
 *       variable, from its latest parent in the order, is ever examined. The order is the
 *       reverse of the extension's removal order, which is topological (each removed variable
 *       is a sink of what remains). The CPDAG does not depend on which topological order is
 *       used, since it is a property of the equivalence class.</li>
 * </ul>
 *
 * <p>The rows are sorted by neighbour and {@link #toPdag} keeps that order, which is the order
 * {@link Pdag#of} gives for a frozen core graph, so the searches iterate neighbours exactly as
 * they did when the completion went through core. Cost: O(Σ_v deg(v)² log Δ) for the
 * extension and O(|E| log Δ) for the labelling, plus O(p + |E|) for the copy in and out.
 */
final class CompletionRows {

    private static final byte UNKNOWN = 0;
    private static final byte COMPELLED = 1;
    private static final byte REVERSIBLE = 2;

    private final int p;
    private final int[] offsets;
    private final int[] neighbours;
    /** The state of each slot's edge seen from the row's owner, in {@link Pdag}'s codes. */
    private final byte[] state;
    /** For each slot, the slot of the same edge in the other end's row. */
    private final int[] twin;

    private CompletionRows(Pdag g) {
        p = g.size();
        offsets = new int[p + 1];
        for (int v = 0; v < p; v++) {
            offsets[v + 1] = offsets[v] + g.degree(v);
        }
        int slots = offsets[p];
        neighbours = new int[slots];
        state = new byte[slots];
        twin = new int[slots];
        long[] packed = new long[8];
        for (int v = 0; v < p; v++) {
            int d = g.degree(v);
            if (packed.length < d) {
                packed = new long[Math.max(d, 2 * packed.length)];
            }
            for (int k = 0; k < d; k++) {
                packed[k] = ((long) g.neighbour(v, k) << 8) | g.neighbourState(v, k);
            }
            Arrays.sort(packed, 0, d);
            for (int k = 0, s = offsets[v]; k < d; k++, s++) {
                neighbours[s] = (int) (packed[k] >>> 8);
                state[s] = (byte) (packed[k] & 0xff);
            }
        }
        // Visiting the owners v in ascending order reaches each row w's entries in its own
        // (ascending) order, so a cursor per row finds every twin without a search.
        int[] cursor = Arrays.copyOf(offsets, p);
        for (int v = 0; v < p; v++) {
            for (int s = offsets[v], e = offsets[v + 1]; s < e; s++) {
                twin[s] = cursor[neighbours[s]]++;
            }
        }
    }

    /** The CPDAG of the class of {@code pdag}'s consistent extensions, or null when it has none. */
    static Pdag cpdagOf(Pdag pdag) {
        CompletionRows rows = new CompletionRows(pdag);
        int[] removal = rows.extendToDag();
        if (removal == null) {
            return null;
        }
        rows.labelCompelled(removal);
        return rows.toPdag();
    }

    /** A consistent DAG extension of {@code pdag} (the one core's {@code DagExtension} gives), or null. */
    static Pdag extensionOf(Pdag pdag) {
        CompletionRows rows = new CompletionRows(pdag);
        return rows.extendToDag() == null ? null : rows.toPdag();
    }

    /** The slot of w in v's row, or −1. */
    private int slot(int v, int w) {
        // rows are sorted and hold each neighbour once
        int at = Arrays.binarySearch(neighbours, offsets[v], offsets[v + 1], w);
        return at >= 0 ? at : -1;
    }

    private boolean adjacent(int v, int w) {
        return slot(v, w) >= 0;
    }

    /**
     * Orients the rows into a consistent DAG extension and returns the variables in the order
     * they were removed (sinks first), or null when there is no extension (some variable never
     * qualifies; this includes a directed cycle).
     */
    private int[] extendToDag() {
        boolean[] removed = new boolean[p];
        boolean[] queued = new boolean[p];
        int[] queue = new int[p];
        // Each variable's directed edges out to variables not yet removed: condition (a) is
        // then a test of one count instead of a scan of the row at every look.
        int[] outgoing = new int[p];
        for (int v = 0; v < p; v++) {
            for (int s = offsets[v], e = offsets[v + 1]; s < e; s++) {
                if (state[s] == Pdag.OUT) {
                    outgoing[v]++;
                }
            }
        }
        int head = 0;
        int tail = 0;
        for (int v = 0; v < p; v++) {
            if (qualifies(v, removed, outgoing)) {
                queued[v] = true;
                queue[tail++] = v;
            }
        }
        while (head < tail) {
            int x = queue[head++];
            for (int s = offsets[x], e = offsets[x + 1]; s < e; s++) {
                if (removed[neighbours[s]]) {
                    continue;
                }
                if (state[s] == Pdag.UNDIRECTED) {
                    state[s] = Pdag.IN;
                    state[twin[s]] = Pdag.OUT;
                } else if (state[s] == Pdag.IN) {
                    outgoing[neighbours[s]]--; // that neighbour's edge into x no longer counts
                }
            }
            removed[x] = true;
            for (int s = offsets[x], e = offsets[x + 1]; s < e; s++) {
                int w = neighbours[s];
                if (!removed[w] && !queued[w] && qualifies(w, removed, outgoing)) {
                    queued[w] = true;
                    queue[tail++] = w;
                }
            }
        }
        return tail == p ? queue : null;
    }

    private boolean qualifies(int x, boolean[] removed, int[] outgoing) {
        if (outgoing[x] > 0) {
            return false;
        }
        int from = offsets[x];
        int to = offsets[x + 1];
        for (int s = from; s < to; s++) {
            int y = neighbours[s];
            if (removed[y] || state[s] != Pdag.UNDIRECTED) {
                continue;
            }
            for (int t = from; t < to; t++) {
                int z = neighbours[t];
                if (z != y && !removed[z] && !adjacent(y, z)) {
                    return false;
                }
            }
        }
        return true;
    }

    /**
     * Turns the DAG in the rows into its CPDAG: every reversible edge becomes undirected.
     * {@code removal} lists the variables sinks first, so its reverse is a topological order.
     */
    private void labelCompelled(int[] removal) {
        int[] pos = new int[p];
        for (int i = 0; i < p; i++) {
            pos[removal[i]] = p - 1 - i;
        }
        byte[] label = new byte[state.length]; // on the slot in the child's row
        for (int i = p - 1; i >= 0; i--) {
            int y = removal[i];
            int from = offsets[y];
            int to = offsets[y + 1];
            int xSlot = -1;
            for (int s = from; s < to; s++) {
                if (state[s] == Pdag.IN && (xSlot < 0 || pos[neighbours[s]] > pos[neighbours[xSlot]])) {
                    xSlot = s;
                }
            }
            if (xSlot < 0) {
                continue;
            }
            int x = neighbours[xSlot];
            boolean allCompelled = false;
            for (int s = offsets[x], e = offsets[x + 1]; s < e && !allCompelled; s++) {
                if (state[s] == Pdag.IN && label[s] == COMPELLED) {
                    int wy = slot(y, neighbours[s]);
                    if (wy < 0) {
                        allCompelled = true; // w → x → y with w, y not adjacent
                    } else {
                        label[wy] = COMPELLED; // w → y, since w precedes y
                    }
                }
            }
            byte rest = allCompelled ? COMPELLED : REVERSIBLE;
            if (!allCompelled) {
                for (int s = from; s < to; s++) {
                    int z = neighbours[s];
                    if (state[s] == Pdag.IN && z != x && !adjacent(z, x)) {
                        rest = COMPELLED; // z → y ← x is a v-structure
                        break;
                    }
                }
            }
            for (int s = from; s < to; s++) {
                if (state[s] == Pdag.IN && (label[s] == UNKNOWN || allCompelled)) {
                    label[s] = rest;
                }
            }
        }
        for (int s = 0; s < label.length; s++) {
            if (label[s] == REVERSIBLE) {
                state[s] = Pdag.UNDIRECTED;
                state[twin[s]] = Pdag.UNDIRECTED;
            }
        }
    }

    private Pdag toPdag() {
        return Pdag.ofSortedRows(offsets, neighbours, state);
    }
}
