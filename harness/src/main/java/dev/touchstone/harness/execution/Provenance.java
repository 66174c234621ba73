package dev.touchstone.harness.execution;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Map;

/**
 * Where results came from: tool version and commit, Java, OS and
 * CPU, when the study started and ended, the study's name and hashes, the threads used and
 * how the runs ended, and the version of the CSV tables' layout ({@code tables_schema},
 * {@link ResultTables#SCHEMA}). Written as {@code provenance.json} at the start and again at the end.
 *
 * @param build    the tool that ran the study
 * @param study    which study, by name and hashes
 * @param session  how and when this session ran, and how its runs ended
 * @param versions this session's tool and learner versions and the plan's runs by version, or null
 */
public record Provenance(Build build, Study study, Session session, Versions versions) {

    /**
     * The tool.
     *
     * @param tool   tool version
     * @param commit the commit the tool was built from ("unknown" outside git), with {@code -dirty} for a changed tree
     */
    public record Build(String tool, String commit) {

        /** The tool running now. */
        public static Build current() {
            var v = dev.touchstone.harness.version.VersionInfo.current();
            return new Build(v.version(), v.commit() + (v.dirty() ? "-dirty" : ""));
        }
    }

    /**
     * The study.
     *
     * @param name     the study's name
     * @param hash     hash of every run key in order ({@link dev.touchstone.harness.study.Plan#hash()})
     * @param fileHash hash of the normalised study text
     */
    public record Study(String name, String hash, String fileHash) {
    }

    /**
     * The session.
     *
     * @param threads  worker threads
     * @param started  when this session started
     * @param finished when it ended, or null while running
     * @param counts   runs by status word (plus {@code total}), or empty while running
     */
    public record Session(int threads, Instant started, Instant finished, Map<String, Integer> counts) {
    }

    /**
     * The versions part of provenance.
     *
     * @param session the versions of this session
     * @param ledger  the plan's runs by version
     */
    public record Versions(RunVersions session, VersionLedger ledger) {
    }

    /** The same provenance for a session that ended at {@code at} with these runs by status. */
    public Provenance finished(Instant at, Map<String, Integer> counts) {
        return new Provenance(build, study, new Session(session.threads(), session.started(), at, counts), versions);
    }

    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    public String json() {
        ObjectNode o = JSON.createObjectNode();
        o.put("tables_schema", ResultTables.SCHEMA);
        ObjectNode tool = o.putObject("tool");
        tool.put("name", "touchstone");
        tool.put("version", build.tool());
        tool.put("commit", build.commit());
        ObjectNode java = o.putObject("java");
        java.put("version", System.getProperty("java.version"));
        java.put("vendor", System.getProperty("java.vendor"));
        java.put("vm", System.getProperty("java.vm.name"));
        ObjectNode os = o.putObject("os");
        os.put("name", System.getProperty("os.name"));
        os.put("version", System.getProperty("os.version"));
        os.put("arch", System.getProperty("os.arch"));
        ObjectNode cpu = o.putObject("cpu");
        cpu.put("cores", Runtime.getRuntime().availableProcessors());
        cpu.put("model", cpuModel());
        cpu.put("max_memory_mb", Runtime.getRuntime().maxMemory() / (1024 * 1024));
        ObjectNode named = o.putObject("study");
        named.put("name", study.name());
        named.put("hash", study.hash());
        named.put("file_hash", study.fileHash());
        o.put("threads", session.threads());
        o.put("started", session.started().toString());
        o.put("finished", session.finished() == null ? null : session.finished().toString());
        ObjectNode runs = o.putObject("runs");
        session.counts().forEach(runs::put);
        if (versions != null) {
            ObjectNode v = o.putObject("versions");
            v.put("tool", versions.session().tool());
            ObjectNode learners = v.putObject("learners");
            new java.util.TreeMap<>(versions.session().learners()).forEach(learners::put);
            v.put("mixed", versions.ledger().mixed());
            ObjectNode by = v.putObject("runs_by_version");
            versions.ledger().byVersion().forEach(by::put);
        }
        try {
            return JSON.writeValueAsString(o) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    /** The CPU model from /proc/cpuinfo where there is one, else the architecture. */
    static String cpuModel() {
        Path info = Path.of("/proc/cpuinfo");
        try {
            if (Files.isReadable(info)) {
                for (String line : Files.readAllLines(info)) {
                    if (line.startsWith("model name")) {
                        int colon = line.indexOf(':');
                        return line.substring(colon + 1).trim();
                    }
                }
            }
        } catch (IOException | RuntimeException e) {
            // fall through: the model is a courtesy, not a requirement
        }
        return System.getProperty("os.arch");
    }
}
