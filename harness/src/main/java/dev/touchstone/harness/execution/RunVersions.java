package dev.touchstone.harness.execution;

import java.util.Map;
import java.util.Objects;

/**
 * The versions a session records with every run: the tool's ({@link
 * dev.touchstone.harness.version.VersionInfo#label()}) and each learner's by id (built-in
 * learners: the tool's; plug-ins: their jar's; outside commands: declared or a digest of
 * their files). A resume compares the versions of the runs it keeps with these, so that
 * results of two versions are never mixed silently.
 *
 * @param tool     the tool's version label
 * @param learners each learner's version by id; ids not listed have the tool's version
 */
public record RunVersions(String tool, Map<String, String> learners) {

    public RunVersions {
        Objects.requireNonNull(tool, "tool");
        learners = Map.copyOf(learners);
    }

    /** The versions of this build, with every learner at the tool's version. */
    public static RunVersions current() {
        return new RunVersions(dev.touchstone.harness.version.VersionInfo.current().label(), Map.of());
    }

    /** The version of the learner {@code id}. */
    public String learner(String id) {
        return learners.getOrDefault(id, tool);
    }

    /** What one run was made with. */
    public Stamp stamp(String learnerId) {
        return new Stamp(tool, learner(learnerId));
    }

    /**
     * The versions one run was made with, as recorded in its journal line.
     *
     * @param tool    the tool's version label
     * @param learner the learner's version
     */
    public record Stamp(String tool, String learner) {
        public Stamp {
            Objects.requireNonNull(tool, "tool");
            Objects.requireNonNull(learner, "learner");
        }
    }
}
