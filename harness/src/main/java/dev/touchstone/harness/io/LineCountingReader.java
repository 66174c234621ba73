package dev.touchstone.harness.io;

import java.io.FilterReader;
import java.io.IOException;
import java.io.Reader;
import java.util.Arrays;

/**
 * A reader that remembers where each line starts, so that a parser's character position
 * can be turned into a line number for messages, and that drops a leading UTF-8 byte-order
 * mark. Cost: one long per line read.
 */
final class LineCountingReader extends FilterReader {

    private long position;
    private long[] newlines = new long[64];
    private int count;
    private boolean started;

    LineCountingReader(Reader in) {
        super(in);
    }

    @Override
    public int read() throws IOException {
        char[] one = new char[1];
        int n = read(one, 0, 1);
        return n < 0 ? -1 : one[0];
    }

    @Override
    public int read(char[] buf, int off, int len) throws IOException {
        int n = super.read(buf, off, len);
        if (n > 0 && !started) {
            started = true;
            if (buf[off] == '\uFEFF') {
                System.arraycopy(buf, off + 1, buf, off, n - 1);
                n--;
                if (n == 0) {
                    return read(buf, off, len);
                }
            }
        }
        for (int i = 0; i < n; i++) {
            if (buf[off + i] == '\n') {
                if (count == newlines.length) {
                    newlines = Arrays.copyOf(newlines, count * 2);
                }
                newlines[count++] = position + i;
            }
        }
        if (n > 0) {
            position += n;
        }
        return n;
    }

    /** The 1-based line of the character at {@code charPosition} (counted after the byte-order mark). */
    long lineOf(long charPosition) {
        int k = Arrays.binarySearch(newlines, 0, count, charPosition);
        int before = k >= 0 ? k : -k - 1;
        return before + 1L;
    }
}
