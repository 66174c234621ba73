package dev.touchstone.harness.io;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.data.VariableKind;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.IntStream;

/**
 * Reads and writes data sets as CSV: a header row of variable names, one row per sample,
 * an empty cell for a missing value (Commons CSV does the quoting).
 *
 * <p>Which columns are discrete is declared by the caller or inferred with one rule: a
 * column that is not declared is <b>discrete if any of its cells is not a number</b>, and
 * continuous otherwise (so a column of codes such as 0/1/2 is continuous unless declared
 * discrete). The choice for every column is reported in {@link Result#columns()}. A number
 * is written in decimal or scientific notation ({@code -1.5}, {@code 2e-3}); the words NaN
 * and Infinity, and values too large for a double, are refused rather than read as missing.
 * Categories of a discrete column are ordered numerically when every label is a number,
 * otherwise alphabetically, so the codes do not depend on the order of the rows.
 *
 * <p>Bad input is refused with one line naming the file, line and column: a non-number in
 * a declared-continuous column, a row with more or fewer cells than the header, an empty or
 * repeated name, a column that is constant or entirely missing, NaN or infinity, an empty
 * file, a declared column that the header lacks. Blank lines are skipped (except in a
 * one-column file, where a blank line is a missing cell).
 *
 * <p>Numbers are parsed from the file's bytes ({@link CsvRecords}, {@link DecimalToDouble})
 * to exactly the double {@link Double#parseDouble} gives; Strings are made only for text. A
 * file whose every data cell is a plain number or empty is parsed in parallel by byte ranges
 * ({@link NumberColumns}), with the same result for any number of threads; any other file, or
 * one with a bad row, is read by the general pass, which gives the kinds and messages.
 * Cost: one pass over the file (the parallel path adds a quick count of its line feeds), two
 * when a column turns out to be discrete after it began with numbers; memory O(rows × columns) for the values, columns sized from the file's length
 * after the first rows, plus a 1 MiB buffer.
 */
public final class DataCsv {

    private static final Pattern NUMBER = Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?");
    private static final Pattern NOT_FINITE = Pattern.compile("(?i)[+-]?(?:nan|inf|infinity)");
    private static final CSVFormat WRITE_FORMAT = CSVFormat.RFC4180.builder()
            .setRecordSeparator("\n")
            .get();

    /** How a column's kind was chosen. */
    public enum Choice {
        /** The caller said so. */
        DECLARED,
        /** Every cell that is not empty is a number. */
        INFERRED_ALL_NUMBERS,
        /** Some cell is not a number. */
        INFERRED_NOT_A_NUMBER
    }

    /**
     * The kind chosen for one column, and why.
     *
     * @param example for {@link Choice#INFERRED_NOT_A_NUMBER}, the first value that is not a number and its line
     */
    public record ColumnKind(String name, VariableKind kind, Choice choice, String example) {
        /** One line such as {@code colour: discrete (has text values, such as 'red' on line 3)}. */
        public String describe() {
            String why;
            switch (choice) {
                case DECLARED:
                    why = "declared";
                    break;
                case INFERRED_ALL_NUMBERS:
                    why = "every value is a number";
                    break;
                default:
                    why = example;
                    break;
            }
            return name + ": " + kind.word() + " (" + why + ")";
        }
    }

    /** A data set read from CSV, with the kind chosen for each column. */
    public record Result(DataSet data, List<ColumnKind> columns) {
        public Result {
            columns = List.copyOf(columns);
        }

        /** The report of the kinds, one line per column. */
        public String describeKinds() {
            StringBuilder sb = new StringBuilder();
            for (ColumnKind c : columns) {
                sb.append(c.describe()).append('\n');
            }
            return sb.toString();
        }
    }

    private DataCsv() {
    }

    /** Reads a CSV data set, inferring every column's kind. */
    public static Result read(Path file) throws IOException {
        return read(file, Map.of());
    }

