package dev.touchstone.harness.cli;

/**
 * Bad input or usage: the message is one line naming the file and place (file, line,
 * field) and is printed as {@code error: …} with exit status 2.
 */
public class UsageException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public UsageException(String message) {
        super(message);
    }

    public UsageException(String message, Throwable cause) {
        super(message, cause);
    }
}
