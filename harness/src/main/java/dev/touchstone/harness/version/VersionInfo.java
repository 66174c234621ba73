package dev.touchstone.harness.version;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/** The tool's version and the git commit it was built from, recorded at build time. */
public final class VersionInfo {

    private static final VersionInfo CURRENT = load();

    private final String version;
    private final String commit;
    private final boolean dirty;

    private VersionInfo(String version, String commit, boolean dirty) {
        this.version = version;
        this.commit = commit;
        this.dirty = dirty;
    }

    public static VersionInfo current() {
        return CURRENT;
    }

    public String version() {
        return version;
    }

    /** The abbreviated commit id, or "unknown" when built outside a git checkout. */
    public String commit() {
        return commit;
    }

    /** Whether the working tree had uncommitted changes when built. */
    public boolean dirty() {
        return dirty;
    }

    /** Whether this is a released build: a version that is known and not a snapshot. */
    public boolean released() {
        return !version.equals("unknown") && !version.endsWith("-SNAPSHOT");
    }

    /**
     * The version as recorded with every run: the version alone for a released build; for an
     * unreleased one the source revision too ({@code 0.1.0-SNAPSHOT+abc1234}, with
     * {@code -dirty} when built from uncommitted changes), since two snapshots differ.
     */
    public String label() {
        return released() ? version : version + "+" + commit + (dirty ? "-dirty" : "");
    }

    @Override
    public String toString() {
        return "touchstone " + version + " (commit " + commit + (dirty ? ", with uncommitted changes" : "") + ")";
    }

    private static VersionInfo load() {
        Properties p = new Properties();
        try (InputStream in = VersionInfo.class.getResourceAsStream("/touchstone-version.properties")) {
            if (in != null) {
                p.load(in);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return new VersionInfo(clean(p.getProperty("version")), clean(p.getProperty("commit")),
                "true".equals(p.getProperty("dirty")));
    }

    private static String clean(String s) {
        return s == null || s.isBlank() || s.startsWith("${") ? "unknown" : s;
    }
}
