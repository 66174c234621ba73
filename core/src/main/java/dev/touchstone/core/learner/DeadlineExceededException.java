package dev.touchstone.core.learner;

/** Thrown by {@link RunContext#checkDeadline()} when a run's time limit has passed. */
public final class DeadlineExceededException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public DeadlineExceededException(String message) {
        super(message, null, false, false);
    }
}
