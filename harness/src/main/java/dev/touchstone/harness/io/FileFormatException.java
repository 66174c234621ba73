package dev.touchstone.harness.io;

import dev.touchstone.harness.BadInputException;

import java.nio.file.Path;

/**
 * A file that cannot be read as its format requires. The message is one line naming the
 * file, the place in it (line, column, field or edge) and what is wrong, so the command
 * line prints it as {@code error: …} with exit status 2.
 */
public final class FileFormatException extends BadInputException {
    private static final long serialVersionUID = 1L;

    private final transient Path file;

    /**
     * @param file   the file being read
     * @param place  where in it, e.g. {@code line 4, column 'age'}; null or empty for the whole file
     * @param detail what is wrong
     */
    public FileFormatException(Path file, String place, String detail) {
        super(file + (place == null || place.isEmpty() ? "" : ", " + place) + ": " + detail);
        this.file = file;
    }

    /** The file that was being read. */
    public Path file() {
        return file;
    }
}
