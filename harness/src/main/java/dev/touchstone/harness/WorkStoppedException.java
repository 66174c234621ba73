package dev.touchstone.harness;

/**
 * Work that stopped for a reason outside the tool and outside the input, such as a cluster job
 * whose worker died: the message already says what happened and what to do (usually "run again
 * to resume"), so the command line prints it as it is with exit status 1, not as an unexpected
 * fault of the tool to report.
 */
public final class WorkStoppedException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    /** A stop with this one-line message and its cause. */
    public WorkStoppedException(String message, Throwable cause) {
        super(message, cause);
    }
}
