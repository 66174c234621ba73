package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

import java.io.IOException;
import java.nio.file.Path;

/**
 * Writes a graph as GraphViz DOT for viewing (not read back). Each edge is drawn with both
 * ends shown as they are: an arrow as an arrowhead ({@code normal}), a circle as an open
 * dot ({@code odot}), a tail as no decoration ({@code none}), using {@code dir=both} so
 * that GraphViz draws the mark at each end. Hidden variables are drawn dashed and grey.
 * Cost O(V + E).
 */
public final class GraphDot {

    private GraphDot() {
    }

    /** Writes the DOT text of {@code g} to {@code file} atomically. */
    public static void write(Path file, Graph g, String title) throws IOException {
        AtomicFiles.writeString(file, toDot(g, title));
    }

    /** The DOT text of {@code g}, titled {@code title}. */
    public static String toDot(Graph g, String title) {
        StringBuilder sb = new StringBuilder();
        sb.append("digraph ").append(id(title)).append(" {\n");
        sb.append("  node [shape=ellipse, fontname=\"Helvetica\"];\n");
        sb.append("  edge [dir=both];\n");
        for (int v = 0; v < g.size(); v++) {
            sb.append("  ").append(id(g.name(v)));
            if (g.isHidden(v)) {
                sb.append(" [style=dashed, color=gray50, fontcolor=gray40]");
            }
            sb.append(";\n");
        }
        for (Edge e : g.edges()) {
            sb.append("  ").append(id(g.name(e.a()))).append(" -> ").append(id(g.name(e.b())))
                    .append(" [arrowtail=").append(arrow(e.atA()))
                    .append(", arrowhead=").append(arrow(e.atB())).append("];\n");
        }
        return sb.append("}\n").toString();
    }

    /** The GraphViz arrow shape for a mark. */
    static String arrow(Mark m) {
        switch (m) {
            case ARROW:
                return "normal";
            case CIRCLE:
                return "odot";
            default:
                return "none";
        }
    }

    /** A quoted DOT identifier. */
    static String id(String s) {
        return '"' + s.replace("\\", "\\\\").replace("\"", "\\\"").replace("\n", "\\n") + '"';
    }
}
