package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;

import java.util.ArrayList;

/**
 * The CPDAG (completed partially directed acyclic graph, or essential graph) of a DAG: the
 * graph with the DAG's skeleton in which an edge is directed exactly when every DAG in the
 * Markov equivalence class directs it the same way. Two independent constructions, which
 * the tests check against each other on every DAG with up to five variables:
 *
 * <ul>
 *   <li>{@link #meek}: skeleton, v-structures, then Meek's rules R1–R4 to closure (Meek 1995,
 *       "Causal inference and causal explanation with background knowledge", UAI).</li>
 *   <li>{@link #chickering}: labelling each edge compelled or reversible in a fixed edge
 *       order (Chickering 1995, "A transformational characterization of equivalent Bayesian
 *       network structures", UAI, procedures Order-Edges and Find-Compelled).</li>
 * </ul>
 *
 * <p>Both cost about O(|V| log |V| + |E|·Δ) for maximum degree Δ on sparse graphs (Meek's
 * closure can reach O(|E|·Δ³) on dense ones); {@link #of} is the faster of the two as
 * measured by the benchmarks in {@code dev.touchstone.benchmarks.graph}. Hidden flags are
 * copied from the input.
 */
public final class Cpdags {

    private static final byte UNKNOWN = 0;
    private static final byte COMPELLED = 1;
    private static final byte REVERSIBLE = 2;

    private Cpdags() {
    }

    /**
     * The CPDAG of {@code dag}, by the faster construction ({@link #chickering}).
     *
     * @throws IllegalArgumentException if {@code dag} is not a DAG, naming the edge or cycle
     */
    public static Graph of(Graph dag) {
        return chickering(dag);
    }

    /**
     * The CPDAG of {@code dag} by Meek's rules: the skeleton with the v-structures oriented,
     * closed under R1–R4.
     *
     * @throws IllegalArgumentException if {@code dag} is not a DAG, naming the edge or cycle
     */
    public static Graph meek(Graph dag) {
        GraphChecks.checkDag(dag);
        PdagArrays p = PdagArrays.skeletonOf(dag);
        VStructures.orientInto(p, dag);
        MeekRules.close(p, null, new ArrayList<>());
        return p.toGraph();
    }

    /**
     * The CPDAG of {@code dag} by Chickering's edge labelling: order the edges (variables y
     * in topological order; into each y, parents from last to first in that order), then
     * label each edge compelled or reversible; compelled edges stay directed, reversible ones
     * become undirected.
     *
     * <p>Find-Compelled examines the lowest unlabelled edge x → y and, whichever branch it
     * takes, labels every edge into y; so only the first edge into each y, the one from its
     * parent latest in the order, is ever examined, and for that x "z is not a parent of x"
     * is the same as "z is not adjacent to x" (z comes before x). The loop below is that
     * observation, not a different algorithm.
     *
     * @throws IllegalArgumentException if {@code dag} is not a DAG, naming the edge or cycle
     */
    public static Graph chickering(Graph dag) {
        int[] order = Ancestry.topologicalOrder(dag);
        if (order == null || !dag.isFullyDirected()) {
            GraphChecks.checkDag(dag);
        }
        int[] pos = Ancestry.positions(order);
        PdagArrays p = PdagArrays.of(dag);
        byte[] label = new byte[p.state.length]; // on the slot in the child's row
        for (int y : order) {
            int from = p.offsets[y];
            int to = p.offsets[y + 1];
            int xSlot = -1;
            for (int s = from; s < to; s++) {
                if (p.state[s] == PdagArrays.IN && (xSlot < 0 || pos[p.neighbours[s]] > pos[p.neighbours[xSlot]])) {
                    xSlot = s;
                }
            }
            if (xSlot < 0) {
                continue;
            }
            int x = p.neighbours[xSlot];
            boolean allCompelled = false;
            for (int s = p.offsets[x], e = p.offsets[x + 1]; s < e && !allCompelled; s++) {
                if (p.state[s] == PdagArrays.IN && label[s] == COMPELLED) {
                    int w = p.neighbours[s];
                    int wy = p.slot(y, w);
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
                    int z = p.neighbours[s];
                    if (p.state[s] == PdagArrays.IN && z != x && !p.adjacent(z, x)) {
                        rest = COMPELLED; // z → y ← x is a v-structure
                        break;
                    }
                }
            }
            for (int s = from; s < to; s++) {
                if (p.state[s] == PdagArrays.IN && (label[s] == UNKNOWN || allCompelled)) {
                    label[s] = rest;
                }
            }
        }
        for (int s = 0; s < label.length; s++) {
            if (label[s] == REVERSIBLE) {
                p.state[s] = PdagArrays.UNDIRECTED;
                p.state[p.twin[s]] = PdagArrays.UNDIRECTED;
            }
        }
        return p.toGraph();
    }
}
