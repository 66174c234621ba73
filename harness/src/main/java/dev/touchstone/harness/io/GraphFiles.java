package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

/**
 * Reads and writes a graph file in whichever format its name says ({@link GraphFormat}):
 * graph JSON, CSV edge list, adjacency-matrix CSV or DOT. A name that says none of them is
 * refused with one line listing the accepted endings. Cost: linear in the file.
 */
public final class GraphFiles {

    private GraphFiles() {
    }

    /**
     * Reads a graph file.
     *
     * @param expected the class the graph must belong to, or null for any
     * @throws FileFormatException naming the file and place at fault
     */
    public static Graph read(Path file, GraphClass expected) throws IOException {
        return GraphFormat.of(file).read(file, null, expected);
    }

    /**
     * Reads a graph file whose variables are known (a data set's columns): a CSV edge list is
     * read over them, in their order; the other formats name their own.
     *
     * @param variables the variables, or null to take them from the file
     * @param expected  the class the graph must belong to, or null for any
     * @throws FileFormatException naming the file and place at fault
     */
    public static Graph read(Path file, List<String> variables, GraphClass expected) throws IOException {
        return GraphFormat.of(file).read(file, variables, expected);
    }

    /** Writes {@code g} in the format the name of {@code file} says, atomically. */
    public static void write(Path file, Graph g, String title) throws IOException {
        GraphFormat.of(file).write(file, g, title);
    }
}
