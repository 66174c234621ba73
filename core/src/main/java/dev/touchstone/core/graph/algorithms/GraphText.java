package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

/** Renders edges and paths by variable name for error messages of the ancestral-graph algorithms. */
final class GraphText {

    private GraphText() {
    }

    /** The edge as {@code 'A' o-> 'B'}, written from {@code e.a()}. */
    static String edge(Graph g, Edge e) {
        return "'" + g.name(e.a()) + "' " + left(e.atA()) + "-" + right(e.atB()) + " '" + g.name(e.b()) + "'";
    }

    /** A directed path or cycle as {@code 'A' --> 'B' --> 'C'}. */
    static String directedPath(Graph g, int[] nodes) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < nodes.length; i++) {
            if (i > 0) {
                sb.append(" --> ");
            }
            sb.append('\'').append(g.name(nodes[i])).append('\'');
        }
        return sb.toString();
    }

    private static char left(Mark m) {
        return m == Mark.ARROW ? '<' : m == Mark.CIRCLE ? 'o' : '-';
    }

    private static char right(Mark m) {
        return m == Mark.ARROW ? '>' : m == Mark.CIRCLE ? 'o' : '-';
    }
}
