package dev.touchstone.harness.study;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.composed.ComposedLearner;
import dev.touchstone.learners.composed.ComposedStep;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;

/**
 * Expands a study into its plan: every truth setting (the product of all truth axes), every
 * learner configuration (the product of each entry's parameter axes); the {@link Plan} orders
 * the runs over them (and builds them when first asked for).
 *
 * <p>Expansion is pure: the same study always gives the same plan, keys and seeds. Cost:
 * linear in the number of settings and configurations; the runs cost linear in their number
 * (bounded by {@code limits.max_runs}) when the plan builds them.
 */
public final class Expansion {

    private final TruthCatalog catalog;
    private final Function<String, String> fingerprints;

    /**
     * @param catalog      the truth catalogue (for defaults and cross-field checks)
     * @param fingerprints for a learner id, what else defines it (e.g. an external command line), or ""
     */
    public Expansion(TruthCatalog catalog, Function<String, String> fingerprints) {
        this.catalog = catalog;
        this.fingerprints = fingerprints;
    }

    public Expansion(TruthCatalog catalog) {
        this(catalog, id -> "");
    }

    /** Expands a validated study. */
    public Plan expand(Study study, dev.touchstone.harness.catalog.LearnerCatalog learners) {
        StudyProblems problems = new StudyProblems();
        List<TruthSetting> truths = truths(study, problems);
        List<LearnerConfig> configs = configs(study, learners, problems);
        problems.throwIfAny();
        return new Plan(study, truths, configs);
    }

    private List<TruthSetting> truths(Study study, StudyProblems problems) {
        List<TruthSetting> out = new ArrayList<>();
        for (int b = 0; b < study.truths().size(); b++) {
            List<List<TruthSetting.Choice>> perSection = new ArrayList<>();
            for (ComponentSpec c : study.truths().get(b)) {
                int block = b;
                perSection.add(problems.attempt(() -> choices(study, block, c), List.of()));
            }
            combine(perSection, 0, new ArrayList<>(), out);
        }
        for (TruthSetting t : out) {
            try {
                catalog.checkCombination(t);
            } catch (IllegalArgumentException e) {
                problems.add(new StudyException(placeOf(study, "truth"), "truth", e.getMessage() + " (in the setting "
                        + t.label() + ")"));
            }
        }
        return out;
    }

    private List<TruthSetting.Choice> choices(Study study, int block, ComponentSpec c) {
        List<TruthSetting.Choice> choices = new ArrayList<>();
        for (String kindName : c.kinds()) {
            TruthCatalog.Kind kind = catalog.section(c.section()).kind(kindName);
            for (Map<String, Object> given : product(c.axes())) {
                ParameterValues values;
                try {
                    values = ParameterValues.resolve(c.section() + " " + kindName, kind.parameters(), given);
                } catch (ParameterException e) {
                    String where = study.truths().size() > 1 ? "truth[" + block + "]." : "truth.";
                    throw new StudyException(placeOf(study, "truth", c.section()), where + c.section() + "."
                            + e.parameter(), e.getMessage());
                }
                choices.add(catalog.choice(c.section(), kindName, values, given));
            }
        }
        return choices;
    }

    private static void combine(List<List<TruthSetting.Choice>> perSection, int i, List<TruthSetting.Choice> prefix,
                                List<TruthSetting> out) {
        if (i == perSection.size()) {
            out.add(new TruthSetting(out.size(), prefix));
            return;
        }
        for (TruthSetting.Choice c : perSection.get(i)) {
            List<TruthSetting.Choice> next = new ArrayList<>(prefix);
            next.add(c);
            combine(perSection, i + 1, next, out);
        }
    }

    private List<LearnerConfig> configs(Study study, dev.touchstone.harness.catalog.LearnerCatalog learners,
                                        StudyProblems problems) {
        List<LearnerConfig> out = new ArrayList<>();
        Map<String, LearnerConfig> byCanonical = new HashMap<>();
        for (LearnerEntry e : study.learners()) {
            Learner learner = learnerOf(e, learners);
            for (Map<String, Object> given : product(e.axes())) {
                ParameterValues values;
                try {
                    values = ParameterValues.resolve("learner " + e.use(), learner.description().parameters(), given);
                } catch (ParameterException ex) {
                    problems.add(new StudyException(e.place(), "learners." + e.id() + ".with." + ex.parameter(),
                            ex.getMessage()));
                    continue;
                }
                Map<String, Object> varied = new LinkedHashMap<>();
                e.axes().forEach((k, v) -> {
                    if (v.size() > 1) {
                        varied.put(k, given.get(k));
                    }
                });
                LearnerConfig c = new LearnerConfig(out.size(), e.id(), learner, values,
                        new LearnerConfig.Details(varied, fingerprint(e, learner), e.knowledge()));
                LearnerConfig same = byCanonical.putIfAbsent(c.canonical(), c);
                if (same != null) {
                    problems.add(new StudyException(e.place(), "learners." + e.id(), "the configuration " + c.label()
                            + " is identical to " + same.label() + " (same learner, same parameter values);"
                            + " remove one of them"));
                    continue;
                }
                out.add(c);
            }
        }
        return out;
    }

    /** The entry's learner: the catalogue's, or the composition of the catalogue learners its steps use. */
    private static Learner learnerOf(LearnerEntry e, dev.touchstone.harness.catalog.LearnerCatalog learners) {
        if (!e.composed()) {
            return learners.find(e.use()).learner();
        }
        List<ComposedStep> steps = new ArrayList<>();
        for (LearnerEntry.Step s : e.steps()) {
            steps.add(new ComposedStep(learners.find(s.use()).learner(), s.given()));
        }
        return ComposedLearner.of(steps);
    }

    /**
     * What defines the entry's learner beyond its id and values; for a composed entry its
     * composition (so the hand-ons are part of a run's identity) and each step's own fingerprint.
     */
    private String fingerprint(LearnerEntry e, Learner learner) {
        if (!(learner instanceof ComposedLearner c)) {
            return fingerprints.apply(e.use());
        }
        StringBuilder sb = new StringBuilder(c.composition());
        for (LearnerEntry.Step s : e.steps()) {
            String f = fingerprints.apply(s.use());
            if (!f.isEmpty()) {
                sb.append(" [").append(s.use()).append(": ").append(f).append(']');
            }
        }
        return sb.toString();
    }

    /** All combinations of the axes, in order (last axis fastest). */
    static List<Map<String, Object>> product(Map<String, List<Object>> axes) {
        List<Map<String, Object>> out = new ArrayList<>();
        out.add(new LinkedHashMap<>());
        for (Map.Entry<String, List<Object>> axis : axes.entrySet()) {
            List<Map<String, Object>> next = new ArrayList<>();
            for (Map<String, Object> partial : out) {
                for (Object v : axis.getValue()) {
                    Map<String, Object> m = new LinkedHashMap<>(partial);
                    m.put(axis.getKey(), v);
                    next.add(m);
                }
            }
            out = next;
        }
        return out;
    }

    private static Node.Place placeOf(Study study, String... path) {
        Node n = study.source();
        for (String p : path) {
            if (n == null || n.get(p) == null) {
                break;
            }
            n = n.get(p);
        }
        return n == null ? new Node.Place("study", 0, 0) : n.place();
    }
}
