package dev.touchstone.harness.execution;

import dev.touchstone.harness.io.AtomicFiles;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;

/** Writes an output file whole or not at all (through {@link AtomicFiles}), turning I/O errors into one message. */
final class OutputFiles {

    private OutputFiles() {
    }

    static void write(Path target, String text) {
        try {
            AtomicFiles.writeString(target, text);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + e.getMessage(), e);
        }
    }
}
