package dev.touchstone.harness.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
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
 * it starts in (its neighbour reads that one to its end). A first pass counts the line feeds of
 * every range, which gives the row each range starts at; the second parses each range straight
 * into its rows of the final columns, so the result does not depend on the number of threads or
 * their timing, and no value is copied.
 *
 * <p>It gives up, returning null, at the first cell that is not a number of the data grammar
 * or empty (text, quotes, spaces, NaN, a number too large for a double), at a carriage return,
 * and at a row with another number of cells than the header. Because a quote can only stand
 * inside a cell of this naive split, a file with any quoted cell is always handed back, so
 * cutting at line breaks is never fooled by a line break inside quotes. The caller then reads
 * the file with the general reader, which gives every kind, label and one-line message.
 *
 * <p>Memory: the values once, plus one 1 MiB buffer per worker. Cost: two passes over the bytes
 * (counting line feeds eight bytes at a time, then parsing), shared among the threads.
 */
final class NumberColumns {

    /** Ranges are at least this long, so a small file takes one range. */
    private static final long MIN_RANGE = 4L << 20;
    private static final int BUFFER = 1 << 20;
    private static final VarHandle LITTLE_ENDIAN_LONG =
            MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final long COMMAS = 0x2C2C2C2C2C2C2C2CL;
    private static final long LINE_FEEDS = 0x0A0A0A0A0A0A0A0AL;

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
            long[] from = new long[ranges + 1];
            for (int k = 0; k <= ranges; k++) {
                from[k] = dataStart + length * k / ranges;
            }
            boolean parallel = threads > 1 && ranges > 1;
            // First the records each range holds, so that every range can parse straight into
            // its place in the final columns: no join copy, and the values are allocated once
            // (a copy and a second allocation of every value cost more than this pass).
            long[] first = new long[ranges + 1];
            long[] counts = inParallel(parallel, ranges, k -> {
                long lo = k == 0 ? dataStart : from[k] - 1;
                return (k == 0 ? 1 : 0) + countLineBreaks(ch, lo, Math.min(from[k + 1], size) - 1);
            });
            for (int k = 0; k < ranges; k++) {
                first[k + 1] = first[k] + counts[k];
            }
            if (first[ranges] == 0 || first[ranges] > Integer.MAX_VALUE - 8) {
                return null;
            }
            double[][] columns = new double[p][(int) first[ranges]];
            AtomicBoolean failed = new AtomicBoolean();
            inParallel(parallel, ranges, k -> {
                Range r = new Range(ch, p, size, failed, columns, (int) first[k], (int) first[k + 1]);
                r.parse(from[k], k == 0, from[k + 1]);
                if (r.row != r.end) {
                    failed.set(true);
                }
                return 0;
            });
            return failed.get() ? null : columns;
        }
    }

    /** One step per range, returning a count. */
    private interface RangeStep {
        long run(int k) throws IOException;
    }

    /** Runs {@code step} for ranges 0 to {@code ranges - 1}, in parallel if asked, and gives their counts. */
    private static long[] inParallel(boolean parallel, int ranges, RangeStep step) throws IOException {
        IntStream ks = IntStream.range(0, ranges);
        if (parallel) {
            ks = ks.parallel();
        }
        try {
            return ks.mapToLong(k -> {
                try {
                    return step.run(k);
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            }).toArray();
        } catch (UncheckedIOException e) {
            throw e.getCause();
        }
    }

    /** The number of line feeds in the file's bytes [lo, hi). */
    static long countLineBreaks(FileChannel ch, long lo, long hi) throws IOException {
        byte[] buf = new byte[(int) Math.max(0, Math.min(BUFFER, hi - lo))];
        long count = 0;
        long at = lo;
        while (at < hi) {
            int r = ch.read(ByteBuffer.wrap(buf, 0, (int) Math.min(buf.length, hi - at)), at);
            if (r <= 0) {
                break;
            }
            count += lineBreaks(buf, r);
            at += r;
        }
        return count;
    }

    /**
     * The first {@code i' >= i} below {@code n} with a comma or line feed at {@code b[i']}, or
     * {@code n}; eight bytes at a time.
     */
    static int nextDelimiter(byte[] b, int i, int n) {
        for (; i + 8 <= n; i += 8) {
            long v = (long) LITTLE_ENDIAN_LONG.get(b, i);
            long found = zeroBytes(v ^ COMMAS) | zeroBytes(v ^ LINE_FEEDS);
            if (found != 0) {
                // Little-endian: the lowest marked byte is the first in the file.
                return i + (Long.numberOfTrailingZeros(found) >>> 3);
            }
        }
        while (i < n && b[i] != ',' && b[i] != '\n') {
            i++;
        }
        return i;
    }

    /**
     * The high bit of each byte of {@code v} that is zero, exactly: the sum cannot carry out of
     * a byte, so no byte marks another (Hacker's Delight, section 6-1).
     */
    private static long zeroBytes(long v) {
        return ~(((v & 0x7F7F7F7F7F7F7F7FL) + 0x7F7F7F7F7F7F7F7FL) | v | 0x7F7F7F7F7F7F7F7FL);
    }

    /** The number of line feeds in {@code b[0, n)}, eight bytes at a time. */
    static int lineBreaks(byte[] b, int n) {
        int count = 0;
        int i = 0;
        for (; i + 8 <= n; i += 8) {
            count += Long.bitCount(zeroBytes((long) LITTLE_ENDIAN_LONG.get(b, i) ^ LINE_FEEDS));
        }
        for (; i < n; i++) {
            if (b[i] == '\n') {
                count++;
            }
        }
        return count;
    }

    /** One byte range's records, read through a buffer of its own. */
    private static final class Range {
        private final FileChannel ch;
        private final int p;
        private final long size;
        private final AtomicBoolean failed;
        private final double[][] columns;
        /** The row after this range's last, as counted. */
        final int end;
        private byte[] buf = new byte[BUFFER];
        private int pos;
        private int limit;
        /** The file position of {@code buf[0]}. */
        private long base;
        /** The row the next record goes to. */
        int row;

        Range(FileChannel ch, int p, long size, AtomicBoolean failed, double[][] columns, int row, int end) {
            this.ch = ch;
            this.p = p;
            this.size = size;
            this.failed = failed;
            this.columns = columns;
            this.row = row;
            this.end = end;
        }

        /** Parses the records that start in [from, to); {@code atRecord} when {@code from} starts one. */
        void parse(long from, boolean atRecord, long to) throws IOException {
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
                        return;
                    }
                }
            }
            int checked = 0;
            while (base + pos < to && base + pos < size) {
                // More records than counted cannot happen; refuse rather than write past the range.
                if (row == end || !record() || (++checked & 1023) == 0 && failed.get()) {
                    failed.set(true);
                    return;
                }
            }
        }

        /**
         * Parses one record at {@code pos} into row {@code row}; false when a cell is not a
         * plain number or empty, or the record has another number of cells.
         */
        private boolean record() throws IOException {
            for (int j = 0; j < p; j++) {
                int s = pos;
                int i = s;
                while (true) {
                    byte[] b = buf;
                    int n = limit;
                    i = nextDelimiter(b, i, n);
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
            row++;
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