    /**
     * Reads a CSV data set; columns named in {@code declared} get that kind, the others are
     * inferred.
     *
     * @throws FileFormatException naming the file, line and column of the first problem
     */
    public static Result read(Path file, Map<String, VariableKind> declared) throws IOException {
        Header header = readHeader(file);
        List<String> names = header.names();
        Set<String> known = new HashSet<>(names);
        for (String d : declared.keySet()) {
            if (!known.contains(d)) {
                throw new FileFormatException(file, null, "column '" + d + "' is declared "
                        + declared.get(d).word() + " but the header has no such column");
            }
        }
        int p = names.size();
        Kind[] kinds = new Kind[p];
        for (int j = 0; j < p; j++) {
            VariableKind k = declared.get(names.get(j));
            kinds[j] = k == null ? Kind.UNDECIDED : k == VariableKind.DISCRETE ? Kind.DISCRETE : Kind.CONTINUOUS;
        }
        if (!Arrays.asList(kinds).contains(Kind.DISCRETE)) {
            // Every cell a plain number or empty: parsed in parallel; otherwise the general pass.
            double[][] columns = NumberColumns.read(file, header.dataStart(), p,
                    Runtime.getRuntime().availableProcessors());
            if (columns != null) {
                Pass numbers = new Pass(file, names, kinds, columns);
                return numbers.result(declared);
            }
        }
        Pass first = new Pass(file, names, kinds);
        first.run();
        Pass done = first;
        if (first.switchedAfterNumbers) {
            Kind[] fixed = first.kinds.clone();
            for (int j = 0; j < p; j++) {
                if (fixed[j] == Kind.UNDECIDED) {
                    fixed[j] = Kind.CONTINUOUS;
                }
            }
            done = new Pass(file, names, fixed);
            System.arraycopy(first.firstNonNumber, 0, done.firstNonNumber, 0, p);
            done.run();
        }
        return done.result(declared);
    }

    /** The names in the header row, and the byte at which the first data row starts. */
    private record Header(List<String> names, long dataStart) {
    }

    private static Header readHeader(Path file) throws IOException {
        try (CsvRecords in = new CsvRecords(file)) {
            if (!in.next()) {
                throw new FileFormatException(file, null, "the file is empty (expected a header row of variable names)");
            }
            List<String> names = new ArrayList<>();
            Map<String, Integer> seen = new HashMap<>();
            for (int j = 0; j < in.cells(); j++) {
                String name = in.text(j);
                if (name.isEmpty()) {
                    throw new FileFormatException(file, "line 1, column " + (j + 1), "empty variable name");
                }
                Integer prev = seen.put(name, j);
                if (prev != null) {
                    throw new FileFormatException(file, "line 1, column " + (j + 1), "variable name '" + name
                            + "' appears twice (also column " + (prev + 1) + ")");
                }
                names.add(name);
            }
            return new Header(names, in.consumed());
        }
    }

    private enum Kind { UNDECIDED, CONTINUOUS, DISCRETE }

    /** One read of the file's rows with the column kinds known so far. */
    private static final class Pass {
        private final Path file;
        private final List<String> names;
        private final Kind[] kinds;
        private final String[] firstNonNumber;
        private final double[][] numbers;
        private final int[][] codes;
        private final List<Map<String, Integer>> labels = new ArrayList<>();
        private int rows;
        private int capacity = 256;
        private boolean estimated;
        boolean switchedAfterNumbers;

        Pass(Path file, List<String> names, Kind[] kinds) {
            this(file, names, kinds, new double[names.size()][], 0);
            for (int j = 0; j < names.size(); j++) {
                if (this.kinds[j] == Kind.DISCRETE) {
                    codes[j] = new int[capacity];
                } else {
                    numbers[j] = new double[capacity];
                }
            }
        }

        /** A pass whose rows are already read, as these columns of numbers (no column discrete). */
        Pass(Path file, List<String> names, Kind[] kinds, double[][] columns) {
            this(file, names, kinds, columns, columns[0].length);
        }

        private Pass(Path file, List<String> names, Kind[] kinds, double[][] numbers, int rows) {
            this.file = file;
            this.names = names;
            this.kinds = kinds.clone();
            int p = names.size();
            this.firstNonNumber = new String[p];
            this.numbers = numbers;
            this.codes = new int[p][];
            this.rows = rows;
            for (int j = 0; j < p; j++) {
                labels.add(new LinkedHashMap<>());
            }
        }

