package dev.touchstone.core.learner;

/** A learner cannot work on this input (wrong data kind, missing values it refuses, …). */
public class LearnerException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public LearnerException(String message) {
        super(message);
    }

    public LearnerException(String message, Throwable cause) {
        super(message, cause);
    }
}
