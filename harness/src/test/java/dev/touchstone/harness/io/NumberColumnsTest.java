package dev.touchstone.harness.io;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;

/**
 * The parallel reader of all-number files against a reference that splits each line with
 * {@link String#split} and parses each cell with {@link Double#parseDouble} (the JDK is the
 * outside check), bit for bit, on seeded random files cut into many small ranges; and the files
 * it must hand back to the general reader.
 */
class NumberColumnsTest {

    @TempDir
    Path tmp;

    private static final String[] SPECIAL = {"0", "-0", "-0.0", "4.9e-324", "2.2250738585072014E-308",
        "1.7976931348623157e308", "123456789012345678901234567890", "0.1", "1e22", "1e23", "9007199254740993", ""};

    private static String cell(UniformRandomProvider rng) {
        switch (rng.nextInt(6)) {
            case 0:
                return SPECIAL[rng.nextInt(SPECIAL.length)];
            case 1:
                return Double.toString(Double.longBitsToDouble(rng.nextLong() & 0x7FEF_FFFF_FFFF_FFFFL));
            case 2:
                return Long.toString(rng.nextLong() % 100_000);
            default:
                return ShortestDecimal.toString((rng.nextDouble() - 0.5) * Math.pow(10, rng.nextInt(9) - 4));
        }
    }

    /** The reference: the columns of {@code body}'s lines, split at commas and parsed by the JDK. */
    private static double[][] reference(List<String> lines, int p) {
        double[][] out = new double[p][lines.size()];
        for (int r = 0; r < lines.size(); r++) {
            String[] cells = lines.get(r).split(",", -1);
            for (int j = 0; j < p; j++) {
                out[j][r] = cells[j].isEmpty() ? Double.NaN : Double.parseDouble(cells[j]);
            }
        }
        return out;
    }

    private Path file(String header, List<String> lines, boolean finalNewline) throws IOException {
        Path f = tmp.resolve("d" + System.nanoTime() + ".csv");
        String body = String.join("\n", lines);
        Files.writeString(f, header + "\n" + body + (finalNewline ? "\n" : ""));
        return f;
    }

    /**
     * The line-feed count that places each range's rows, and the search for the end of a cell,
     * eight bytes at a time, against loops byte by byte (common practice as the reference), on
     * seeded random bytes rich in line feeds, commas and bytes one bit away from them (0x0B,
     * 0x8A, 0x09, 0x2D, 0xAC), of every length up to 70.
     */
    @Test
    void findsLineFeedsAndCommasAsByteByByteLoops() {
        UniformRandomProvider rng = Seeds.random(22);
        byte[] near = {'\n', 0x0B, (byte) 0x8A, 0x09, 0x00, (byte) 0xFF, '1', ',', 0x2D, (byte) 0xAC};
        for (int t = 0; t < 2000; t++) {
            int n = rng.nextInt(71);
            byte[] b = new byte[n + rng.nextInt(9)];
            for (int i = 0; i < b.length; i++) {
                b[i] = rng.nextInt(3) == 0 ? (byte) rng.nextInt(256) : near[rng.nextInt(near.length)];
            }
            int expected = 0;
            for (int i = 0; i < n; i++) {
                expected += b[i] == '\n' ? 1 : 0;
            }
            assertEquals(expected, NumberColumns.lineBreaks(b, n), "trial " + t);
            int from = n == 0 ? 0 : rng.nextInt(n + 1);
            int next = from;
            while (next < n && b[next] != ',' && b[next] != '\n') {
                next++;
            }
            assertEquals(next, NumberColumns.nextDelimiter(b, from, n), "trial " + t + " from " + from);
        }
    }

