package dev.touchstone.core.graph;

import dev.touchstone.core.param.Worded;
import java.util.EnumSet;
import java.util.Set;

/**
 * The kinds of graph a learner can return and a truth can be expressed as.
 *
 * <ul>
 *   <li>{@link #DAG}: directed acyclic graph.</li>
 *   <li>{@link #CPDAG}: completed partially directed acyclic graph, the Markov equivalence
 *       class of a DAG (Chickering 1995; Meek 1995).</li>
 *   <li>{@link #MAG}: maximal ancestral graph over observed variables (Richardson and
 *       Spirtes 2002, "Ancestral graph Markov models", Annals of Statistics 30).</li>
 *   <li>{@link #PAG}: partial ancestral graph, the Markov equivalence class of a MAG
 *       (Zhang 2008).</li>
 * </ul>
 *
 * <p>{@link #allows(Edge)} checks only which mark combinations may occur; the structural
 * properties (acyclicity, ancestrality, maximality, completeness) are checked by the
 * graph algorithms.
 */
public enum GraphClass implements Worded {
    DAG(EnumSet.of(Mark.TAIL, Mark.ARROW), false, false),
    CPDAG(EnumSet.of(Mark.TAIL, Mark.ARROW), true, false),
    MAG(EnumSet.of(Mark.TAIL, Mark.ARROW), true, true),
    PAG(EnumSet.of(Mark.TAIL, Mark.ARROW, Mark.CIRCLE), true, true);

    private final Set<Mark> marks;
    private final boolean undirectedAllowed;
    private final boolean bidirectedAllowed;

    GraphClass(Set<Mark> marks, boolean undirectedAllowed, boolean bidirectedAllowed) {
        this.marks = marks;
        this.undirectedAllowed = undirectedAllowed;
        this.bidirectedAllowed = bidirectedAllowed;
    }

    /** Whether an edge with these marks may appear in a graph of this class. */
    public boolean allows(Edge e) {
        if (!marks.contains(e.atA()) || !marks.contains(e.atB())) {
            return false;
        }
        if (e.isUndirected()) {
            return undirectedAllowed;
        }
        if (e.isBidirected()) {
            return bidirectedAllowed;
        }
        return true;
    }

    /**
     * Parses {@code dag}, {@code cpdag}, {@code mag} or {@code pag}.
     *
     * @throws IllegalArgumentException naming the word and the allowed words
     */
    public static GraphClass parse(String word) {
        return Worded.parse(GraphClass.class, word, "graph class");
    }
}
