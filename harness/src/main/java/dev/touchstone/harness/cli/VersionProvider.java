package dev.touchstone.harness.cli;

import dev.touchstone.harness.version.VersionInfo;
import picocli.CommandLine;

/** Supplies {@code --version} to picocli: the tool's version and commit, Java and the OS. */
public final class VersionProvider implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
        return new String[] {VersionInfo.current().toString(),
                "Java " + System.getProperty("java.version") + ", " + System.getProperty("os.name") + " "
                        + System.getProperty("os.arch")};
    }
}
