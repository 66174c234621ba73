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

    /**
     * The settings of the one learner a command runs: {@code ID.NAME=VALUE} as in the commands
     * that run several learners, or plain {@code NAME=VALUE}. A prefix naming another learner is
     * refused, so a setting copied from a calibrate command line cannot be silently ignored.
     *
     * @throws UsageException naming the setting
     */
    static Map<String, String> forLearner(Map<String, String> raw, String learnerId) {
        Map<String, String> out = new LinkedHashMap<>();
        for (Map.Entry<String, String> e : raw.entrySet()) {
            String name = e.getKey();
            String own = learnerId + ".";
            if (name.startsWith(own)) {
                name = name.substring(own.length());
            } else if (name.indexOf('.') > 0) {
                throw new UsageException("--set " + e.getKey() + "=" + e.getValue() + ": this command runs '"
                        + learnerId + "'; write " + own + name.substring(name.indexOf('.') + 1) + " or just "
                        + name.substring(name.indexOf('.') + 1));
            }
            if (out.put(name, e.getValue()) != null) {
                throw new UsageException("--set " + e.getKey() + "=" + e.getValue() + ": " + name + " is set twice");
            }
        }
        return out;
    }
}
