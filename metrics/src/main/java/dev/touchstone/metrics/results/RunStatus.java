package dev.touchstone.metrics.results;

import java.util.Locale;

/** How a run ended. Only {@link #OK} runs carry metric values. */
public enum RunStatus {
    /** The learner returned an estimate and it was scored. */
    OK,
    /** The learner (or scoring) threw; the message says why. */
    FAILED,
    /** The run hit its time limit. */
    TIMEOUT,
    /** The run was not attempted (for example the learner does not accept the data kind). */
    SKIPPED;

    /** The lower-case word written in files: {@code ok}, {@code failed}, {@code timeout}, {@code skipped}. */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Whether this counts as a failed run in aggregates (failed or timed out). */
    public boolean isFailure() {
        return this == FAILED || this == TIMEOUT;
    }

    /**
     * Parses a status word.
     *
     * @throws IllegalArgumentException naming the word and the allowed words
     */
    public static RunStatus parse(String word) {
        if (word != null) {
            for (RunStatus s : values()) {
                if (s.word().equals(word.trim().toLowerCase(Locale.ROOT))) {
                    return s;
                }
            }
        }
        throw new IllegalArgumentException("unknown run status '" + word + "' (allowed: ok, failed, timeout, skipped)");
    }
}
