package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;

import org.jgrapht.graph.DirectedPseudograph;
import org.jgrapht.graph.Pseudograph;
import org.jgrapht.nio.Attribute;
import org.jgrapht.nio.ImportException;
import org.jgrapht.nio.dot.DOTImporter;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;

/**
 * Graphs as GraphViz DOT, for drawing ({@code dot -Tsvg g.dot}) and for exchange with
 * general graph tools. Every edge is written with its head where the arrow is: a directed
 * edge X → Y is {@code "X" -> "Y"}, so any DOT reader sees the true direction. Each edge
 * also carries its marks explicitly with {@code dir=both}: {@code arrowtail} is the mark at
 * the first node and {@code arrowhead} the mark at the second, an arrow as {@code normal}, a
 * circle as {@code odot}, a tail as {@code none} (GraphViz's arrow shapes). Hidden variables
 * are drawn {@code style=dashed} in grey, and a dashed node is read back as hidden.
 *
 * <p>Reading goes through JGraphT's DOT importer (jgrapht-io), which parses the DOT
 * grammar; the marks follow GraphViz's rules for {@code dir}: in a {@code digraph} an edge
 * without attributes is an arrow at its second node and a tail at its first, in a
 * {@code graph} it is undirected; any arrow shape other than {@code none} and the circle
 * shapes ({@code odot}, {@code dot}, {@code invodot}, {@code invdot}) is an arrow. The
 * checks of {@link GraphAssembler} apply. Cost O(V + E).
 */
public final class GraphDot {

    /** The start of an undirected DOT graph, after comments and blank space. */
    private static final Pattern UNDIRECTED = Pattern.compile(
            "(?:\\s|//[^\\n]*\\n|#[^\\n]*\\n|/\\*(?s:.*?)\\*/)*(?:strict\\s+)?graph\\b",
            Pattern.CASE_INSENSITIVE);

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
        for (int v = 0; v < g.size(); v++) {
            sb.append("  ").append(id(g.name(v)));
            if (g.isHidden(v)) {
                sb.append(" [style=dashed, color=gray50, fontcolor=gray40]");
            }
            sb.append(";\n");
        }
        for (Edge e : g.edges()) {
            // The end with the stronger mark (arrow over circle over tail) is the head, so that
            // readers that ignore the marks still see X -> Y for X → Y.
            boolean swap = rank(e.atA()) > rank(e.atB());
            int from = swap ? e.b() : e.a();
            int to = swap ? e.a() : e.b();
            Mark atFrom = swap ? e.atB() : e.atA();
            Mark atTo = swap ? e.atA() : e.atB();
            sb.append("  ").append(id(g.name(from))).append(" -> ").append(id(g.name(to)))
                    .append(" [dir=both, arrowtail=").append(arrow(atFrom))
                    .append(", arrowhead=").append(arrow(atTo)).append("];\n");
        }
        return sb.append("}\n").toString();
    }

    private static int rank(Mark m) {
        switch (m) {
            case ARROW:
                return 2;
            case CIRCLE:
                return 1;
            default:
                return 0;
        }
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

    /** A quoted DOT identifier (DOT's only escape inside quotes is {@code \"}). */
    static String id(String s) {
        return '"' + s.replace("\"", "\\\"").replace("\n", " ") + '"';
    }

    /**
     * Reads a DOT file: variables in order of first appearance, dashed ones hidden.
     *
     * @param expected the class the graph must belong to, or null for any
     * @throws FileFormatException naming the file and the edge at fault
     */
    public static Graph read(Path file, GraphClass expected) throws IOException {
        String text = InputFiles.readString(file);
        Parsed parsed;
        try {
            parsed = parse(new StringReader(text), !UNDIRECTED.matcher(text).lookingAt());
        } catch (ImportException e) {
            throw new FileFormatException(file, null, "not valid DOT: " + oneLine(e));
        }
        GraphAssembler a = new GraphAssembler(file, parsed.names, expected, "nodes");
        List<String> hidden = new ArrayList<>();
        for (String n : parsed.names) {
            Map<String, Attribute> attrs = parsed.nodeAttributes.get(n);
            Attribute style = attrs == null ? null : attrs.get("style");
            if (style != null && style.getValue().toLowerCase(Locale.ROOT).contains("dashed")) {
                hidden.add(n);
            }
        }
        a.hide(hidden, "nodes");
        int k = 0;
        for (DotEdge e : parsed.edges) {
            k++;
            String dir = value(e.attributes, "dir", parsed.directed ? "forward" : "none").toLowerCase(Locale.ROOT);
            boolean headShown = dir.equals("forward") || dir.equals("both");
            boolean tailShown = dir.equals("back") || dir.equals("both");
            if (!headShown && !tailShown && !dir.equals("none")) {
                throw new FileFormatException(file, "edge " + k + " (" + e.source + ", " + e.target + ")",
                        "unknown dir '" + dir + "' (allowed: forward, back, both, none)");
            }
            String atSource = tailShown ? mark(value(e.attributes, "arrowtail", "normal")) : "tail";
            String atTarget = headShown ? mark(value(e.attributes, "arrowhead", "normal")) : "tail";
            a.add(e.source, e.target, atSource, atTarget, "edge " + k);
        }
        return a.build();
    }

    private static String oneLine(Exception e) {
        String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
        return m.replace('\n', ' ').strip();
    }

    private static String value(Map<String, Attribute> attrs, String key, String otherwise) {
        Attribute a = attrs.get(key);
        return a == null ? otherwise : a.getValue().strip();
    }

    /** Our mark word for a GraphViz arrow shape (modifiers such as {@code o} for open are ignored). */
    private static String mark(String shape) {
        String s = shape.toLowerCase(Locale.ROOT);
        if (s.equals("none") || s.isEmpty()) {
            return "tail";
        }
        if (s.equals("odot") || s.equals("dot") || s.equals("invodot") || s.equals("invdot")) {
            return "circle";
        }
        return "arrow";
    }

    private static Parsed parse(Reader in, boolean directed) {
        Parsed out = new Parsed(directed);
        DOTImporter<String, DotEdge> importer = new DOTImporter<>();
        importer.setVertexFactory(id -> id);
        importer.setEdgeWithAttributesFactory(attrs -> new DotEdge(attrs));
        importer.addVertexAttributeConsumer((va, attr) ->
                out.nodeAttributes.computeIfAbsent(va.getFirst(), x -> new HashMap<>()).put(va.getSecond(), attr));
        org.jgrapht.Graph<String, DotEdge> g = directed ? new DirectedPseudograph<>(null, null, false)
                : new Pseudograph<>(null, null, false);
        importer.importGraph(g, in);
        out.names.addAll(g.vertexSet());
        for (DotEdge e : g.edgeSet()) {
            e.source = g.getEdgeSource(e);
            e.target = g.getEdgeTarget(e);
            out.edges.add(e);
        }
        return out;
    }

    /** What the importer gave: node names in order of appearance, their attributes, the edges. */
    private static final class Parsed {
        final boolean directed;
        final List<String> names = new ArrayList<>();
        final Map<String, Map<String, Attribute>> nodeAttributes = new LinkedHashMap<>();
        final List<DotEdge> edges = new ArrayList<>();

        Parsed(boolean directed) {
            this.directed = directed;
        }
    }

    /** One imported edge with its attributes; identity equality, so parallel edges stay apart. */
    private static final class DotEdge {
        final Map<String, Attribute> attributes;
        String source;
        String target;

        DotEdge(Map<String, Attribute> attributes) {
            this.attributes = attributes == null ? Map.of() : new HashMap<>(attributes);
        }
    }
}