        void run() throws IOException {
            int p = names.size();
            long size = Files.size(file);
            try (CsvRecords in = new CsvRecords(file)) {
                in.next();
                long headerBytes = in.consumed();
                while (in.next()) {
                    if (p > 1 && in.cells() == 1 && in.isEmpty(0)) {
                        continue;
                    }
                    long line = in.line();
                    if (in.cells() != p) {
                        throw new FileFormatException(file, "line " + line, "the row has " + in.cells()
                                + (in.cells() == 1 ? " cell" : " cells") + " but the header has " + p);
                    }
                    if (rows == capacity) {
                        grow(in.consumed() - headerBytes, size - in.consumed());
                    }
                    byte[] b = in.bytes();
                    for (int j = 0; j < p; j++) {
                        if (kinds[j] != Kind.DISCRETE && !in.quoted(j)) {
                            // The common case: a number parsed in place, no String made.
                            int s = in.start(j);
                            int e = in.end(j);
                            if (s == e) {
                                numbers[j][rows] = Double.NaN;
                                continue;
                            }
                            double v = DecimalToDouble.parse(b, s, e);
                            if (!Double.isNaN(v) && !Double.isInfinite(v)) {
                                numbers[j][rows] = v;
                                continue;
                            }
                        }
                        cell(in.text(j), j, line);
                    }
                    rows++;
                }
            }
        }

        /**
         * Makes room for more rows: at the first growth, for as many rows as the rest of the
         * file holds at the mean row length so far (plus 5 %), so a large file is not copied
         * again and again; later by half again.
         */
        private void grow(long bytesSoFar, long bytesLeft) {
            long estimate = capacity + capacity / 2;
            if (!estimated && bytesSoFar > 0) {
                estimated = true;
                double perRow = (double) bytesSoFar / rows;
                estimate = Math.max(estimate, rows + (long) (1.05 * bytesLeft / perRow) + 16);
            }
            capacity = (int) Math.min(Integer.MAX_VALUE - 8, estimate);
            for (int j = 0; j < kinds.length; j++) {
                if (kinds[j] == Kind.DISCRETE) {
                    codes[j] = Arrays.copyOf(codes[j], capacity);
                } else {
                    numbers[j] = Arrays.copyOf(numbers[j], capacity);
                }
            }
        }

        private String place(long line, int j) {
            return "line " + line + ", column '" + names.get(j) + "'";
        }

        private void cell(String text, int j, long line) {
            Kind kind = kinds[j];
            if (kind == Kind.DISCRETE) {
                codes[j][rows] = text.isEmpty() ? DataSet.MISSING_CODE
                        : labels.get(j).computeIfAbsent(text, t -> labels.get(j).size());
                return;
            }
            if (text.isEmpty()) {
                numbers[j][rows] = Double.NaN;
                return;
            }
            if (NOT_FINITE.matcher(text).matches()) {
                throw new FileFormatException(file, place(line, j), "'" + text
                        + "' is not a finite number (leave the cell empty for a missing value)");
            }
            if (!NUMBER.matcher(text).matches()) {
                if (kind == Kind.CONTINUOUS) {
                    throw new FileFormatException(file, place(line, j), "'" + text
                            + "' is not a number, but the column is continuous");
                }
                // An undeclared column with a label: it is discrete. Its earlier numbers are
                // re-read as labels in a second pass, so their text is kept exactly.
                kinds[j] = Kind.DISCRETE;
                firstNonNumber[j] = "has text values, such as '" + text + "' on line " + line;
                codes[j] = new int[capacity];
                numbers[j] = null;
                if (rows > 0) {
                    switchedAfterNumbers = true;
                }
                Arrays.fill(codes[j], 0, rows, DataSet.MISSING_CODE);
                codes[j][rows] = labels.get(j).computeIfAbsent(text, t -> labels.get(j).size());
                return;
            }
            double v = Double.parseDouble(text);
            if (Double.isInfinite(v)) {
                throw new FileFormatException(file, place(line, j), "'" + text
                        + "' is too large for a double (not a finite number)");
            }
            numbers[j][rows] = v;
        }

