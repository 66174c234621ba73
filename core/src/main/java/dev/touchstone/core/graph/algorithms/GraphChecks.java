package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;

/**
 * Structural validation of DAGs, partially directed graphs and CPDAGs, with messages that
 * name the offending edge or cycle. {@code check…} methods throw
 * {@link IllegalArgumentException}; {@code is…} methods answer.
 *
 * <p>Costs: {@link #checkDag} and {@link #checkPdag} are O(|V| + |E|);
 * {@link #isCpdag} / {@link #checkCpdag} build a consistent extension (Dor and Tarsi 1992)
 * and its CPDAG (Chickering 1995), O(|V| + |E|·Δ²) for maximum degree Δ.
 */
public final class GraphChecks {

    private GraphChecks() {
    }

    /**
     * Checks that {@code g} is a DAG: every edge directed, no directed cycle.
     *
     * @throws IllegalArgumentException naming the first edge that is not directed, or a
     *     cycle as {@code a -> b -> c -> a}
     */
    public static void checkDag(Graph g) {
        if (!g.isFullyDirected()) {
            for (Edge e : g.edges()) {
                if (!e.isDirected()) {
                    throw new IllegalArgumentException("not a DAG: edge " + PdagArrays.describe(g, e)
                            + " is not directed");
                }
            }
        }
        int[] cycle = Ancestry.directedCycle(g);
        if (cycle.length > 0) {
            throw new IllegalArgumentException("not a DAG: directed cycle " + Ancestry.describeCycle(g, cycle));
        }
    }

    /** Whether {@code g} is a DAG: every edge directed, no directed cycle. */
    public static boolean isDag(Graph g) {
        return g.isFullyDirected() && Ancestry.isAcyclic(g);
    }

    /**
     * Checks that {@code g} is a partially directed acyclic graph: every edge directed or
     * undirected, and no directed cycle among the directed edges.
     *
     * @throws IllegalArgumentException naming the first edge with another mark, or a cycle
     */
    public static void checkPdag(Graph g) {
        for (Edge e : g.edges()) {
            if (!e.isDirected() && !e.isUndirected()) {
                throw new IllegalArgumentException("not a partially directed graph: edge "
                        + PdagArrays.describe(g, e) + " is neither directed nor undirected");
            }
        }
        int[] cycle = Ancestry.directedCycle(g);
        if (cycle.length > 0) {
            throw new IllegalArgumentException("directed cycle " + Ancestry.describeCycle(g, cycle));
        }
    }

    /**
     * Whether {@code g} is a CPDAG (completed partially directed acyclic graph, the
     * essential graph of a Markov equivalence class; Chickering 1995, Andersson, Madigan
     * and Perlman 1997): it has a consistent DAG extension whose CPDAG is {@code g} itself.
     * That suffices because every consistent extension has the skeleton and v-structures
     * of {@code g}, hence lies in one Markov equivalence class (Verma and Pearl 1990).
     */
    public static boolean isCpdag(Graph g) {
        return cpdagProblem(g) == null;
    }

    /**
     * Checks that {@code g} is a CPDAG (see {@link #isCpdag}).
     *
     * @throws IllegalArgumentException saying why not: a bad mark, no consistent
     *     extension, or the first edge whose mark differs from the CPDAG of an extension
     */
    public static void checkCpdag(Graph g) {
        String problem = cpdagProblem(g);
        if (problem != null) {
            throw new IllegalArgumentException("not a CPDAG: " + problem);
        }
    }

    private static String cpdagProblem(Graph g) {
        for (Edge e : g.edges()) {
            if (!e.isDirected() && !e.isUndirected()) {
                return "edge " + PdagArrays.describe(g, e) + " is neither directed nor undirected";
            }
        }
        Graph extension = DagExtension.of(g);
        if (extension == null) {
            return "it has no consistent DAG extension (a directed cycle, or orientations that force a new"
                    + " v-structure or cycle)";
        }
        Graph cpdag = Cpdags.of(extension);
        if (cpdag.sameEdges(g)) {
            return null;
        }
        for (Edge e : g.edges()) {
            Edge c = cpdag.edge(e.a(), e.b());
            if (!e.equals(c)) {
                return "edge " + PdagArrays.describe(g, e) + " should be " + PdagArrays.describe(g, c)
                        + " in the CPDAG of its equivalence class";
            }
        }
        return "its edges differ from the CPDAG of its equivalence class";
    }
}
