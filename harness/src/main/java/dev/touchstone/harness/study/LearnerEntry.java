package dev.touchstone.harness.study;

import dev.touchstone.learners.composed.ComposedLearner;
import dev.touchstone.learners.composed.Handoff;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * One entry of a study's {@code learners} list as written: the name it goes by in results
 * ({@code id}), the catalogue learner it uses ({@code use}) and, per parameter, the values
 * it takes (several values expand into several configurations), and the background
 * knowledge its runs receive. Immutable.
 *
 * <p>A composed entry ({@code steps}) has two or more steps, each a catalogue learner with its
 * values and, after the first, how it is given the estimate of the step before; its
 * {@link #use()} and {@link #axes()} are those of the {@link ComposedLearner} the steps make. A
 * plain entry is the one-step case.
 */
public record LearnerEntry(String id, List<Step> steps, KnowledgeSource knowledge, Node.Place place) {

    /** One step as written: the catalogue learner, its parameter axes, and how it receives the step before's estimate (null for the first). */
    public record Step(String use, Map<String, List<Object>> axes, Handoff given) {
        public Step {
            Objects.requireNonNull(use, "use");
            Map<String, List<Object>> copy = new LinkedHashMap<>();
            axes.forEach((k, v) -> copy.put(k, List.copyOf(v)));
            axes = Collections.unmodifiableMap(copy);
        }
    }

    public LearnerEntry {
        steps = List.copyOf(steps);
        if (steps.isEmpty()) {
            throw new IllegalArgumentException("a learner entry needs a learner");
        }
        knowledge = knowledge == null ? KnowledgeSource.NONE : knowledge;
    }

    /** A plain entry using one catalogue learner. */
    public LearnerEntry(String id, String use, Map<String, List<Object>> axes, KnowledgeSource knowledge,
                        Node.Place place) {
        this(id, List.of(new Step(use, axes, null)), knowledge, place);
    }

    /** A plain entry whose runs get no background knowledge. */
    public LearnerEntry(String id, String use, Map<String, List<Object>> axes, Node.Place place) {
        this(id, use, axes, KnowledgeSource.NONE, place);
    }

    /** Whether the entry is made of steps of other learners. */
    public boolean composed() {
        return steps.size() > 1;
    }

    /** The learner id: the catalogue learner's, or for a composed entry the id of the composition. */
    public String use() {
        return composed() ? ComposedLearner.idOf(stepUses()) : steps.get(0).use();
    }

    /** The parameter axes; for a composed entry every step's, named {@code STEP.PARAMETER}. */
    public Map<String, List<Object>> axes() {
        if (!composed()) {
            return steps.get(0).axes();
        }
        List<String> names = ComposedLearner.stepNames(stepUses());
        Map<String, List<Object>> out = new LinkedHashMap<>();
        for (int i = 0; i < steps.size(); i++) {
            String name = names.get(i);
            steps.get(i).axes().forEach((k, v) -> out.put(ComposedLearner.parameterName(name, k), v));
        }
        return Collections.unmodifiableMap(out);
    }

    private List<String> stepUses() {
        List<String> uses = new ArrayList<>();
        for (Step s : steps) {
            uses.add(s.use());
        }
        return uses;
    }

    /** The number of configurations this entry expands into. */
    public long configurations() {
        long n = 1;
        for (List<Object> v : axes().values()) {
            n = Math.multiplyExact(n, v.size());
        }
        return n;
    }
}
