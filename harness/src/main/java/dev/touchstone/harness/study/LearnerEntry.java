package dev.touchstone.harness.study;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One entry of a study's {@code learners} list as written: the name it goes by in results
 * ({@code id}), the catalogue learner it uses ({@code use}) and, per parameter, the values
 * it takes (several values expand into several configurations), and the background
 * knowledge its runs receive. Immutable.
 */
public record LearnerEntry(String id, String use, Map<String, List<Object>> axes, KnowledgeSource knowledge,
                           Node.Place place) {

    public LearnerEntry {
        Map<String, List<Object>> copy = new LinkedHashMap<>();
        axes.forEach((k, v) -> copy.put(k, List.copyOf(v)));
        axes = Collections.unmodifiableMap(copy);
        knowledge = knowledge == null ? KnowledgeSource.NONE : knowledge;
    }

    /** An entry whose runs get no background knowledge. */
    public LearnerEntry(String id, String use, Map<String, List<Object>> axes, Node.Place place) {
        this(id, use, axes, KnowledgeSource.NONE, place);
    }

    /** The number of configurations this entry expands into. */
    public long configurations() {
        long n = 1;
        for (List<Object> v : axes.values()) {
            n = Math.multiplyExact(n, v.size());
        }
        return n;
    }
}
