package dev.touchstone.harness.execution;

import dev.touchstone.harness.testing.TestWorld;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;

/** Runs {@link CrashSafetyTest#STUDY} in its own JVM, to be killed in the middle. */
public final class CrashChild {

    private CrashChild() {
    }

    public static void main(String[] args) {
        TestWorld.runner().run(TestWorld.plan(CrashSafetyTest.STUDY), new StudyRunner.Options(Path.of(args[0]), 2,
                Progress.quiet(), new PrintWriter(new StringWriter())));
    }
}
