package dev.touchstone.harness.cli;

import dev.touchstone.harness.BadInputException;

/**
 * Bad usage of the command line (an option or argument) or bad input met by a verb: the
 * message is one line naming the option, file or place, printed as {@code error: …} with
 * exit status 2 like every {@link BadInputException}.
 */
public class UsageException extends BadInputException {
    private static final long serialVersionUID = 1L;

    public UsageException(String message) {
        super(message);
    }

    public UsageException(String message, Throwable cause) {
        super(message, cause);
    }
}
