package dev.touchstone.harness.cli;

import picocli.CommandLine.Option;

import java.nio.file.Path;

/**
 * The options that say where learners come from beyond the built-in ones, the same in every
 * command that names learners: {@code --learners FILE} (outside commands declared in a
 * learners file) and {@code --plugins DIR} (Java plug-in jars).
 */
final class LearnerSourceOptions {

    @Option(names = "--learners", paramLabel = "FILE",
            description = "A learners file declaring outside command learners (see docs/outside-learners.md).")
    Path learnersFile;

    @Option(names = "--plugins", paramLabel = "DIR", description = "A folder of plug-in jars with Learner services.")
    Path plugins;

    /** The learners, tests and catalogues these options make available. */
    Toolkit toolkit() {
        return new Toolkit(learnersFile, plugins);
    }
}
