package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/**
 * Reads a graph file in whichever of the product's graph formats its name says: a CSV edge
 * list ({@code .csv}, variables taken from the edges) or graph JSON (anything else). Cost:
 * linear in the file.
 */
public final class GraphFiles {

    private GraphFiles() {
    }

    /** Whether the file name says CSV edge list. */
    public static boolean isCsv(Path file) {
        return file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".csv");
    }

    /**
     * Reads a graph file.
     *
     * @param expected the class the graph must belong to, or null for any
     * @throws FileFormatException naming the file and place at fault
     */
    public static Graph read(Path file, GraphClass expected) throws IOException {
        return isCsv(file) ? GraphCsv.readWithVariablesFromEdges(file, List.of(), expected)
                : GraphJson.read(file, expected);
    }

    /**
     * Reads a graph file whose variables are known (a data set's columns): a CSV edge list is
     * read over them, in their order; graph JSON names its own.
     *
     * @param variables the variables, or null to take them from the file
     * @param expected  the class the graph must belong to, or null for any
     * @throws FileFormatException naming the file and place at fault
     */
    public static Graph read(Path file, List<String> variables, GraphClass expected) throws IOException {
        return variables != null && isCsv(file) ? GraphCsv.read(file, variables, expected) : read(file, expected);
    }
}
