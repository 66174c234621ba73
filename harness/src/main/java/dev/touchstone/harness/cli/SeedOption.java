package dev.touchstone.harness.cli;

import picocli.CommandLine.Option;

/**
 * The root seed, with one name and one default in every command that draws random numbers:
 * {@code --seed N}, default {@value #DEFAULT}. Studies carry their own seed in the study file;
 * a command that must know whether a seed was given at all (to keep a model file's own data
 * seed, say) asks {@link #given()}.
 */
final class SeedOption {

    /** The seed used when none is given. */
    static final long DEFAULT = 1;

    @Option(names = "--seed", paramLabel = "N", description = "The root of every random choice (default: "
            + DEFAULT + ").")
    Long seed;

    /** The seed given, or the default. */
    long value() {
        return seed == null ? DEFAULT : seed;
    }

    /** Whether {@code --seed} was given. */
    boolean given() {
        return seed != null;
    }
}