        Result result(Map<String, VariableKind> declared) {
            int p = names.size();
            if (rows == 0) {
                throw new FileFormatException(file, null, "no data rows after the header");
            }
            DataSet.Builder b = DataSet.builder(rows);
            List<ColumnKind> report = new ArrayList<>();
            for (int j = 0; j < p; j++) {
                String name = names.get(j);
                boolean isDeclared = declared.containsKey(name);
                if (kinds[j] == Kind.DISCRETE) {
                    Variable v = discrete(j);
                    b.discrete(v, recode(j, v));
                    report.add(new ColumnKind(name, VariableKind.DISCRETE,
                            isDeclared ? Choice.DECLARED : Choice.INFERRED_NOT_A_NUMBER, firstNonNumber[j]));
                } else {
                    double[] values = numbers[j].length == rows ? numbers[j] : Arrays.copyOf(numbers[j], rows);
                    numbers[j] = null;
                    checkContinuous(j, values);
                    b.continuous(name, values);
                    report.add(new ColumnKind(name, VariableKind.CONTINUOUS,
                            isDeclared ? Choice.DECLARED : Choice.INFERRED_ALL_NUMBERS, null));
                }
            }
            return new Result(b.build(), report);
        }

        private void checkContinuous(int j, double[] values) {
            double first = Double.NaN;
            boolean constant = true;
            for (double v : values) {
                if (Double.isNaN(v)) {
                    continue;
                }
                if (Double.isNaN(first)) {
                    first = v;
                } else if (v != first) {
                    // Two values differ: the column is fine, and the rest need not be looked at
                    // (on a file of 10,000 columns the full scans cost a pass over every value).
                    constant = false;
                    break;
                }
            }
            if (Double.isNaN(first)) {
                throw new FileFormatException(file, "column '" + names.get(j) + "'", "every cell is empty");
            }
            if (constant) {
                throw new FileFormatException(file, "column '" + names.get(j) + "'", "every value is " + first
                        + " (a constant column carries no information)");
            }
        }

        private Variable discrete(int j) {
            Map<String, Integer> found = labels.get(j);
            if (found.isEmpty()) {
                throw new FileFormatException(file, "column '" + names.get(j) + "'", "every cell is empty");
            }
            if (found.size() == 1) {
                throw new FileFormatException(file, "column '" + names.get(j) + "'", "every value is '"
                        + found.keySet().iterator().next() + "' (a constant column carries no information)");
            }
            List<String> sorted = new ArrayList<>(found.keySet());
            boolean allNumbers = sorted.stream().allMatch(s -> NUMBER.matcher(s).matches());
            sorted.sort(allNumbers
                    ? Comparator.comparingDouble((String s) -> Double.parseDouble(s)).thenComparing(Comparator.naturalOrder())
                    : Comparator.naturalOrder());
            return Variable.discrete(names.get(j), sorted);
        }

        private int[] recode(int j, Variable v) {
            Map<String, Integer> found = labels.get(j);
            int[] map = new int[found.size()];
            List<String> cats = v.categories();
            for (int k = 0; k < cats.size(); k++) {
                map[found.get(cats.get(k))] = k;
            }
            int[] out = new int[rows];
            for (int r = 0; r < rows; r++) {
                int c = codes[j][r];
                out[r] = c == DataSet.MISSING_CODE ? DataSet.MISSING_CODE : map[c];
            }
            return out;
        }
    }

    /** Writes {@code data} to {@code file} atomically (see {@link #write(OutputStream, DataSet)}). */
    public static void write(Path file, DataSet data) throws IOException {
        AtomicFiles.writeBytes(file, out -> write(out, data));
    }

