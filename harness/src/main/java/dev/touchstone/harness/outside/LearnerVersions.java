package dev.touchstone.harness.outside;

import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.io.Sha256;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.CodeSource;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Finds each learner's version, recorded with every run so that a resume never mixes two
 * versions silently: built-in learners have the tool's version; a Java plug-in the
 * {@code Implementation-Version} of its jar's manifest (else {@code sha256:} and a digest of
 * the jar); an outside command the {@code version} its learners file declares, else
 * {@code sha256:} and a digest of its argument list and of every file the arguments name
 * (absolute, or relative to the learners file's folder, after {@code {dir}} is filled in),
 * so that editing the script changes the version. SHA-256 is FIPS 180-4; digests are cut to
 * 16 hexadecimal digits (64 bits), enough to tell versions of one learner apart.
 */
public final class LearnerVersions {

    private LearnerVersions() {
    }

    /** The version of every learner in the catalogue by id, built-in ones at the tool's {@code tool}. */
    public static Map<String, String> of(LearnerCatalog catalog, String tool) {
        Map<String, String> byId = new LinkedHashMap<>();
        for (LearnerCatalog.Entry e : catalog.entries()) {
            switch (e.origin()) {
                case PLUG_IN:
                    byId.put(e.id(), pluginVersion(e.learner().getClass()));
                    break;
                case COMMAND:
                    if (e.learner() instanceof CommandLearner) {
                        byId.put(e.id(), commandVersion(((CommandLearner) e.learner()).spec()));
                    }
                    break;
                default:
                    byId.put(e.id(), tool);
            }
        }
        return byId;
    }

    /** A plug-in's manifest version, else a digest of its jar (or "unknown" when it has no jar). */
    static String pluginVersion(Class<?> type) {
        Package p = type.getPackage();
        String v = p == null ? null : p.getImplementationVersion();
        if (v != null && !v.isBlank()) {
            return v.trim();
        }
        CodeSource cs = type.getProtectionDomain().getCodeSource();
        if (cs == null || cs.getLocation() == null) {
            return "unknown";
        }
        try {
            Path jar = Path.of(cs.getLocation().toURI());
            if (!Files.isRegularFile(jar)) {
                return "unknown";
            }
            return digest(Sha256.start().addFile(jar));
        } catch (URISyntaxException | IllegalArgumentException | IOException e) {
            return "unknown";
        }
    }

    /** The declared version of a command, else a digest of its arguments and the files they name. */
    public static String commandVersion(CommandSpec spec) {
        if (spec.version() != null) {
            return spec.version();
        }
        Sha256 d = Sha256.start();
        for (String arg : spec.command()) {
            d.add(arg).add((byte) 0);
            Path file = namedFile(arg, spec.dir());
            if (file != null) {
                try {
                    d.addFile(file);
                } catch (IOException e) {
                    d.add("unreadable");
                }
            }
        }
        return digest(d);
    }

    /** The regular file an argument names (with {@code {dir}} filled in), or null. */
    static Path namedFile(String arg, Path dir) {
        String a = dir == null ? arg : arg.replace("{dir}", dir.toString());
        if (a.contains("{") || a.isBlank()) {
            return null;
        }
        try {
            Path p = Path.of(a);
            if (!p.isAbsolute()) {
                if (dir == null) {
                    return null;
                }
                p = dir.resolve(p);
            }
            return Files.isRegularFile(p) ? p : null;
        } catch (IllegalArgumentException e) {
            return null;
        }
    }

    private static String digest(Sha256 d) {
        return "sha256:" + d.hex(8);
    }
}
