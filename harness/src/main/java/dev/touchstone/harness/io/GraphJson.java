package dev.touchstone.harness.io;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.io.JsonStringEncoder;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Set;

/**
 * Graph files in the product's own JSON shape:
 * <pre>
 * {"variables": ["A", "B", "C"],
 *  "hidden": ["C"],
 *  "edges": [{"between": ["A", "B"], "marks": ["tail", "arrow"]}]}
 * </pre>
 * where {@code marks[i]} is the mark at {@code between[i]} ({@code tail}, {@code arrow} or
 * {@code circle}); {@code hidden} may be left out. Reading is strict: an unknown field, a
 * missing one, a value of the wrong type, an unknown variable or mark, a self-loop, a pair
 * given twice, marks the expected class does not allow, or a cycle where a DAG is expected
 * is refused with one line naming the file and the edge (edges are numbered from 1).
 * Writing puts one edge per line, in the graph's canonical order. Cost O(V + E).
 */
public final class GraphJson {

    /**
     * The reader's mapper, in a holder so that writing a graph (the last step of every
     * {@code learn}) does not initialise Jackson's data binding, which loads some 600 classes.
     */
    private static final class Reading {
        static final ObjectMapper MAPPER = new ObjectMapper()
                .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION);
    }

    private static final Set<String> TOP_FIELDS = Set.of("variables", "hidden", "edges");
    private static final Set<String> EDGE_FIELDS = Set.of("between", "marks");

    private GraphJson() {
    }

    /** Reads a graph of any class. */
    public static Graph read(Path file) throws IOException {
        return read(file, null);
    }

    /**
     * Reads a graph that must belong to {@code expected} (null for any class).
     *
     * @throws FileFormatException naming the file and the edge or field at fault
     */
    public static Graph read(Path file, GraphClass expected) throws IOException {
        JsonNode root = JsonTrees.read(file, Reading.MAPPER);
        if (root == null || root.isMissingNode()) {
            throw new FileFormatException(file, null, "the file is empty (expected a JSON object with variables and edges)");
        }
        if (!root.isObject()) {
            throw new FileFormatException(file, null, "expected a JSON object with variables and edges");
        }
        for (Iterator<String> it = root.fieldNames(); it.hasNext(); ) {
            String f = it.next();
            if (!TOP_FIELDS.contains(f)) {
                throw new FileFormatException(file, "field '" + f + "'", "unknown field (allowed: variables, hidden, edges)");
            }
        }
        List<String> variables = strings(file, root.get("variables"), "variables", true, -1);
        GraphAssembler assembler = new GraphAssembler(file, variables, expected, "field 'variables'");
        if (root.has("hidden")) {
            assembler.hide(strings(file, root.get("hidden"), "hidden", true, -1), "field 'hidden'");
        }
        JsonNode edges = root.get("edges");
        if (edges == null || !edges.isArray()) {
            throw new FileFormatException(file, "field 'edges'", edges == null ? "missing (use [] for no edges)"
                    : "expected a list of edges");
        }
        for (int k = 0; k < edges.size(); k++) {
            String place = "edge " + (k + 1);
            JsonNode e = edges.get(k);
            if (!e.isObject()) {
                throw new FileFormatException(file, place, "expected an object with 'between' and 'marks'");
            }
            for (Iterator<String> it = e.fieldNames(); it.hasNext(); ) {
                String f = it.next();
                if (!EDGE_FIELDS.contains(f)) {
                    throw new FileFormatException(file, place, "unknown field '" + f + "' (allowed: between, marks)");
                }
            }
            List<String> between = strings(file, e.get("between"), place + ", field 'between'", false, 2);
            List<String> marks = strings(file, e.get("marks"), place + ", field 'marks'", false, 2);
            assembler.add(between.get(0), between.get(1), marks.get(0), marks.get(1), place);
        }
        return assembler.build();
    }

    private static List<String> strings(Path file, JsonNode node, String field, boolean isTopField, int size) {
        String place = isTopField ? "field '" + field + "'" : field;
        if (node == null) {
            throw new FileFormatException(file, place, "missing");
        }
        if (!node.isArray()) {
            throw new FileFormatException(file, place, "expected a list of names");
        }
        if (size >= 0 && node.size() != size) {
            throw new FileFormatException(file, place, "expected exactly " + size + " entries, got " + node.size());
        }
        List<String> out = new ArrayList<>();
        for (JsonNode v : node) {
            if (!v.isTextual()) {
                throw new FileFormatException(file, place, "expected text, got " + v);
            }
            out.add(v.asText());
        }
        return out;
    }

    /** Writes {@code g} to {@code file} atomically. */
    public static void write(Path file, Graph g) throws IOException {
        AtomicFiles.writeString(file, toJson(g));
    }

    /** The JSON text of {@code g}, one edge per line. */
    public static String toJson(Graph g) {
        StringBuilder sb = new StringBuilder("{\n  \"variables\": ");
        list(sb, g.names());
        sb.append(",\n  \"hidden\": ");
        list(sb, List.copyOf(g.hiddenNames()));
        sb.append(",\n  \"edges\": [");
        List<Edge> edges = g.edges();
        for (int k = 0; k < edges.size(); k++) {
            Edge e = edges.get(k);
            sb.append(k == 0 ? "\n    " : ",\n    ").append("{\"between\": ");
            list(sb, List.of(g.name(e.a()), g.name(e.b())));
            sb.append(", \"marks\": ");
            list(sb, List.of(e.atA().word(), e.atB().word()));
            sb.append('}');
        }
        sb.append(edges.isEmpty() ? "]\n}\n" : "\n  ]\n}\n");
        return sb.toString();
    }

    private static void list(StringBuilder sb, List<String> items) {
        sb.append('[');
        for (int i = 0; i < items.size(); i++) {
            if (i > 0) {
                sb.append(", ");
            }
            // The same escapes as the mapper's writer (quote, backslash, control characters).
            sb.append('"').append(JsonStringEncoder.getInstance().quoteAsString(items.get(i))).append('"');
        }
        sb.append(']');
    }
}
