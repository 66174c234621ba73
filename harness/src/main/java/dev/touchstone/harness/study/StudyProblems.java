package dev.touchstone.harness.study;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;

/**
 * The problems found while validating a study (or a learners file), collected so that one
 * reading reports all of them instead of stopping at the first: each independent part of the
 * file (a field, a list item, a parameter) is checked in {@link #attempt}, which records its
 * {@link StudyException} and lets the reading go on with a stand-in value. {@link #throwIfAny}
 * then raises them together, the first found first, so a command that stops at bad input
 * ({@code run}) and one that lists it ({@code check}) see the same problems in the same order.
 *
 * <p>A part that depends on a failed one is not checked (it would only repeat the first
 * problem), so the count is of independent problems. Not thread-safe: one per reading.
 */
public final class StudyProblems {

    private final List<StudyException> found = new ArrayList<>();

    /** Records a problem (all of them, if it already carries several). */
    public void add(StudyException problem) {
        for (StudyException p : problem.problems()) {
            if (found.stream().noneMatch(f -> f.getMessage().equals(p.getMessage()))) {
                found.add(p);
            }
        }
    }

    /** The value of {@code step}, or {@code fallback} after recording the problem it raised. */
    public <T> T attempt(Supplier<T> step, T fallback) {
        try {
            return step.get();
        } catch (StudyException e) {
            add(e);
            return fallback;
        }
    }

    /** Runs a check, recording the problem it raised. */
    public void attempt(Runnable check) {
        attempt(() -> {
            check.run();
            return null;
        }, null);
    }

    /** Whether nothing was found so far. */
    public boolean isEmpty() {
        return found.isEmpty();
    }

    /** The problems found, in the order they were found. */
    public List<StudyException> all() {
        return List.copyOf(found);
    }

    /** Raises the problems found, if any: the first, carrying the others ({@link StudyException#problems()}). */
    public void throwIfAny() {
        if (!found.isEmpty()) {
            throw StudyException.together(found);
        }
    }
}
