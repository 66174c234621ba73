package dev.touchstone.harness.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Arrays;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.stream.IntStream;

/**
 * The fast path of the data reader: the rows of a file in which every cell is a plain number
 * or empty, parsed in parallel into columns. The rows after the header are cut into byte
 * ranges; each range holds the records that start in it, so a worker skips the partial line
 * it starts in (its neighbour reads that one to its end). Each range is parsed into columns of
 * its own, then the columns are joined in file order, so the result does not depend on the
 * number of threads or their timing.
 *
 * <p>It gives up, returning null, at the first cell that is not a number of the data grammar
 * or empty (text, quotes, spaces, NaN, a number too large for a double), at a carriage return,
 * and at a row with another number of cells than the header. Because a quote can only stand
 * inside a cell of this naive split, a file with any quoted cell is always handed back, so
 * cutting at line breaks is never fooled by a line break inside quotes. The caller then reads
 * the file with the general reader, which gives every kind, label and one-line message.
 *
 * <p>Memory: the values twice at the join (the ranges' columns and the joined ones), plus one
 * 1 MiB buffer per worker. Cost: one pass over the bytes, shared among the threads.
 */
final class NumberColumns {

    /** Ranges are at least this long, so a small file takes one range. */
    private static final long MIN_RANGE = 4L << 20;
    private static final int BUFFER = 1 << 20;

    private NumberColumns() {
    }

    /**
     * The columns of the file's rows from byte {@code dataStart} on, with {@code p} cells per
     * row, or null when some cell is not a plain number or empty (or a row has another number of
     * cells). Empty cells are NaN.
     */
    static double[][] read(Path file, long dataStart, int p, int threads) throws IOException {
        return read(file, dataStart, p, threads, MIN_RANGE);
    }

