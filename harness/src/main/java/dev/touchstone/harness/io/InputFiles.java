package dev.touchstone.harness.io;

import java.io.FilterReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Opens the files a user names (data, graphs, knowledge, studies, learners files) so that
 * every way of not being able to read one is bad input with one line naming the file: no
 * such file, a folder where a file is expected, no permission, and text that is not UTF-8
 * (with the line where decoding failed). Readers decode strictly: a malformed byte is
 * refused, never replaced. Cost: that of reading the file.
 */
public final class InputFiles {

    private InputFiles() {
    }

    /**
     * Checks that {@code file} is a readable regular file.
     *
     * @throws FileFormatException saying what is wrong and what to do
     */
    public static void check(Path file) {
        if (Files.isDirectory(file)) {
            throw new FileFormatException(file, null, "is a folder, not a file (give the file inside it)");
        }
        if (!Files.exists(file)) {
            throw new FileFormatException(file, null, "no such file (check the path)");
        }
        if (!Files.isReadable(file)) {
            throw new FileFormatException(file, null, "cannot be read (permission denied; check its permissions)");
        }
    }

    /** A strict UTF-8 reader of {@code file}, after {@link #check}; decoding errors name the file and line. */
    public static Reader reader(Path file) {
        check(file);
        try {
            var decoder = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT);
            return new Utf8Reader(file, new InputStreamReader(Files.newInputStream(file), decoder));
        } catch (IOException e) {
            throw unreadable(file, e);
        }
    }

    /** The whole text of {@code file}, strictly decoded. */
    public static String readString(Path file) {
        try (Reader r = reader(file)) {
            StringBuilder sb = new StringBuilder();
            char[] buf = new char[8192];
            int n;
            while ((n = r.read(buf)) >= 0) {
                sb.append(buf, 0, n);
            }
            return sb.toString();
        } catch (IOException e) {
            throw unreadable(file, e);
        }
    }

    /** The bytes of {@code file}, after {@link #check}. */
    public static byte[] readBytes(Path file) {
        check(file);
        try {
            return Files.readAllBytes(file);
        } catch (IOException e) {
            throw unreadable(file, e);
        }
    }

    /** Bad input for a file that could not be opened or read. */
    static FileFormatException unreadable(Path file, IOException e) {
        if (e instanceof NoSuchFileException) {
            return new FileFormatException(file, null, "no such file (check the path)");
        }
        if (e instanceof AccessDeniedException) {
            return new FileFormatException(file, null, "cannot be read (permission denied; check its permissions)");
        }
        String reason = e.getMessage() == null ? "input/output error" : e.getMessage();
        return new FileFormatException(file, null, "cannot be read (" + reason + ")");
    }

    /**
     * The line of the first byte that is not UTF-8 (the decoder reads ahead, so the reader
     * cannot tell); a newline byte is never part of a multi-byte sequence, so counting them
     * before that byte gives the line.
     */
    private static long badLine(Path file) {
        byte[] bytes = readBytes(file);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer out = CharBuffer.allocate(8192);
        var decoder = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        while (true) {
            CoderResult r = decoder.decode(in, out, true);
            if (r.isError() || r.isUnderflow()) {
                break;
            }
            out.clear();
        }
        long line = 1;
        for (int i = 0; i < in.position(); i++) {
            line += bytes[i] == '\n' ? 1 : 0;
        }
        return line;
    }

    /** Turns a decoding failure into bad input at the line reached so far. */
    private static final class Utf8Reader extends FilterReader {
        private final Path file;

        Utf8Reader(Path file, Reader in) {
            super(in);
            this.file = file;
        }

        @Override
        public int read() throws IOException {
            char[] one = new char[1];
            int n = read(one, 0, 1);
            return n < 0 ? -1 : one[0];
        }

        @Override
        public int read(char[] buf, int off, int len) throws IOException {
            int n;
            try {
                n = super.read(buf, off, len);
            } catch (CharacterCodingException e) {
                throw new FileFormatException(file, "line " + badLine(file),
                        "not valid UTF-8 text (save the file as UTF-8)");
            }
            return n;
        }
    }
}
