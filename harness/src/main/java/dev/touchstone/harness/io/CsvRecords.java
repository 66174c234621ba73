package dev.touchstone.harness.io;

import java.io.Closeable;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;

/**
 * Splits a CSV file (RFC 4180) into records straight from its bytes, so that a reader can
 * parse numbers in place and make Strings only for text. Cells are separated by commas,
 * records by LF, CR LF or CR; a cell in double quotes may hold commas, line breaks and
 * doubled quotes; spaces around a cell are dropped; a blank line is a record of one empty
 * cell; a leading UTF-8 byte-order mark is skipped. These are the rules of Commons CSV's
 * RFC 4180 format with surrounding spaces ignored, which the data reader used before and
 * which the tests compare against. One difference: only ASCII white space may stand between
 * a quote and the comma next to it.
 *
 * <p>Text is decoded strictly as UTF-8 when asked for ({@link #text}); a malformed byte is
 * bad input naming the file and its line. Memory: a buffer that holds the longest record
 * (up to 1 MiB unless a record is longer); cost: one pass over the bytes.
 */
final class CsvRecords implements Closeable {

    private static final int NEED_MORE = -1;
    private static final int NO_RECORD = -2;

    private final Path file;
    private final InputStream in;
    private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
            .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
    private byte[] buf;
    private int pos;
    private int limit;
    private boolean eof;
    private long consumedBefore;
    private long line = 1;
    private long recordLine;
    private int recordStart;
    private int cells;
    private int[] starts = new int[64];
    private int[] ends = new int[64];
    private byte[] flags = new byte[64];
    private int recordNewlines;

    private static final byte QUOTED = 1;
    private static final byte ESCAPED = 2;

    CsvRecords(Path file) {
        InputFiles.check(file);
        this.file = file;
        try {
            this.in = Files.newInputStream(file);
            // A small file gets a small buffer; it grows if a record needs more.
            this.buf = new byte[(int) Math.max(64, Math.min(1 << 20, Files.size(file) + 1))];
            fill();
            if (limit - pos >= 3 && buf[0] == (byte) 0xEF && buf[1] == (byte) 0xBB && buf[2] == (byte) 0xBF) {
                pos = 3;
            }
        } catch (IOException e) {
            throw InputFiles.unreadable(file, e);
        }
    }

    /** Moves to the next record; false at the end of the file. */
    boolean next() {
        while (true) {
            int end = scan();
            if (end >= 0) {
                recordStart = pos;
                recordLine = line;
                line += recordNewlines;
                pos = end;
                return true;
            }
            if (end == NO_RECORD) {
                return false;
            }
            try {
                fill();
            } catch (IOException e) {
                throw InputFiles.unreadable(file, e);
            }
        }
    }

    /** The line on which the current record starts (1-based). */
    long line() {
        return recordLine;
    }

    /** The number of cells of the current record. */
    int cells() {
        return cells;
    }

    /** The buffer that holds the current record (valid until the next call of {@link #next}). */
    byte[] bytes() {
        return buf;
    }

    /** Where cell {@code k}'s content starts in {@link #bytes} (inside the quotes for a quoted cell). */
    int start(int k) {
        return starts[k];
    }

    /** Where cell {@code k}'s content ends (exclusive). */
    int end(int k) {
        return ends[k];
    }

    /** Whether cell {@code k} was in quotes. */
    boolean quoted(int k) {
        return (flags[k] & QUOTED) != 0;
    }

    /** Whether cell {@code k} is empty (written as nothing or as {@code ""}). */
    boolean isEmpty(int k) {
        return starts[k] == ends[k];
    }

    /** How many bytes of the file lie before the end of the current record. */
    long consumed() {
        return consumedBefore + pos;
    }

    /**
     * The text of cell {@code k}: decoded, doubled quotes undone for a quoted cell, white
     * space (as {@link Character#isWhitespace}) stripped from both ends of an unquoted one.
     */
    String text(int k) {
        int s = starts[k];
        int e = ends[k];
        boolean ascii = true;
        for (int i = s; i < e; i++) {
            if (buf[i] < 0) {
                ascii = false;
                break;
            }
        }
        String t;
        if (ascii) {
            t = new String(buf, s, e - s, StandardCharsets.ISO_8859_1);
        } else {
            t = decode(s, e);
        }
        if ((flags[k] & ESCAPED) != 0) {
            t = t.replace("\"\"", "\"");
        }
        return (flags[k] & QUOTED) != 0 ? t : t.strip();
    }