    @Test
    @DisplayName("random all-number files, cut into up to 64 ranges: the JDK's doubles, bit for bit, for 1 to 16 threads")
    void agreesWithTheJdkOnRandomFiles() throws IOException {
        UniformRandomProvider rng = Seeds.random(2210);
        for (int trial = 0; trial < 60; trial++) {
            int p = 1 + rng.nextInt(trial % 3 == 0 ? 40 : 6);
            int n = 1 + rng.nextInt(300);
            List<String> names = new ArrayList<>();
            for (int j = 0; j < p; j++) {
                names.add("x" + j);
            }
            List<String> lines = new ArrayList<>();
            for (int r = 0; r < n; r++) {
                List<String> cells = new ArrayList<>();
                for (int j = 0; j < p; j++) {
                    cells.add(cell(rng));
                }
                String line = String.join(",", cells);
                // A one-column file's last empty cell would vanish into the final line break.
                lines.add(p == 1 && line.isEmpty() ? "0" : line);
            }
            Path f = file(String.join(",", names), lines, rng.nextBoolean());
            long start = String.join(",", names).length() + 1;
            double[][] expected = reference(lines, p);
            for (int threads : new int[] {1, 3, 16}) {
                double[][] got = NumberColumns.read(f, start, p, threads, 1 + rng.nextInt(64));
                assertNotNull(got, "trial " + trial);
                for (int j = 0; j < p; j++) {
                    assertEquals(n, got[j].length, "trial " + trial + " rows");
                    for (int r = 0; r < n; r++) {
                        assertEquals(Double.doubleToRawLongBits(expected[j][r]), Double.doubleToRawLongBits(got[j][r]),
                                "trial " + trial + ", row " + r + ", column " + j + ": " + lines.get(r));
                    }
                }
            }
        }
    }

    @Test
    @DisplayName("text, quotes, spaces, CR, NaN, overflow, blank lines and ragged rows are handed back, wherever they stand")
    void handsBackWhatIsNotPlainNumbers() throws IOException {
        String[] bad = {"red,2.5", "\"1\",2", " 1,2", "1 ,2", "NaN,2", "1e400,2", "1,2,3", "", "1,2\r", "0x10,2",
            "1d,2", "1"};
        UniformRandomProvider rng = Seeds.random(2211);
        for (String b : bad) {
            for (int at : new int[] {0, 57, 199}) {
                List<String> lines = new ArrayList<>();
                for (int r = 0; r < 200; r++) {
                    lines.add(r == at ? b : (rng.nextDouble() - 0.5) + "," + rng.nextInt(9));
                }
                Path f = file("a,b", lines, true);
                assertNull(NumberColumns.read(f, 4, 2, 3, 1 + rng.nextInt(32)), "'" + b + "' on data row " + at);
            }
        }
    }

    @Test
    @DisplayName("DataCsv takes the parallel path and the general one to the same data set, kinds and checks")
    void dataCsvGivesTheSameAsTheGeneralPass() throws IOException {
        UniformRandomProvider rng = Seeds.random(2212);
        List<String> lines = new ArrayList<>();
        for (int r = 0; r < 500; r++) {
            lines.add(cell(rng) + "," + (rng.nextDouble() - 0.5) + "," + (r % 7 == 0 ? "" : Integer.toString(r % 3)));
        }
        Path plain = file("a,b,c", lines, true);
        // The same file with CR LF line ends, which the parallel path hands back to the general one.
        Path crlf = tmp.resolve("crlf.csv");
        Files.writeString(crlf, Files.readString(plain).replace("\n", "\r\n"));
        DataCsv.Result fast = DataCsv.read(plain);
        DataCsv.Result general = DataCsv.read(crlf);
        assertEquals(general.columns(), fast.columns());
        DataSet a = fast.data();
        DataSet b = general.data();
        assertEquals(b.rows(), a.rows());
        for (int j = 0; j < 3; j++) {
            for (int r = 0; r < a.rows(); r++) {
                assertEquals(Double.doubleToRawLongBits(b.continuous(j)[r]), Double.doubleToRawLongBits(a.continuous(j)[r]));
            }
        }
    }
}
