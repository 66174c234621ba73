package dev.touchstone.harness;

/**
 * Bad input: a file or value the user gave that cannot be used. The message is one line
 * naming the file and place (file, line, field, option) and what is wrong; the command line
 * prints it as {@code error: …} with exit status 2. It lives at the bottom of the harness so
 * that file formats, studies and the command line can all raise it without depending on
 * one another.
 */
public class BadInputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public BadInputException(String message) {
        super(message);
    }

    public BadInputException(String message, Throwable cause) {
        super(message, cause);
    }
}
