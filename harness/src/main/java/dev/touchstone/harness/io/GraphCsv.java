package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * Graphs as a CSV edge list for exchange with other tools: the header
 * {@code node_a,node_b,mark_a,mark_b}, then one row per edge with the mark at each end
 * ({@code tail}, {@code arrow}, {@code circle}). An edge list cannot show variables without
 * edges nor hidden flags, so the reader is given the variable list, or takes the variables
 * from the edges (in order of first appearance) after an optional list of its own. The same
 * checks as {@link GraphJson} apply; messages name the file, the line and the edge.
 * Cost O(V + E).
 */
public final class GraphCsv {

    /** The header row, exactly. */
    public static final List<String> HEADER = List.of("node_a", "node_b", "mark_a", "mark_b");

    private static final CSVFormat READ_FORMAT = CSVFormat.RFC4180.builder()
            .setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(true).get();
    private static final CSVFormat WRITE_FORMAT = CSVFormat.RFC4180.builder().setRecordSeparator("\n").get();

    private GraphCsv() {
    }

    /**
     * Reads an edge list over exactly these variables (in this order).
     *
     * @param expected the class the graph must belong to, or null for any
     * @throws FileFormatException naming the file, line and edge at fault
     */
    public static Graph read(Path file, List<String> variables, GraphClass expected) throws IOException {
        List<String[]> rows = new ArrayList<>();
        List<Long> lines = new ArrayList<>();
        parse(file, rows, lines);
        return assemble(file, variables, expected, rows, lines);
    }

    /**
     * Reads an edge list whose variables are {@code extra} (which may be empty) followed by
     * the other names the edges use, in order of first appearance.
     */
    public static Graph readWithVariablesFromEdges(Path file, List<String> extra, GraphClass expected)
            throws IOException {
        List<String[]> rows = new ArrayList<>();
        List<Long> lines = new ArrayList<>();
        parse(file, rows, lines);
        Set<String> names = new LinkedHashSet<>(extra);
        if (names.size() != extra.size()) {
            throw new IllegalArgumentException("the variable list names a variable twice: " + extra);
        }
        for (String[] r : rows) {
            if (!r[0].isEmpty()) {
                names.add(r[0]);
            }
            if (!r[1].isEmpty()) {
                names.add(r[1]);
            }
        }
        return assemble(file, new ArrayList<>(names), expected, rows, lines);
    }

    private static Graph assemble(Path file, List<String> variables, GraphClass expected, List<String[]> rows,
                                  List<Long> lines) {
        GraphAssembler a = new GraphAssembler(file, variables, expected, "variable list");
        for (int k = 0; k < rows.size(); k++) {
            String[] r = rows.get(k);
            a.add(r[0], r[1], r[2], r[3], "line " + lines.get(k));
        }
        return a.build();
    }

    private static void parse(Path file, List<String[]> rows, List<Long> lines) throws IOException {
        try (LineCountingReader in = new LineCountingReader(InputFiles.reader(file));
             CSVParser parser = CSVParser.parse(in, READ_FORMAT)) {
            boolean header = true;
            for (CSVRecord rec : parser) {
                long line = in.lineOf(rec.getCharacterPosition());
                if (header) {
                    header = false;
                    if (!rec.toList().equals(HEADER)) {
                        throw new FileFormatException(file, "line " + line, "expected the header "
                                + String.join(",", HEADER) + ", got " + String.join(",", rec.toList()));
                    }
                    continue;
                }
                if (rec.size() != 4) {
                    throw new FileFormatException(file, "line " + line, "the row has " + rec.size()
                            + " cells but an edge needs 4 (node_a, node_b, mark_a, mark_b)");
                }
                String[] r = rec.values();
                for (int c = 0; c < 2; c++) {
                    if (r[c].isEmpty()) {
                        throw new FileFormatException(file, "line " + line, "empty " + HEADER.get(c));
                    }
                }
                rows.add(r);
                lines.add(line);
            }
            if (header) {
                throw new FileFormatException(file, null, "the file is empty (expected the header "
                        + String.join(",", HEADER) + ")");
            }
        } catch (UncheckedIOException e) {
            throw new FileFormatException(file, null, "not valid CSV: "
                    + (e.getCause() == null ? e.getMessage() : e.getCause().getMessage()));
        }
    }

    /** Writes the edges of {@code g} to {@code file} atomically. */
    public static void write(Path file, Graph g) throws IOException {
        AtomicFiles.writeText(file, w -> write(w, g));
    }

    /** Writes the header and one row per edge, in the graph's canonical order. */
    public static void write(Writer out, Graph g) throws IOException {
        CSVPrinter p = new CSVPrinter(out, WRITE_FORMAT);
        p.printRecord(HEADER);
        for (Edge e : g.edges()) {
            p.printRecord(g.name(e.a()), g.name(e.b()), e.atA().word(), e.atB().word());
        }
        p.flush();
    }
}
