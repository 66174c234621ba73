package dev.touchstone.harness.io;

import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.Set;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class AtomicFilesTest {

    @TempDir
    Path dir;

    private long filesIn(Path folder) throws IOException {
        try (Stream<Path> s = Files.list(folder)) {
            return s.count();
        }
    }

    @Test
    void writesAndReplacesWholeFiles() throws IOException {
        Path f = dir.resolve("sub/folder/out.txt");
        AtomicFiles.writeString(f, "first");
        assertEquals("first", Files.readString(f));
        AtomicFiles.writeString(f, "second, longer");
        assertEquals("second, longer", Files.readString(f));
        AtomicFiles.writeBytes(f, out -> out.write(new byte[] {1, 2, 3}));
        assertArrayEquals(new byte[] {1, 2, 3}, Files.readAllBytes(f));
        assertEquals(1, filesIn(f.getParent()), "no temporary file is left behind");
    }

    @Test
    void aFailedWriteLeavesTheOldFileAndNoTemporaryFile() throws IOException {
        Path f = dir.resolve("keep.txt");
        AtomicFiles.writeString(f, "old content");
        IOException e = assertThrows(IOException.class, () -> AtomicFiles.writeText(f, w -> {
            w.write("half of the new con");
            w.flush();
            throw new IOException("disk on fire");
        }));
        assertEquals("disk on fire", e.getMessage());
        assertEquals("old content", Files.readString(f));
        assertEquals(1, filesIn(dir));
        assertThrows(IllegalStateException.class, () -> AtomicFiles.writeText(dir.resolve("new.txt"), w -> {
            throw new IllegalStateException("bug");
        }));
        assertEquals(1, filesIn(dir), "an unchecked failure leaves nothing either");
    }

    @Test
    @DisplayName("a written file gets the permissions the umask gives any new file, not owner-only 0600")
    void honoursTheUmask() throws IOException {
        Assumptions.assumeTrue(dir.getFileSystem().supportedFileAttributeViews().contains("posix"),
                "permissions are POSIX-only");
        // A file opened the ordinary way is the reference: the kernel applies the umask to it.
        Path plain = dir.resolve("plain.txt");
        Files.writeString(plain, "x");
        Set<PosixFilePermission> expected = Files.getPosixFilePermissions(plain);
        Path atomic = dir.resolve("atomic.txt");
        AtomicFiles.writeString(atomic, "x");
        assertEquals(PosixFilePermissions.toString(expected),
                PosixFilePermissions.toString(Files.getPosixFilePermissions(atomic)));
        AtomicFiles.writeString(atomic, "replaced");
        assertEquals(PosixFilePermissions.toString(expected),
                PosixFilePermissions.toString(Files.getPosixFilePermissions(atomic)), "after a replacement too");
    }
}
