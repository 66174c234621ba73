package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Graphs as an adjacency-matrix CSV, the square table of end marks that matrix-minded tools
 * (R, pandas, spreadsheets) read directly, as is common practice in the field. The first
 * row is an empty cell followed by the variable names; then one row per variable, in the
 * same order, starting with its name. The cell in row {@code i}, column {@code j} is the
 * code of the mark <em>at {@code j}</em> on the edge between {@code i} and {@code j}:
 * {@value #NONE} no edge, {@value #TAIL} tail, {@value #ARROW} arrow, {@value #CIRCLE}
 * circle. So X → Y has 2 in row X, column Y and 1 in row Y, column X; X — Y has 1 in both;
 * X ↔ Y has 2 in both. The diagonal is 0, and a cell is 0 exactly when its mirror is.
 * The matrix lists every variable (isolated ones too) but not which are hidden. The checks
 * of {@link GraphAssembler} apply; messages name the file, the line and the column.
 * Cost O(V²).
 */
public final class GraphMatrixCsv {

    /** Code of an absent edge. */
    public static final int NONE = 0;
    /** Code of a tail. */
    public static final int TAIL = 1;
    /** Code of an arrowhead. */
    public static final int ARROW = 2;
    /** Code of a circle. */
    public static final int CIRCLE = 3;

    private static final CSVFormat READ_FORMAT = CSVFormat.RFC4180.builder()
            .setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(true).get();
    private static final CSVFormat WRITE_FORMAT = CSVFormat.RFC4180.builder().setRecordSeparator("\n").get();

    private GraphMatrixCsv() {
    }

    /** The code of a mark. */
    static int code(Mark m) {
        switch (m) {
            case TAIL:
                return TAIL;
            case ARROW:
                return ARROW;
            default:
                return CIRCLE;
        }
    }

    private static Mark markOf(int code) {
        switch (code) {
            case TAIL:
                return Mark.TAIL;
            case ARROW:
                return Mark.ARROW;
            case CIRCLE:
                return Mark.CIRCLE;
            default:
                return null;
        }
    }

    /**
     * Reads a matrix.
     *
     * @param expected the class the graph must belong to, or null for any
     * @throws FileFormatException naming the file, line and column at fault
     */
    public static Graph read(Path file, GraphClass expected) throws IOException {
        List<String> names = null;
        List<int[]> rows = new ArrayList<>();
        List<Long> lines = new ArrayList<>();
        try (LineCountingReader in = new LineCountingReader(InputFiles.reader(file));
             CSVParser parser = CSVParser.parse(in, READ_FORMAT)) {
            for (CSVRecord rec : parser) {
                long line = in.lineOf(rec.getCharacterPosition());
                if (names == null) {
                    if (rec.size() < 2 || !rec.get(0).isEmpty()) {
                        throw new FileFormatException(file, "line " + line, "expected the header: an empty cell,"
                                + " then the variable names");
                    }
                    names = rec.toList().subList(1, rec.size());
                    continue;
                }
                int k = rows.size();
                if (k >= names.size()) {
                    throw new FileFormatException(file, "line " + line, "more rows than the " + names.size()
                            + " variables of the header");
                }
                if (rec.size() != names.size() + 1) {
                    throw new FileFormatException(file, "line " + line, "the row has " + rec.size()
                            + " cells but needs " + (names.size() + 1) + " (the name, then one code per variable)");
                }
                if (!rec.get(0).equals(names.get(k))) {
                    throw new FileFormatException(file, "line " + line, "row " + (k + 1) + " is '" + rec.get(0)
                            + "' but the header's variable " + (k + 1) + " is '" + names.get(k) + "'");
                }
                int[] codes = new int[names.size()];
                for (int j = 0; j < codes.length; j++) {
                    String cell = rec.get(j + 1);
                    int c = cell.length() == 1 ? cell.charAt(0) - '0' : -1;
                    if (c < NONE || c > CIRCLE) {
                        throw new FileFormatException(file, "line " + line + ", column '" + names.get(j) + "'",
                                "'" + cell + "' is not a mark code (0 none, 1 tail, 2 arrow, 3 circle)");
                    }
                    codes[j] = c;
                }
                rows.add(codes);
                lines.add(line);
            }
        } catch (UncheckedIOException e) {
            throw new FileFormatException(file, null, "not valid CSV: "
                    + (e.getCause() == null ? e.getMessage() : e.getCause().getMessage()));
        }
        if (names == null) {
            throw new FileFormatException(file, null, "the file is empty (expected a header of variable names)");
        }
        if (rows.size() != names.size()) {
            throw new FileFormatException(file, null, rows.size() + " rows for " + names.size()
                    + " variables: the matrix must be square");
        }
        GraphAssembler a = new GraphAssembler(file, names, expected, "line " + 1);
        for (int i = 0; i < names.size(); i++) {
            String place = "line " + lines.get(i);
            if (rows.get(i)[i] != NONE) {
                throw new FileFormatException(file, place + ", column '" + names.get(i) + "'",
                        "the diagonal must be 0 (a variable has no edge to itself)");
            }
            for (int j = i + 1; j < names.size(); j++) {
                int atJ = rows.get(i)[j];
                int atI = rows.get(j)[i];
                if ((atJ == NONE) != (atI == NONE)) {
                    throw new FileFormatException(file, place + ", column '" + names.get(j) + "'", "'"
                            + names.get(i) + "' and '" + names.get(j) + "' have codes " + atJ + " and " + atI
                            + " (line " + lines.get(j) + "): an edge needs a mark at both ends, no edge 0 at both");
                }
                if (atJ != NONE) {
                    a.add(names.get(i), names.get(j), markOf(atI).word(), markOf(atJ).word(),
                            place + ", column '" + names.get(j) + "'");
                }
            }
        }
        return a.build();
    }

    /** Writes the matrix of {@code g} to {@code file} atomically. */
    public static void write(Path file, Graph g) throws IOException {
        AtomicFiles.writeText(file, w -> write(w, g));
    }

    /** Writes the header and one row per variable. */
    public static void write(Writer out, Graph g) throws IOException {
        int p = g.size();
        int[][] m = new int[p][p];
        for (Edge e : g.edges()) {
            m[e.a()][e.b()] = code(e.atB());
            m[e.b()][e.a()] = code(e.atA());
        }
        CSVPrinter printer = new CSVPrinter(out, WRITE_FORMAT);
        List<String> header = new ArrayList<>();
        header.add("");
        header.addAll(g.names());
        printer.printRecord(header);
        for (int i = 0; i < p; i++) {
            List<String> row = new ArrayList<>(p + 1);
            row.add(g.name(i));
            for (int j = 0; j < p; j++) {
                row.add(Integer.toString(m[i][j]));
            }
            printer.printRecord(row);
        }
        printer.flush();
    }
}
