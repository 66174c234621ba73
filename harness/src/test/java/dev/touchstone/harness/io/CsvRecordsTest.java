package dev.touchstone.harness.io;

import dev.touchstone.core.random.Seeds;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The record splitter against Commons CSV 1.x (a general-purpose library) with the format the
 * data reader used before: RFC 4180, surrounding spaces ignored, empty lines kept.
 */
class CsvRecordsTest {

    private static final CSVFormat REFERENCE = CSVFormat.RFC4180.builder()
            .setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(false).get();
    private static final String ALPHABET = "a1,\"  \n\r\té.";

    @TempDir
    Path dir;

    /** Records as (line, cells) from Commons CSV, or null if it refuses the text. */
    private static List<String> reference(String text) {
        List<String> out = new ArrayList<>();
        try (CSVParser parser = CSVParser.parse(new StringReader(text), REFERENCE)) {
            for (CSVRecord r : parser) {
                long line = 1 + text.substring(0, (int) r.getCharacterPosition()).chars().filter(c -> c == '\n').count();
                out.add(line + ":" + String.join("|", r.toList()));
            }
        } catch (IOException | UncheckedIOException e) {
            return null;
        }
        return out;
    }

    private List<String> ours(Path file) {
        try {
            return readAll(file);
        } catch (FileFormatException e) {
            return null;
        }
    }

    private static List<String> readAll(Path file) {
        List<String> out = new ArrayList<>();
        try (CsvRecords in = new CsvRecords(file)) {
            while (in.next()) {
                List<String> cells = new ArrayList<>();
                for (int k = 0; k < in.cells(); k++) {
                    cells.add(in.text(k));
                }
                out.add(in.line() + ":" + String.join("|", cells));
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out;
    }

    @Test
    void agreesWithCommonsCsvOnRandomTexts() throws IOException {
        UniformRandomProvider rng = Seeds.random(2203);
        Path f = dir.resolve("r.csv");
        int refused = 0;
        for (int i = 0; i < 2_000; i++) {
            StringBuilder sb = new StringBuilder();
            int len = rng.nextInt(25);
            for (int c = 0; c < len; c++) {
                sb.append(ALPHABET.charAt(rng.nextInt(ALPHABET.length())));
            }
            String text = sb.toString();
            Files.writeString(f, text, StandardCharsets.UTF_8);
            List<String> expected = reference(text);
            refused += expected == null ? 1 : 0;
            assertEquals(expected, ours(f), () -> "text [" + text.replace("\n", "\\n").replace("\r", "\\r") + "]");
        }
        assertTrue(refused > 100 && refused < 1_950, "both accepted and refused texts were drawn: " + refused);
    }

    @Test
    void recordsLongerThanTheBufferAndSplitAcrossReads() throws IOException {
        // 1.5 MiB records force the buffer to grow; the quoted cell with a line break crosses reads.
        String big = "x".repeat(3 << 19);
        String text = "a,b\n" + big + ",\"q\n" + big + "\"\n1,2";
        Path f = dir.resolve("big.csv");
        Files.writeString(f, text, StandardCharsets.UTF_8);
        try (CsvRecords in = new CsvRecords(f)) {
            assertTrue(in.next());
            assertTrue(in.next());
            assertEquals(2, in.line());
            assertEquals(big, in.text(0));
            assertEquals("q\n" + big, in.text(1));
            assertTrue(in.next());
            assertEquals(4, in.line());
            assertEquals("2", in.text(1));
            assertTrue(!in.next());
        }
    }

    @Test
    void badUtf8NamesItsLineAndUnclosedQuotesTheirs() throws IOException {
        Path f = dir.resolve("latin.csv");
        Files.write(f, new byte[] {'a', '\n', '"', 'x', '\n', (byte) 0xE9, '"', '\n'});
        String m = assertThrows(FileFormatException.class, () -> {
            try (CsvRecords in = new CsvRecords(f)) {
                in.next();
                in.next();
                in.text(0);
            }
        }).getMessage();
        assertTrue(m.endsWith("latin.csv, line 3: not valid UTF-8 text (save the file as UTF-8)"), m);
        Path g = dir.resolve("open.csv");
        Files.writeString(g, "a,b\n1,2\n3,\"4\n5,6\n");
        m = assertThrows(FileFormatException.class, () -> readAll(g)).getMessage();
        assertTrue(m.endsWith("open.csv, line 3: not valid CSV: a quoted cell that starts on this line has no closing quote"), m);
    }
}
