package dev.touchstone.harness.testing;

import org.junit.jupiter.api.Assumptions;

import java.io.File;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.fail;

/**
 * The python3 interpreter for the tests whose outside learners are small Python scripts. Where it
 * is missing, a test using it is skipped with a message naming what was skipped, except in CI
 * (environment CI=true), where .ci/run installs it and the test must run: so a machine without
 * Python can never make CI pass by skipping.
 */
public final class Python3 {

    private Python3() {
    }

    /** The interpreter's absolute path, found on PATH, or null when there is none. */
    public static String find() {
        for (String dir : System.getenv().getOrDefault("PATH", "").split(File.pathSeparator)) {
            if (!dir.isEmpty() && Files.isExecutable(Path.of(dir, "python3"))) {
                return Path.of(dir, "python3").toString();
            }
        }
        return null;
    }

    /**
     * The interpreter's path; skips the calling test (fails it in CI) when there is none.
     *
     * @param what the tests that need it, for the skip message
     */
    public static String require(String what) {
        String python = find();
        if (python == null) {
            if ("true".equals(System.getenv("CI"))) {
                fail("python3 is not installed; .ci/run should have installed Debian's python3 package (" + what + ")");
            }
            Assumptions.assumeTrue(false, "python3 not found: skipping " + what + " (it runs in CI)");
        }
        return python;
    }
}
