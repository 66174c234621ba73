package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The graph file formats, chosen by the end of the file name: the one place that maps a
 * name to a reader and a writer, so that every command and store reads and writes graphs
 * alike. {@code .json}: graph JSON ({@link GraphJson}); {@code .matrix.csv}: adjacency
 * matrix ({@link GraphMatrixCsv}); any other {@code .csv}: edge list ({@link GraphCsv});
 * {@code .dot} or {@code .gv}: DOT ({@link GraphDot}). Any other name is refused with one
 * line listing these. Cost: the format's, linear in the file (quadratic for the matrix).
 */
public enum GraphFormat {
    /** Graph JSON, with hidden flags. */
    JSON("graph JSON", ".json"),
    /** Adjacency matrix of mark codes; checked before {@link #EDGE_LIST} since it also ends in {@code .csv}. */
    MATRIX("adjacency-matrix CSV", ".matrix.csv"),
    /** CSV edge list. */
    EDGE_LIST("CSV edge list", ".csv"),
    /** GraphViz DOT, with hidden flags (dashed nodes). */
    DOT("DOT", ".dot", ".gv");

    private final String description;
    private final List<String> endings;

    GraphFormat(String description, String... endings) {
        this.description = description;
        this.endings = List.of(endings);
    }

    /** A short description, e.g. {@code CSV edge list}. */
    public String description() {
        return description;
    }

    /** The name endings that select this format, the first being the one written by default. */
    public List<String> endings() {
        return endings;
    }

    /** The format a file name asks for, or null when none matches. */
    public static GraphFormat forName(String fileName) {
        String n = fileName.toLowerCase(Locale.ROOT);
        for (GraphFormat f : values()) {
            for (String e : f.endings) {
                if (n.endsWith(e) && n.length() > e.length()) {
                    return f;
                }
            }
        }
        return null;
    }

    /**
     * The format of {@code file}.
     *
     * @throws FileFormatException, one line listing the accepted endings, when the name matches none
     */
    public static GraphFormat of(Path file) {
        GraphFormat f = file.getFileName() == null ? null : forName(file.getFileName().toString());
        if (f == null) {
            throw new FileFormatException(file, null, "cannot tell the graph format from the name (accepted: "
                    + accepted() + ")");
        }
        return f;
    }

    /** The accepted endings with what they mean, for messages and help texts. */
    public static String accepted() {
        List<String> parts = new ArrayList<>();
        for (GraphFormat f : values()) {
            parts.add(String.join(" or ", f.endings) + " " + f.description);
        }
        return String.join(", ", parts);
    }

    /** Whether files of this format record which variables are hidden. */
    public boolean keepsHidden() {
        return this == JSON || this == DOT;
    }

    /** Whether files of this format list variables without edges. */
    public boolean keepsIsolated() {
        return this != EDGE_LIST;
    }

    /**
     * Reads a graph file.
     *
     * @param variables the variables when known (a data set's columns), used by the edge list,
     *                  which cannot list them itself; null to take them from the file
     * @param expected  the class the graph must belong to, or null for any
     * @throws FileFormatException naming the file and place at fault
     */
    public Graph read(Path file, List<String> variables, GraphClass expected) throws IOException {
        switch (this) {
            case JSON:
                return GraphJson.read(file, expected);
            case MATRIX:
                return GraphMatrixCsv.read(file, expected);
            case EDGE_LIST:
                return variables != null ? GraphCsv.read(file, variables, expected)
                        : GraphCsv.readWithVariablesFromEdges(file, List.of(), expected);
            default:
                return GraphDot.read(file, expected);
        }
    }

    /** Writes {@code g} to {@code file} atomically; {@code title} names the graph where the format has a title (DOT). */
    public void write(Path file, Graph g, String title) throws IOException {
        switch (this) {
            case JSON:
                GraphJson.write(file, g);
                break;
            case MATRIX:
                GraphMatrixCsv.write(file, g);
                break;
            case EDGE_LIST:
                GraphCsv.write(file, g);
                break;
            default:
                GraphDot.write(file, g, title);
                break;
        }
    }

    /** The text of {@code g} in this format (for printing). */
    public String text(Graph g, String title) {
        try {
            switch (this) {
                case JSON:
                    return GraphJson.toJson(g);
                case MATRIX: {
                    StringWriter w = new StringWriter();
                    GraphMatrixCsv.write(w, g);
                    return w.toString();
                }
                case EDGE_LIST: {
                    StringWriter w = new StringWriter();
                    GraphCsv.write(w, g);
                    return w.toString();
                }
                default:
                    return GraphDot.toDot(g, title);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
