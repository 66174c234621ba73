package dev.touchstone.harness.execution;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.util.List;

/**
 * How values are written into the study's CSV files, in one place: undefined values as an
 * empty cell (never 0, never "NaN"), whole numbers without a decimal point, other numbers
 * in their shortest exact form, one header row, {@code \n} line ends. Also used by the
 * calibration's {@code calibration-runs.csv}, so every CSV file the tool writes looks alike.
 */
public final class Cells {

    static final CSVFormat FORMAT = CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get();

    private Cells() {
    }

    /** A number's cell: empty when undefined or not finite, whole numbers without a decimal point. */
    public static String number(Double v) {
        if (v == null || !Double.isFinite(v)) {
            return "";
        }
        double d = v;
        if (d == Math.rint(d) && Math.abs(d) < 1e15) {
            return Long.toString((long) d);
        }
        return Double.toString(d);
    }

    static String number(Long v) {
        return v == null ? "" : Long.toString(v);
    }

    static String number(Integer v) {
        return v == null ? "" : Integer.toString(v);
    }

    /** A text's cell: empty for null (quoting is the CSV printer's). */
    public static String text(String s) {
        return s == null ? "" : s;
    }

    /** Renders a header and rows to CSV text. */
    public static String csv(List<String> header, List<List<String>> rows) {
        StringWriter w = new StringWriter();
        try (CSVPrinter p = new CSVPrinter(w, FORMAT)) {
            p.printRecord(header);
            for (List<String> r : rows) {
                p.printRecord(r);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return w.toString();
    }
}
