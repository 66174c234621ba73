package dev.touchstone.harness.outside;

import dev.touchstone.core.learner.LearnerDescription;

import java.nio.file.Path;
import java.util.List;

/**
 * An external command learner as declared in a learners file: its description, the
 * argument list with placeholders, the format of the graph file it writes, and the folder
 * of the learners file ({@code {dir}}). Immutable.
 *
 * @param description what the learner declares (id, returns, accepts, parameters, …)
 * @param command     the argument list; no shell is involved
 * @param output      the graph format the command writes
 * @param origin      the learners file that declares it
 * @param installation where the command is installed and which version it is
 */
public record CommandSpec(LearnerDescription description, List<String> command, OutputFormat output, Origin origin,
                          Installation installation) {

    public CommandSpec {
        command = List.copyOf(command);
        installation = installation == null ? Installation.LOCAL : installation;
    }

    /** A command installed on this machine only, with no declared version. */
    public CommandSpec(LearnerDescription description, List<String> command, OutputFormat output, Origin origin) {
        this(description, command, output, origin, Installation.LOCAL);
    }

    /**
     * The learners file a command is declared in.
     *
     * @param dir    the folder the learners file is in ({@code {dir}})
     * @param source the learners file, for messages
     */
    public record Origin(Path dir, String source) {
    }

    /**
     * Where a command is installed and which version it is; neither is part of the fingerprint.
     *
     * @param onWorkers whether the learners file says the command is installed on the workers of
     *                  a cluster engine too (field {@code installed_on_workers}); it does not change
     *                  what the command computes
     * @param version   the version the learners file declares (field {@code version}), or null;
     *                  recorded with every run (a new version of the same method keeps its runs'
     *                  keys, and a resume says what changed)
     */
    public record Installation(boolean onWorkers, String version) {

        /** Installed on this machine only, no declared version. */
        public static final Installation LOCAL = new Installation(false, null);
    }

    /** The folder the learners file is in. */
    public Path dir() {
        return origin.dir();
    }

    /** The learners file, for messages. */
    public String source() {
        return origin.source();
    }

    /** Whether the command is installed on a cluster engine's workers too. */
    public boolean onWorkers() {
        return installation.onWorkers();
    }

    /** The declared version, or null. */
    public String version() {
        return installation.version();
    }

    /** The graph formats a command may write (those of docs/formats.md). */
    public enum OutputFormat {
        JSON("json", "estimate.json"), CSV("csv", "estimate.csv");

        private final String word;
        private final String fileName;

        OutputFormat(String word, String fileName) {
            this.word = word;
            this.fileName = fileName;
        }

        public String word() {
            return word;
        }

        public String fileName() {
            return fileName;
        }
    }

    /** What defines this learner beyond its id and parameter values: the command line and output format. */
    public String fingerprint() {
        return String.join("\u0001", command) + "|" + output.word() + "|" + description.returns().word();
    }
}