    /**
     * Writes {@code data} as UTF-8 CSV: the header, then one row per sample; a missing cell is
     * empty, a discrete cell is its category label (quoted where RFC 4180 needs it), and a
     * number is the shortest decimal that reads back to the same double
     * ({@link ShortestDecimal}). Rows are assembled as bytes, so no String is made per cell, in
     * blocks formatted in parallel and written in order.
     *
     * @throws IllegalArgumentException if a category label is empty (it would read back as missing)
     */
    public static void write(OutputStream out, DataSet data) throws IOException {
        int p = data.columns();
        byte[][][] labels = new byte[p][][];
        int widest = 0;
        for (int j = 0; j < p; j++) {
            if (!data.isDiscrete(j)) {
                continue;
            }
            List<String> cats = data.variable(j).categories();
            labels[j] = new byte[cats.size()][];
            for (int c = 0; c < cats.size(); c++) {
                if (cats.get(c).isEmpty()) {
                    throw new IllegalArgumentException("column '" + data.variable(j).name()
                            + "' has an empty category label, which would read back as a missing cell");
                }
                labels[j][c] = quoted(cats.get(c));
                widest = Math.max(widest, labels[j][c].length);
            }
        }
        StringBuilder header = new StringBuilder();
        CSVPrinter printer = new CSVPrinter(header, WRITE_FORMAT);
        printer.printRecord(data.names());
        printer.flush();
        out.write(header.toString().getBytes(StandardCharsets.UTF_8));
        int rowBytes = p * (Math.max(widest, ShortestDecimal.MAX_CHARS) + 1) + 2;
        Rows rows = new Rows(data, labels);
        // Blocks of rows of about 1 MiB are formatted in parallel, a few at a time, and
        // written in order, so the file is the same for any number of threads.
        int perBlock = Math.max(1, (1 << 20) / rowBytes);
        int blocks = (data.rows() + perBlock - 1) / perBlock;
        int threads = Runtime.getRuntime().availableProcessors();
        int batch = Math.max(1, 2 * threads);
        byte[][] buffers = new byte[batch][];
        int[] used = new int[batch];
        for (int first = 0; first < blocks; first += batch) {
            int count = Math.min(batch, blocks - first);
            int from = first;
            IntStream ks = IntStream.range(0, count);
            if (threads > 1 && count > 1) {
                ks = ks.parallel();
            }
            ks.forEach(k -> {
                int r0 = (from + k) * perBlock;
                int r1 = Math.min(data.rows(), r0 + perBlock);
                if (buffers[k] == null) {
                    buffers[k] = new byte[perBlock * rowBytes];
                }
                int at = 0;
                for (int r = r0; r < r1; r++) {
                    at = rows.write(r, buffers[k], at);
                }
                used[k] = at;
            });
            for (int k = 0; k < count; k++) {
                out.write(buffers[k], 0, used[k]);
            }
        }
        out.flush();
    }

    /** Formats the rows of a data set as CSV bytes. */
    private static final class Rows {
        private final int p;
        private final double[][] numbers;
        private final int[][] codes;
        private final byte[][][] labels;

        Rows(DataSet data, byte[][][] labels) {
            this.p = data.columns();
            this.labels = labels;
            this.numbers = new double[p][];
            this.codes = new int[p][];
            for (int j = 0; j < p; j++) {
                if (data.isDiscrete(j)) {
                    codes[j] = data.discrete(j);
                } else {
                    numbers[j] = data.continuous(j);
                }
            }
        }

        /** Writes row {@code r} with its line break into {@code row} from {@code at}; returns the position after it. */
        int write(int r, byte[] row, int at) {
            int start = at;
            for (int j = 0; j < p; j++) {
                if (j > 0) {
                    row[at++] = ',';
                }
                if (codes[j] != null) {
                    int c = codes[j][r];
                    if (c != DataSet.MISSING_CODE) {
                        byte[] label = labels[j][c];
                        System.arraycopy(label, 0, row, at, label.length);
                        at += label.length;
                    }
                } else if (!Double.isNaN(numbers[j][r])) {
                    at = ShortestDecimal.write(numbers[j][r], row, at);
                }
            }
            if (at == start && p == 1) {
                // A lone empty cell would be a blank line; quotes keep it a missing cell.
                row[at++] = '"';
                row[at++] = '"';
            }
            row[at++] = '\n';
            return at;
        }
    }

    /**
     * The label as one CSV cell: in quotes (doubled inside) when it holds a comma, a quote or
     * a line break, or starts or ends with white space that the reader would drop.
     */
    static byte[] quoted(String label) {
        boolean needs = label.isEmpty() || Character.isWhitespace(label.charAt(0))
                || Character.isWhitespace(label.charAt(label.length() - 1));
        for (int i = 0; i < label.length() && !needs; i++) {
            char c = label.charAt(i);
            needs = c == ',' || c == '"' || c == '\n' || c == '\r';
        }
        String cell = needs ? '"' + label.replace("\"", "\"\"") + '"' : label;
        return cell.getBytes(StandardCharsets.UTF_8);
    }
}
