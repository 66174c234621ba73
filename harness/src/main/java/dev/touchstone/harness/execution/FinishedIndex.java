package dev.touchstone.harness.execution;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import dev.touchstone.harness.io.AtomicFiles;
import dev.touchstone.harness.io.Sha256;
import dev.touchstone.metrics.results.RunStatus;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The marker of a finished study, {@code finished.json} in its output folder, that lets a
 * resume with nothing to do recognise the study without decoding its journal.
 *
 * <p>It is written (atomically) as the last act of a session that finished every run, and
 * names what that session ended with: the plan's outline hash (what every run key is made of,
 * {@link dev.touchstone.harness.study.Plan#outlineHash}), the normalised study's hash, the
 * versions the session recorded and whether kept runs differed from them, the runs by status,
 * and the size and SHA-256 of every file it vouches for (journal, kept estimates, tables,
 * provenance, study copy, learners copy, and once written the report's two pages).
 * It is {@linkplain #matches believed} only while every one of those files has exactly that
 * size and digest (a file whose size and modification time are unchanged since the marker was
 * written is not read again, see {@link #matches}): a journal appended to, cut, edited or damaged after the study finished
 * (or a table deleted) no longer matches, and the resume then reads the journal as before,
 * with all its checks (a damaged line refused with exit 2 before anything is written). A
 * session that is going to write deletes the marker first, so a crash can never leave a
 * marker beside files it does not describe.
 *
 * <p>Cost of a check: one metadata look-up per vouched file when nothing was touched; otherwise
 * a digest pass over the touched files (at most about 12 MB for a 10,000-run study), against
 * decoding every journal line into result records.
 *
 * @param hashes         what the finishing session ran: plan, study text and versions
 * @param versionChanges whether kept runs were made with other versions than those (a resume
 *                       with the same versions must then still be refused unless accepted)
 * @param counts         runs by status word, and {@code total}
 * @param files          file name (relative to the folder) → {@code BYTES:SHA256@MILLIS} (size,
 *                       digest, modification time in milliseconds)
 */
public record FinishedIndex(Hashes hashes, boolean versionChanges, Map<String, Integer> counts,
                            Map<String, String> files) {

    /** The marker's file name in a study's output folder. */
    public static final String FILE_NAME = "finished.json";

    private static final JsonFactory JSON = new JsonFactory();

    public FinishedIndex {
        counts = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(counts));
        files = java.util.Collections.unmodifiableMap(new TreeMap<>(files));
    }

    /**
     * What a session runs, as the marker names it.
     *
     * @param outline  {@code Plan.outlineHash()}: equal outlines mean the same run keys in the same
     *                 order (the plan's {@code hash()}), so a resume compares it without building the runs
     * @param study    hash of the normalised study text ({@code study.yaml})
     * @param versions hash of the versions the session records: the tool's and every learner's, in id order
     */
    public record Hashes(String outline, String study, String versions) {

        /** The hashes of a plan, its normalised study text and the session's versions. */
        public static Hashes of(dev.touchstone.harness.study.Plan plan, String studyText, RunVersions versions) {
            return new Hashes(plan.outlineHash(), dev.touchstone.harness.study.Canonical.hash(studyText),
                    dev.touchstone.harness.study.Canonical.hash(versions.tool() + "\n"
                            + new TreeMap<>(versions.learners())));
        }
    }

    /** The marker describing {@code names} in {@code out} as they are now. */
    static FinishedIndex of(Path out, Hashes hashes, boolean versionChanges, Map<String, Integer> counts,
                            List<String> names) {
        return new FinishedIndex(hashes, versionChanges, counts, fingerprints(out, names, Map.of()));
    }

    /** {@code kept} with the fingerprints of {@code names} in {@code out} as they are now added. */
    private static Map<String, String> fingerprints(Path out, List<String> names, Map<String, String> kept) {
        Map<String, String> files = new TreeMap<>(kept);
        for (String n : names) {
            files.put(n, fingerprint(out.resolve(n)));
        }
        return files;
    }

    /** The runs by status, as the finishing session counted them. */
    public Map<RunStatus, Integer> byStatus() {
        Map<RunStatus, Integer> m = new LinkedHashMap<>();
        for (RunStatus s : RunStatus.values()) {
            Integer n = counts.get(s.word());
            if (n != null && n > 0) {
                m.put(s, n);
            }
        }
        return m;
    }

    /** The number of runs of the finished study. */
    public int total() {
        return counts.getOrDefault("total", 0);
    }

    /**
     * Whether the folder is still exactly as this marker says, for this plan, study text and
     * versions: every vouched file present with its recorded size and digest.
     *
     * <p>A file whose size and modification time are both still those recorded, and whose
     * modification time is strictly older than the marker's own, is taken as unchanged without
     * reading it; any other file is digested in full. This is common practice for build tools and
     * version-control indexes (a change that keeps the size and puts the old time back is not
     * seen). The "strictly older than the marker" rule is the usual guard against a coarse clock:
     * a file rewritten in the same clock tick as the marker keeps its time, so it is digested.
     */
    public boolean matches(Path out, Hashes session) {
        if (!hashes.equals(session)) {
            return false;
        }
        long markerTime;
        try {
            markerTime = Files.getLastModifiedTime(out.resolve(FILE_NAME)).toMillis();
        } catch (IOException e) {
            return false;
        }
        for (Map.Entry<String, String> f : files.entrySet()) {
            Path p = out.resolve(f.getKey());
            try {
                long size = Files.size(p);
                String recorded = f.getValue();
                if (!recorded.startsWith(size + ":")) {
                    return false;
                }
                long time = Files.getLastModifiedTime(p).toMillis();
                boolean untouched = time < markerTime && recorded.endsWith("@" + time);
                if (!untouched && !digestPart(recorded).equals(digest(p))) {
                    return false;
                }
            } catch (IOException | UncheckedIOException e) {
                return false;
            }
        }
        return true;
    }

    /** Whether the marker vouches for every one of these files. */
    public boolean vouchesFor(List<String> names) {
        return files.keySet().containsAll(names);
    }

    /** The same marker also vouching for {@code names} in {@code out} as they are now. */
    FinishedIndex with(Path out, List<String> names) {
        return new FinishedIndex(hashes, versionChanges, counts, fingerprints(out, names, files));
    }

    /**
     * The marker kept in {@code out}, or null when there is none or it cannot be read (then it is not believed).
     * Read with the streaming parser: a resume with nothing to do needs no data-binding mapper.
     */
    public static FinishedIndex read(Path out) {
        Path file = out.resolve(FILE_NAME);
        if (!Files.isRegularFile(file)) {
            return null;
        }
        try (JsonParser p = JSON.createParser(file.toFile())) {
            if (p.nextToken() != JsonToken.START_OBJECT) {
                return null;
            }
            Map<String, String> text = new LinkedHashMap<>();
            Map<String, Integer> counts = new LinkedHashMap<>();
            Map<String, String> files = new TreeMap<>();
            Boolean changes = null;
            while (p.nextToken() == JsonToken.FIELD_NAME) {
                String field = p.currentName();
                JsonToken t = p.nextToken();
                switch (field) {
                    case "counts" -> readObject(p, t, () -> counts.put(p.currentName(), p.getValueAsInt()));
                    case "files" -> readObject(p, t, () -> files.put(p.currentName(), p.getValueAsString()));
                    case "version_changes" -> changes = t.isBoolean() ? t == JsonToken.VALUE_TRUE : null;
                    default -> {
                        if (t == JsonToken.VALUE_STRING) {
                            text.put(field, p.getText());
                        } else {
                            p.skipChildren();
                        }
                    }
                }
            }
            if (!text.containsKey("outline") || !text.containsKey("study") || !text.containsKey("versions")
                    || changes == null || files.isEmpty()) {
                return null;
            }
            return new FinishedIndex(new Hashes(text.get("outline"), text.get("study"), text.get("versions")), changes,
                    counts, files);
        } catch (IOException | RuntimeException e) {
            return null;
        }
    }

    /** What to do with each scalar field of a nested object. */
    private interface FieldReader {
        void read() throws IOException;
    }

    /** Reads a nested object of scalars (its start token {@code t} just read); anything else in it is skipped. */
    private static void readObject(JsonParser p, JsonToken t, FieldReader each) throws IOException {
        if (t != JsonToken.START_OBJECT) {
            p.skipChildren();
            return;
        }
        while (p.nextToken() == JsonToken.FIELD_NAME) {
            if (p.nextToken().isScalarValue()) {
                each.read();
            } else {
                p.skipChildren();
            }
        }
    }

    /** Writes the marker into {@code out}, whole or not at all. */
    void write(Path out) {
        java.io.StringWriter text = new java.io.StringWriter();
        try (JsonGenerator g = JSON.createGenerator(text).useDefaultPrettyPrinter()) {
            g.writeStartObject();
            g.writeStringField("outline", hashes.outline());
            g.writeStringField("study", hashes.study());
            g.writeStringField("versions", hashes.versions());
            g.writeBooleanField("version_changes", versionChanges);
            g.writeObjectFieldStart("counts");
            for (Map.Entry<String, Integer> c : counts.entrySet()) {
                g.writeNumberField(c.getKey(), c.getValue());
            }
            g.writeEndObject();
            g.writeObjectFieldStart("files");
            for (Map.Entry<String, String> f : files.entrySet()) {
                g.writeStringField(f.getKey(), f.getValue());
            }
            g.writeEndObject();
            g.writeEndObject();
        } catch (IOException e) {
            throw new UncheckedIOException("the marker could not be written as JSON", e);
        }
        OutputFiles.write(out.resolve(FILE_NAME), text + "\n");
    }

    /** Removes the marker from {@code out}, before a session changes what it vouches for. */
    static void remove(Path out) {
        try {
            Files.deleteIfExists(out.resolve(FILE_NAME));
        } catch (IOException e) {
            throw new UncheckedIOException("cannot remove " + out.resolve(FILE_NAME) + ": " + e.getMessage(), e);
        }
    }

    /**
     * Adds the files of a report just written from the finished study in {@code out} to its
     * marker, so a later resume with nothing to do knows the report is current too. Does
     * nothing when the folder holds no marker (the study is not finished).
     */
    public static void vouch(Path out, List<String> names) {
        FinishedIndex index = read(out);
        if (index != null) {
            index.with(out, names).write(out);
        }
    }

    /** {@code BYTES:SHA256@MILLIS} of a file: its size, digest and modification time. */
    static String fingerprint(Path p) {
        try {
            return digest(p) + "@" + Files.getLastModifiedTime(p).toMillis();
        } catch (NoSuchFileException e) {
            throw new UncheckedIOException(e);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + p + ": " + e.getMessage(), e);
        }
    }

    /** The {@code BYTES:SHA256} part of a recorded fingerprint (markers written before times were recorded have no more). */
    private static String digestPart(String recorded) {
        int at = recorded.indexOf('@');
        return at < 0 ? recorded : recorded.substring(0, at);
    }

    /** {@code BYTES:SHA256} of a file. */
    static String digest(Path p) {
        try {
            Sha256 d = Sha256.start().addFile(p);
            return d.size() + ":" + d.hex();
        } catch (NoSuchFileException e) {
            throw new UncheckedIOException(e);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + p + ": " + e.getMessage(), e);
        }
    }

    /** The names, for a list of optional files, of those present in {@code out}. */
    static List<String> present(Path out, List<String> names) {
        List<String> found = new ArrayList<>();
        for (String n : names) {
            if (Files.isRegularFile(out.resolve(n))) {
                found.add(n);
            }
        }
        return found;
    }
}