    private String decode(int s, int e) {
        CharBuffer out = CharBuffer.allocate(e - s);
        ByteBuffer bytes = ByteBuffer.wrap(buf, s, e - s);
        decoder.reset();
        CoderResult r = decoder.decode(bytes, out, true);
        if (r.isError()) {
            long at = recordLine;
            for (int i = recordStart; i < bytes.position(); i++) {
                at += buf[i] == '\n' ? 1 : 0;
            }
            throw new FileFormatException(file, "line " + at, "not valid UTF-8 text (save the file as UTF-8)");
        }
        decoder.flush(out);
        out.flip();
        return out.toString();
    }

    /** White space that Commons CSV drops around a cell, among the bytes below 128 (not CR or LF). */
    private static boolean isSpace(byte c) {
        return c == ' ' || c == '\t' || c == 0x0B || c == 0x0C || (c >= 0x1C && c <= 0x1F);
    }

    /**
     * Scans one record from {@code pos}: its end, or {@link #NEED_MORE} when the buffer ends
     * first, or {@link #NO_RECORD} at the end of the file.
     */
    private int scan() {
        byte[] b = buf;
        int i = pos;
        int n = limit;
        cells = 0;
        recordNewlines = 0;
        if (i == n) {
            return eof ? NO_RECORD : NEED_MORE;
        }
        while (true) {
            while (i < n && isSpace(b[i])) {
                i++;
            }
            if (i == n && !eof) {
                return NEED_MORE;
            }
            int start;
            int end;
            byte flag = 0;
            if (i < n && b[i] == '"') {
                long quoteLine = line + recordNewlines;
                i++;
                start = i;
                while (true) {
                    if (i == n) {
                        if (!eof) {
                            return NEED_MORE;
                        }
                        throw new FileFormatException(file, "line " + quoteLine,
                                "not valid CSV: a quoted cell that starts on this line has no closing quote");
                    }
                    byte c = b[i];
                    if (c == '"') {
                        if (i + 1 == n && !eof) {
                            return NEED_MORE;
                        }
                        if (i + 1 < n && b[i + 1] == '"') {
                            flag = ESCAPED;
                            i += 2;
                            continue;
                        }
                        end = i;
                        i++;
                        break;
                    }
                    if (c == '\n') {
                        recordNewlines++;
                    }
                    i++;
                }
                flag |= QUOTED;
                while (i < n && isSpace(b[i])) {
                    i++;
                }
                if (i == n && !eof) {
                    return NEED_MORE;
                }
                if (i < n && b[i] != ',' && b[i] != '\n' && b[i] != '\r') {
                    throw new FileFormatException(file, "line " + (line + recordNewlines), "not valid CSV: after a"
                            + " closing quote comes '" + (char) (b[i] & 0xFF) + "' (expected a comma or the end of the line)");
                }
            } else {
                start = i;
                while (i < n && b[i] != ',' && b[i] != '\n' && b[i] != '\r') {
                    i++;
                }
                if (i == n && !eof) {
                    return NEED_MORE;
                }
                end = i;
                while (end > start && isSpace(b[end - 1])) {
                    end--;
                }
            }
            addCell(start, end, flag);
            if (i == n) {
                return i;
            }
            byte c = b[i];
            if (c == ',') {
                i++;
                if (i == n && eof) {
                    addCell(i, i, (byte) 0);
                    return i;
                }
                continue;
            }
            if (c == '\n') {
                recordNewlines++;
                return i + 1;
            }
            // CR, alone or before LF
            if (i + 1 == n && !eof) {
                return NEED_MORE;
            }
            if (i + 1 < n && b[i + 1] == '\n') {
                recordNewlines++;
                return i + 2;
            }
            return i + 1;
        }
    }

    private void addCell(int start, int end, byte flag) {
        if (cells == starts.length) {
            starts = Arrays.copyOf(starts, cells * 2);
            ends = Arrays.copyOf(ends, cells * 2);
            flags = Arrays.copyOf(flags, cells * 2);
        }
        starts[cells] = start;
        ends[cells] = end;
        flags[cells] = flag;
        cells++;
    }

    /** Keeps the bytes from {@code pos} on, then reads more (growing the buffer if it is full). */
    private void fill() throws IOException {
        if (eof) {
            return;
        }
        if (pos > 0) {
            System.arraycopy(buf, pos, buf, 0, limit - pos);
            consumedBefore += pos;
            limit -= pos;
            pos = 0;
        }
        if (limit == buf.length) {
            buf = Arrays.copyOf(buf, buf.length * 2);
        }
        int r = in.read(buf, limit, buf.length - limit);
        if (r < 0) {
            eof = true;
        } else {
            limit += r;
        }
    }

    @Override
    public void close() throws IOException {
        in.close();
    }
}
