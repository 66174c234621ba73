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
 * @param dir         the folder the learners file is in
 * @param source      the learners file, for messages
 * @param onWorkers   whether the learners file says the command is installed on the workers of
 *                    a cluster engine too (field {@code installed_on_workers}); not part of the
 *                    fingerprint, since it does not change what the command computes
 * @param version     the version the learners file declares (field {@code version}), or null;
 *                    recorded with every run, not part of the fingerprint (a new version of
 *                    the same method keeps its runs' keys, and a resume says what changed)
 */
public record CommandSpec(LearnerDescription description, List<String> command, OutputFormat output, Path dir,
                          String source, boolean onWorkers, String version) {

    public CommandSpec {
        command = List.copyOf(command);
    }

    /** A command with no declared version. */
    public CommandSpec(LearnerDescription description, List<String> command, OutputFormat output, Path dir,
                       String source, boolean onWorkers) {
        this(description, command, output, dir, source, onWorkers, null);
    }

    /** A command installed on this machine only. */
    public CommandSpec(LearnerDescription description, List<String> command, OutputFormat output, Path dir,
                       String source) {
        this(description, command, output, dir, source, false);
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
