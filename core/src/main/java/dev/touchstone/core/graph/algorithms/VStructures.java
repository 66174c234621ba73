package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;

/**
 * The v-structures (unshielded colliders) of a DAG or partially directed graph: triples
 * {@code a → c ← b} with {@code a} and {@code b} not adjacent. Two DAGs are Markov
 * equivalent exactly when they have the same skeleton and the same v-structures (Verma
 * and Pearl 1990, "Equivalence and synthesis of causal models", UAI).
 *
 * <p>Only directed edges count; undirected and other edges are ignored. Cost: O(Σ_c
 * |pa(c)|² log Δ) over the variables c, with Δ the maximum degree.
 */
public final class VStructures {

    private VStructures() {
    }

    /** One unshielded collider {@code a → collider ← b}, with {@code a < b}. */
    public record VStructure(int a, int collider, int b) {
        public VStructure {
            if (a >= b) {
                throw new IllegalArgumentException("a v-structure is written with a < b, got " + a + ", " + b);
            }
        }
    }

    /** All v-structures, sorted by collider, then a, then b. */
    public static List<VStructure> of(Graph g) {
        List<VStructure> out = new ArrayList<>();
        for (int c = 0; c < g.size(); c++) {
            int[] pa = g.parents(c);
            for (int i = 0; i < pa.length; i++) {
                for (int j = i + 1; j < pa.length; j++) {
                    if (!g.adjacent(pa[i], pa[j])) {
                        out.add(new VStructure(pa[i], c, pa[j]));
                    }
                }
            }
        }
        return Collections.unmodifiableList(out);
    }

    /** The number of v-structures. */
    public static long count(Graph g) {
        long count = 0;
        for (int c = 0; c < g.size(); c++) {
            int[] pa = g.parents(c);
            for (int i = 0; i < pa.length; i++) {
                for (int j = i + 1; j < pa.length; j++) {
                    if (!g.adjacent(pa[i], pa[j])) {
                        count++;
                    }
                }
            }
        }
        return count;
    }

    /** Whether {@code a → c ← b} is a v-structure of {@code g}. */
    public static boolean isVStructure(Graph g, int a, int c, int b) {
        return a != b && g.hasDirected(a, c) && g.hasDirected(b, c) && !g.adjacent(a, b);
    }

    /** Whether the two graphs have the same v-structures (variables must match in order). */
    public static boolean same(Graph g, Graph h) {
        return g.names().equals(h.names()) && of(g).equals(of(h));
    }

    /**
     * Marks the edges of every v-structure of {@code dag} in {@code p}, which holds the
     * same adjacencies: both edges of each unshielded collider are oriented into it.
     */
    static void orientInto(PdagArrays p, Graph dag) {
        int[] pa = new int[8];
        int[] paSlot = new int[8];
        for (int c = 0; c < p.n; c++) {
            int m = 0;
            for (int s = p.offsets[c]; s < p.offsets[c + 1]; s++) {
                int w = p.neighbours[s];
                // p's slots follow dag's rows, so the slot's marks are read in O(1).
                if (Ancestry.isParentSlot(dag, c, s - p.offsets[c])) {
                    if (m == pa.length) {
                        pa = Arrays.copyOf(pa, 2 * m);
                        paSlot = Arrays.copyOf(paSlot, 2 * m);
                    }
                    pa[m] = w;
                    paSlot[m++] = s;
                }
            }
            for (int i = 0; i < m; i++) {
                for (int j = i + 1; j < m; j++) {
                    if (!p.adjacent(pa[i], pa[j])) {
                        p.orientOut(p.twin[paSlot[i]]);
                        p.orientOut(p.twin[paSlot[j]]);
                    }
                }
            }
        }
    }
}
