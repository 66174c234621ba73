package dev.touchstone.harness.io;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.VariableKind;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Column kinds declared beside a data file, so integer-coded columns are not read as
 * continuous by accident. A kinds file is a CSV with the header {@code column,kind} and one
 * row per column, the kind being {@code continuous} or {@code discrete}. {@code simulate}
 * writes one next to each data file: {@code data.csv} gets {@code data.kinds.csv}
 * ({@link #besideData}), which {@code learn} and {@code calibrate} read by themselves. Kinds
 * given on the command line win over the file. When nothing is declared, {@link #assumption}
 * says in one line what was assumed. Cost: linear in the files.
 */
public final class ColumnKinds {

    /** The header row, exactly. */
    public static final List<String> HEADER = List.of("column", "kind");

    private static final CSVFormat READ_FORMAT = CSVFormat.RFC4180.builder()
            .setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(true).get();
    private static final CSVFormat WRITE_FORMAT = CSVFormat.RFC4180.builder().setRecordSeparator("\n").get();

    private ColumnKinds() {
    }

    /** The kinds file that goes with a data file: {@code NAME.csv} → {@code NAME.kinds.csv}. */
    public static Path besideData(Path data) {
        String name = data.getFileName().toString();
        String stem = name.toLowerCase(Locale.ROOT).endsWith(".csv") ? name.substring(0, name.length() - 4) : name;
        return data.resolveSibling(stem + ".kinds.csv");
    }

    /** Writes the kind of every column of {@code data} to {@code file} atomically. */
    public static void write(Path file, DataSet data) throws IOException {
        AtomicFiles.writeText(file, w -> {
            CSVPrinter p = new CSVPrinter(w, WRITE_FORMAT);
            p.printRecord(HEADER);
            for (int j = 0; j < data.columns(); j++) {
                p.printRecord(data.variable(j).name(), data.isDiscrete(j) ? VariableKind.DISCRETE.word()
                        : VariableKind.CONTINUOUS.word());
            }
            p.flush();
        });
    }

    /**
     * Reads a kinds file.
     *
     * @throws FileFormatException naming the file and line at fault
     */
    public static Map<String, VariableKind> read(Path file) throws IOException {
        Map<String, VariableKind> out = new LinkedHashMap<>();
        try (LineCountingReader in = new LineCountingReader(InputFiles.reader(file));
             CSVParser parser = CSVParser.parse(in, READ_FORMAT)) {
            boolean header = true;
            for (CSVRecord rec : parser) {
                String place = "line " + in.lineOf(rec.getCharacterPosition());
                if (header) {
                    header = false;
                    if (!rec.toList().equals(HEADER)) {
                        throw new FileFormatException(file, place, "expected the header column,kind, got "
                                + String.join(",", rec.toList()));
                    }
                    continue;
                }
                if (rec.size() != 2 || rec.get(0).isEmpty()) {
                    throw new FileFormatException(file, place, "expected a column name and its kind");
                }
                VariableKind k;
                switch (rec.get(1).toLowerCase(Locale.ROOT)) {
                    case "continuous":
                        k = VariableKind.CONTINUOUS;
                        break;
                    case "discrete":
                        k = VariableKind.DISCRETE;
                        break;
                    default:
                        throw new FileFormatException(file, place, "unknown kind '" + rec.get(1)
                                + "' (allowed: continuous, discrete)");
                }
                if (out.put(rec.get(0), k) != null) {
                    throw new FileFormatException(file, place, "column '" + rec.get(0) + "' is listed twice");
                }
            }
            if (header) {
                throw new FileFormatException(file, null, "the file is empty (expected the header column,kind)");
            }
        } catch (UncheckedIOException e) {
            throw new FileFormatException(file, null, "not valid CSV: "
                    + (e.getCause() == null ? e.getMessage() : e.getCause().getMessage()));
        }
        return out;
    }

    /** The declared kinds and where they came from. */
    public record Declared(Map<String, VariableKind> kinds, String source) {
        public Declared {
            kinds = Map.copyOf(kinds);
        }

        /** Whether anything was declared. */
        public boolean isEmpty() {
            return kinds.isEmpty();
        }
    }

    /**
     * The kinds for reading {@code data}: those of {@code kindsFile} if given, else of the file
     * beside the data if there is one, then the command line's lists on top.
     *
     * @throws FileFormatException for a bad kinds file, or a column in both lists
     */
    public static Declared declared(Path data, Path kindsFile, List<String> discrete, List<String> continuous)
            throws IOException {
        Map<String, VariableKind> out = new LinkedHashMap<>();
        List<String> sources = new ArrayList<>();
        Path file = kindsFile != null ? kindsFile : besideData(data);
        if (kindsFile != null || Files.isRegularFile(file)) {
            if (!Files.isRegularFile(file)) {
                throw new FileFormatException(file, null, "no such kinds file");
            }
            out.putAll(read(file));
            sources.add(file.toString());
        }
        Map<String, VariableKind> listed = new LinkedHashMap<>();
        for (String c : discrete) {
            listed.put(c.trim(), VariableKind.DISCRETE);
        }
        for (String c : continuous) {
            if (listed.put(c.trim(), VariableKind.CONTINUOUS) != null) {
                throw new dev.touchstone.harness.BadInputException("column '" + c.trim()
                        + "' is given both --discrete and --continuous");
            }
        }
        if (!listed.isEmpty()) {
            sources.add("--discrete/--continuous");
        }
        out.putAll(listed);
        return new Declared(out, String.join(" and ", sources));
    }

    /**
     * One line saying what was assumed for the columns nobody declared, or null when every
     * column was declared: how many were read as continuous or discrete and which continuous
     * ones hold only whole numbers (codes, perhaps).
     */
    public static String assumption(DataCsv.Result read, Declared declared) {
        List<String> wholeNumbers = new ArrayList<>();
        int continuous = 0;
        int discrete = 0;
        DataSet d = read.data();
        for (int j = 0; j < d.columns(); j++) {
            if (declared.kinds().containsKey(d.variable(j).name())) {
                continue;
            }
            if (d.isDiscrete(j)) {
                discrete++;
                continue;
            }
            continuous++;
            boolean whole = true;
            for (double x : d.continuous(j)) {
                if (!Double.isNaN(x) && x != Math.rint(x)) {
                    whole = false;
                    break;
                }
            }
            if (whole) {
                wholeNumbers.add(d.variable(j).name());
            }
        }
        if (continuous + discrete == 0) {
            return null;
        }
        StringBuilder sb = new StringBuilder("kinds: ");
        sb.append(declared.isEmpty() ? "none declared" : "declared for some columns (" + declared.source() + ")");
        sb.append("; assumed ").append(continuous).append(" continuous (all values numbers) and ").append(discrete)
                .append(" discrete (text values)");
        if (!wholeNumbers.isEmpty()) {
            sb.append("; read as continuous though every value is a whole number: ")
                    .append(String.join(", ", wholeNumbers.size() > 8 ? wholeNumbers.subList(0, 8) : wholeNumbers))
                    .append(wholeNumbers.size() > 8 ? ", …" : "")
                    .append(" (declare them with --discrete or a kinds file if they are codes)");
        }
        return sb.toString();
    }
}
