package dev.touchstone.harness.catalog;

import dev.touchstone.core.learner.Learner;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.ServiceLoader;

/**
 * Every learner a study or the command line may name, by id: the built-in ones and those
 * in plug-in jars (both found with Java's {@link ServiceLoader}), and the external
 * commands declared in a learners file. Immutable; lookups are O(1).
 *
 * <p>Command learners only ever enter through {@link Builder#addCommand}, which the command
 * line calls for a learners file given with {@code --learners}; a study file alone can
 * never make one runnable: only the user, by naming the file, lets a command run.
 */
public final class LearnerCatalog {

    /** Where a learner came from. */
    public enum Origin {
        BUILT_IN, PLUG_IN, COMMAND;

        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
        }
    }

    /** A learner with its origin (and, for plug-ins and commands, the file it came from). */
    public record Entry(Learner learner, Origin origin, String source) {
        public String id() {
            return learner.description().id();
        }
    }

    private final Map<String, Entry> byId;

    private LearnerCatalog(Map<String, Entry> byId) {
        this.byId = Collections.unmodifiableMap(new LinkedHashMap<>(byId));
    }

    /** The built-in learners visible to this class's class loader. */
    public static LearnerCatalog builtIn() {
        return builder().addServices(LearnerCatalog.class.getClassLoader(), Origin.BUILT_IN, "built in").build();
    }

    public static Builder builder() {
        return new Builder();
    }

    /** The learner with this id, or null. */
    public Entry find(String id) {
        return byId.get(id);
    }

    public boolean contains(String id) {
        return byId.containsKey(id);
    }

    /** All learners, in the order they were added (built-in ones first, each group sorted by id). */
    public List<Entry> entries() {
        return List.copyOf(byId.values());
    }

    /** The ids, for "allowed: …" messages. */
    public List<String> ids() {
        return List.copyOf(byId.keySet());
    }

    /** Collects learners; a second learner with an id already taken is refused with both sources named. */
    public static final class Builder {
        private final Map<String, Entry> byId = new LinkedHashMap<>();

        /** Adds every {@link Learner} service visible to {@code loader}, sorted by id. */
        public Builder addServices(ClassLoader loader, Origin origin, String source) {
            List<Learner> found = new ArrayList<>();
            for (Learner l : ServiceLoader.load(Learner.class, loader)) {
                found.add(l);
            }
            found.sort((a, b) -> a.description().id().compareTo(b.description().id()));
            for (Learner l : found) {
                Entry existing = byId.get(l.description().id());
                if (existing != null && existing.learner().getClass() == l.getClass()) {
                    continue; // the same class seen again through a parent loader
                }
                add(l, origin, source);
            }
            return this;
        }

        public Builder add(Learner learner, Origin origin, String source) {
            String id = learner.description().id();
            Entry old = byId.get(id);
            if (old != null) {
                throw new IllegalArgumentException("two learners have the id '" + id + "': one " + old.origin().word()
                        + " (" + old.source() + "), one " + origin.word() + " (" + source + ")");
            }
            byId.put(id, new Entry(learner, origin, source));
            return this;
        }

        /** Adds an external command learner declared in a learners file. */
        public Builder addCommand(Learner learner, String learnersFile) {
            return add(learner, Origin.COMMAND, learnersFile);
        }

        public LearnerCatalog build() {
            return new LearnerCatalog(byId);
        }
    }
}
