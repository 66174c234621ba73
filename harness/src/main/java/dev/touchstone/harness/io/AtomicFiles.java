package dev.touchstone.harness.io;

import java.io.BufferedOutputStream;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Writes a file whole or not at all: the content goes to a temporary file in the same
 * folder, is forced to the disk, and is then renamed over the target in one atomic step,
 * after which the folder itself is synced so the rename survives a crash (the usual POSIX
 * recipe; common practice). A reader therefore sees the old file or the new one, never a
 * torn one. If writing fails, the temporary file is removed and the target is untouched.
 * Cost: one extra fsync of the file and one of the folder per write.
 *
 * <p>The temporary file is created with a plain {@code CREATE_NEW} open, so the file gets the
 * permissions the user's umask gives any new file ({@code Files.createTempFile} would force
 * owner-only access, 0600, on POSIX systems, and the rename would carry that over).
 */
public final class AtomicFiles {

    /** What writes the content of a text file. */
    @FunctionalInterface
    public interface TextBody {
        void writeTo(Writer out) throws IOException;
    }

    /** What writes the content of a binary file. */
    @FunctionalInterface
    public interface ByteBody {
        void writeTo(OutputStream out) throws IOException;
    }

    private static final java.security.SecureRandom RANDOM = new java.security.SecureRandom();

    private AtomicFiles() {
    }

    /** Writes UTF-8 text produced by {@code body} to {@code target}, atomically. */
    public static void writeText(Path target, TextBody body) throws IOException {
        writeBytes(target, out -> {
            Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8));
            body.writeTo(w);
            w.flush();
        });
    }

    /** Writes {@code text} as UTF-8 to {@code target}, atomically. */
    public static void writeString(Path target, String text) throws IOException {
        writeText(target, w -> w.write(text));
    }

    /** Writes the bytes produced by {@code body} to {@code target}, atomically. */
    public static void writeBytes(Path target, ByteBody body) throws IOException {
        Path absolute = target.toAbsolutePath();
        Path folder = absolute.getParent();
        Files.createDirectories(folder);
        Path temp = folder.resolve("." + absolute.getFileName() + "." + Long.toUnsignedString(RANDOM.nextLong(), 36)
                + ".partial");
        boolean moved = false;
        // CREATE_NEW fails if the name is taken, so a writer never writes into (or removes) a file it did not create.
        FileChannel opened = FileChannel.open(temp, StandardOpenOption.WRITE, StandardOpenOption.CREATE_NEW);
        try {
            try (FileChannel channel = opened) {
                // Closing the stream would close the channel before force(), so close only flushes.
                BufferedOutputStream out = new BufferedOutputStream(Channels.newOutputStream(channel)) {
                    @Override
                    public void close() throws IOException {
                        flush();
                    }
                };
                body.writeTo(out);
                out.flush();
                channel.force(true);
            }
            try {
                Files.move(temp, absolute, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                throw new IOException("cannot replace " + target + " atomically on this file system", e);
            }
            moved = true;
            syncFolder(folder);
        } finally {
            if (!moved) {
                Files.deleteIfExists(temp);
            }
        }
    }

    private static void syncFolder(Path folder) {
        // Linux and macOS allow opening a folder to fsync it; elsewhere this is best effort.
        try (FileChannel dir = FileChannel.open(folder, StandardOpenOption.READ)) {
            dir.force(true);
        } catch (IOException | UnsupportedOperationException e) {
            // the rename has happened; only its durability across a power cut is not guaranteed
        }
    }
}
