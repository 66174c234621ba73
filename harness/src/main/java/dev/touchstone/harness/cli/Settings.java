package dev.touchstone.harness.cli;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Reads repeated {@code --set NAME=VALUE} options into an ordered map, refusing malformed or repeated ones. */
final class Settings {

    private Settings() {
    }

    /**
     * @throws UsageException naming the malformed or repeated option
     */
    static Map<String, String> parse(List<String> settings) {
        Map<String, String> raw = new LinkedHashMap<>();
        for (String s : settings) {
            int eq = s.indexOf('=');
            if (eq <= 0) {
                throw new UsageException("--set " + s + ": expected NAME=VALUE");
            }
            String name = s.substring(0, eq).trim();
            if (raw.put(name, s.substring(eq + 1).trim()) != null) {
                throw new UsageException("--set " + s + ": " + name + " is set twice");
            }
        }
        return raw;
    }
}
