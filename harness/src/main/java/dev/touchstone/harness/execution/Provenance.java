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
 * @param tool        tool version
 * @param commit      the commit the tool was built from ("unknown" outside git)
 * @param studyName   the study's name
 * @param studyHash   hash of every run key in order ({@link dev.touchstone.harness.study.Plan#hash()})
 * @param studyFileHash hash of the normalised study text
 * @param threads     worker threads
 * @param started     when this session started
 * @param finished    when it ended, or null while running
 * @param counts      runs by status word (plus {@code total}), or empty while running
 * @param versions    this session's tool and learner versions and the plan's runs by version, or null
 */
public record Provenance(String tool, String commit, String studyName, String studyHash, String studyFileHash,
                         int threads, Instant started, Instant finished, Map<String, Integer> counts,
                         Versions versions) {

    /**
     * The versions part of provenance.
     *
     * @param session the versions of this session
     * @param ledger  the plan's runs by version
     */
    public record Versions(RunVersions session, VersionLedger ledger) {
    }

    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    public String json() {
        ObjectNode o = JSON.createObjectNode();
        o.put("tables_schema", ResultTables.SCHEMA);
        ObjectNode tool = o.putObject("tool");
        tool.put("name", "touchstone");
        tool.put("version", this.tool);
        tool.put("commit", commit);
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
        ObjectNode study = o.putObject("study");
        study.put("name", studyName);
        study.put("hash", studyHash);
        study.put("file_hash", studyFileHash);
        o.put("threads", threads);
        o.put("started", started.toString());
        o.put("finished", finished == null ? null : finished.toString());
        ObjectNode runs = o.putObject("runs");
        counts.forEach(runs::put);
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
