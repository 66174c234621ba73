package dev.touchstone.harness.outside;

import dev.touchstone.harness.catalog.LearnerCatalog;

import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Every learner a study may name, gathered in one place for the command line and for
 * workers that rebuild a plan elsewhere: the built-in learners of a class path (service
 * loader), the plug-in jars of a folder, and the external commands of a learners file,
 * with each command's fingerprint (what, beyond its id, defines its runs' keys).
 *
 * @param catalog      the learners by id
 * @param fingerprints for each command learner's id, its fingerprint (other ids: absent)
 */
public record LearnerSources(LearnerCatalog catalog, Map<String, String> fingerprints) {

    public LearnerSources {
        fingerprints = Map.copyOf(fingerprints);
    }

    /**
     * Gathers the learners.
     *
     * @param loader        the class path whose built-in learners count
     * @param pluginDir     a folder of plug-in jars, or null
     * @param commands      the command learners of a learners file (may be empty)
     * @param commandSource where the commands came from, for messages (the learners file's name)
     * @throws IllegalArgumentException (or a study error) naming what cannot be used
     */
    public static LearnerSources gather(ClassLoader loader, Path pluginDir, List<CommandSpec> commands,
                                        String commandSource) {
        LearnerCatalog.Builder b = LearnerCatalog.builder()
                .addServices(loader, LearnerCatalog.Origin.BUILT_IN, "built in");
        if (pluginDir != null) {
            PluginLoader.addPlugins(b, pluginDir);
        }
        Map<String, String> fingerprints = new HashMap<>();
        for (CommandSpec s : commands) {
            b.addCommand(new CommandLearner(s), commandSource);
            fingerprints.put(s.description().id(), s.fingerprint());
        }
        return new LearnerSources(b.build(), fingerprints);
    }

    /** The fingerprint of a learner id ("" for learners that are not commands). */
    public String fingerprint(String id) {
        return fingerprints.getOrDefault(id, "");
    }
}