    /** As {@link #read(Path, long, int, int)}, with ranges of at least {@code minRange} bytes (tests cut small files). */
    static double[][] read(Path file, long dataStart, int p, int threads, long minRange) throws IOException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            long size = ch.size();
            long length = size - dataStart;
            if (length <= 0) {
                return null;
            }
            int ranges = (int) Math.max(1, Math.min(4L * Math.max(1, threads), length / minRange));
            AtomicBoolean failed = new AtomicBoolean();
            IntStream ks = IntStream.range(0, ranges);
            if (threads > 1 && ranges > 1) {
                ks = ks.parallel();
            }
            Range[] parts;
            try {
                parts = ks.mapToObj(k -> {
                    long from = dataStart + length * k / ranges;
                    long to = dataStart + length * (k + 1) / ranges;
                    try {
                        return new Range(ch, p, size, failed).parse(from, from == dataStart, to);
                    } catch (IOException e) {
                        throw new UncheckedIOException(e);
                    }
                }).toArray(Range[]::new);
            } catch (UncheckedIOException e) {
                throw e.getCause();
            }
            if (failed.get()) {
                return null;
            }
            return join(parts, p);
        }
    }

    private static double[][] join(Range[] parts, int p) {
        long total = 0;
        for (Range r : parts) {
            total += r.rows;
        }
        if (total == 0 || total > Integer.MAX_VALUE - 8) {
            return null;
        }
        int n = (int) total;
        double[][] out = new double[p][];
        for (int j = 0; j < p; j++) {
            if (parts.length == 1 && parts[0].columns[j].length == n) {
                // One range sized exactly: its column is the result.
                out[j] = parts[0].columns[j];
                continue;
            }
            double[] column = new double[n];
            int at = 0;
            for (Range r : parts) {
                if (r.rows > 0) {
                    System.arraycopy(r.columns[j], 0, column, at, r.rows);
                    at += r.rows;
                }
            }
            out[j] = column;
        }
        for (Range r : parts) {
            r.columns = null;
        }
        return out;
    }

    /** One byte range's records, read through a buffer of its own. */
    private static final class Range {
        private final FileChannel ch;
        private final int p;
        private final long size;
        private final AtomicBoolean failed;
        private byte[] buf = new byte[BUFFER];
        private int pos;
        private int limit;
        /** The file position of {@code buf[0]}. */
        private long base;
        double[][] columns;
        int rows;

        Range(FileChannel ch, int p, long size, AtomicBoolean failed) {
            this.ch = ch;
            this.p = p;
            this.size = size;
            this.failed = failed;
        }

        /** Parses the records that start in [from, to); {@code atRecord} when {@code from} starts one. */
        Range parse(long from, boolean atRecord, long to) throws IOException {
            base = atRecord ? from : from - 1;
            limit = 0;
            pos = 0;
            fill();
            if (!atRecord) {
                // Skip to the first byte after a line break at or after from - 1.
                while (true) {
                    while (pos < limit && buf[pos] != '\n') {
                        pos++;
                    }
                    if (pos < limit) {
                        pos++;
                        break;
                    }
                    if (!fill()) {
                        return this;
                    }
                }
            }
            int capacity = 0;
            while (base + pos < to && base + pos < size) {
                if (rows == capacity) {
                    capacity = grow(capacity, to);
                }
                if (!record() || (rows & 1023) == 0 && failed.get()) {
                    failed.set(true);
                    return this;
                }
            }
            return this;
        }

        /** Room for more rows: at first for the range's length at this row's length (plus 10 %), then half again. */
        private int grow(int capacity, long to) throws IOException {
            int next;
            if (capacity == 0) {
                int lineEnd = pos;
                while (true) {
                    while (lineEnd < limit && buf[lineEnd] != '\n') {
                        lineEnd++;
                    }
                    if (lineEnd < limit || !more()) {
                        break;
                    }
                    lineEnd = pos;
                }
                long rowBytes = Math.max(1, lineEnd - pos + 1);
                next = (int) Math.min(Integer.MAX_VALUE - 8, 16 + (long) (1.1 * (to - base - pos) / rowBytes));
                columns = new double[p][next];
                return next;
            }
            next = (int) Math.min(Integer.MAX_VALUE - 8, capacity + (long) capacity / 2 + 16);
            for (int j = 0; j < p; j++) {
                columns[j] = Arrays.copyOf(columns[j], next);
            }
            return next;
        }

        /**
         * Parses one record at {@code pos} into row {@code rows}; false when a cell is not a
         * plain number or empty, or the record has another number of cells.
         */
        private boolean record() throws IOException {
            int row = rows;
            for (int j = 0; j < p; j++) {
                int s = pos;
                int i = s;
                while (true) {
                    byte[] b = buf;
                    int n = limit;
                    while (i < n && b[i] != ',' && b[i] != '\n') {
                        i++;
                    }
                    if (i < n || base + n >= size) {
                        break;
                    }
                    int shift = pos;
                    if (!more()) {
                        break;
                    }
                    s -= shift - pos;
                    i -= shift - pos;
                }
                byte[] b = buf;
                boolean atEnd = i == limit;
                boolean last = j == p - 1;
                if (atEnd ? !last : (b[i] == '\n') != last) {
                    return false;
                }
                if (s == i) {
                    columns[j][row] = Double.NaN;
                } else {
                    double v = DecimalToDouble.parse(b, s, i);
                    if (Double.isNaN(v) || Double.isInfinite(v)) {
                        return false;
                    }
                    columns[j][row] = v;
                }
                // At the end of the file after a comma, the next cell starts and ends at the end.
                pos = atEnd ? i : i + 1;
            }
            rows++;
            return true;
        }

        /** Keeps the bytes from {@code pos} on and reads more; false at the end of the file. */
        private boolean more() throws IOException {
            if (pos > 0) {
                System.arraycopy(buf, pos, buf, 0, limit - pos);
                base += pos;
                limit -= pos;
                pos = 0;
            }
            if (limit == buf.length) {
                buf = Arrays.copyOf(buf, buf.length * 2);
            }
            return fill();
        }

        /** Reads into the free end of the buffer; false when nothing more could be read. */
        private boolean fill() throws IOException {
            long at = base + limit;
            if (at >= size) {
                return false;
            }
            int r = ch.read(ByteBuffer.wrap(buf, limit, buf.length - limit), at);
            if (r <= 0) {
                return false;
            }
            limit += r;
            return true;
        }
    }
}
