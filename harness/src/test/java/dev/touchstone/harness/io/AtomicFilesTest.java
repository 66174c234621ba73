package dev.touchstone.harness.io;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
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
}
