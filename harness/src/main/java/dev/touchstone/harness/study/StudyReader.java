package dev.touchstone.harness.study;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.FormerNames;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.learners.composed.ComposedLearner;
import dev.touchstone.learners.composed.ComposedStep;
import dev.touchstone.learners.composed.Handoff;

import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Reads and validates a study file against the catalogues of truth components, learners
 * and metrics, before anything runs. Every problem is reported as one
 * {@link StudyException} naming file, line, column, field and what is allowed; independent
 * problems (fields, list items, parameters) are all collected in {@link StudyProblems} and
 * raised together, the first found first.
 *
 * <p>Checks: unknown or missing fields; types; ranges and choices of every parameter (from
 * its {@code ParameterSpec}); unknown learners (with a reminder that command learners must
 * come from a learners file), parameters and metrics; duplicate values, ids and sample
 * sizes; a {@code compare_to} that names no single configuration; and a grid larger than
 * {@code limits.max_runs}. Cost: linear in the file plus the product of axis lengths
 * (counted, not enumerated).
 */
public final class StudyReader {

    private static final Pattern NAME = Pattern.compile("[A-Za-z0-9][A-Za-z0-9._-]*");
    private static final Pattern ENTRY_ID = Pattern.compile("[a-z0-9][a-z0-9._-]*");

    private final TruthCatalog truth;
    private final LearnerCatalog learners;
    private final MetricCatalog metrics;

    public StudyReader(TruthCatalog truth, LearnerCatalog learners, MetricCatalog metrics) {
        this.truth = truth;
        this.learners = learners;
        this.metrics = metrics;
    }

    /** Reads and validates a study file. */
    public Study read(Path file) {
        Path parent = file.toAbsolutePath().normalize().getParent();
        return read(NodeReader.read(file), parent != null ? parent : Path.of("").toAbsolutePath());
    }

    /** Validates a parsed study whose relative paths resolve against the working folder. */
    public Study read(Node root) {
        return read(root, Path.of("").toAbsolutePath());
    }

    /** Validates a parsed study whose relative paths (e.g. a graph file) resolve against {@code baseDir}. */
    public Study read(Node root, Path baseDir) {
        StudyProblems problems = new StudyProblems();
        checkKeys(root, StudyFields.names(), problems);
        String name = problems.attempt(() -> name(root), null);
        Node descriptionNode = root.get(StudyFields.DESCRIPTION);
        String description = descriptionNode == null || descriptionNode.isNull() ? ""
                : problems.attempt(() -> text(descriptionNode), "");
        Long seed = problems.attempt(() -> integer(required(root, StudyFields.SEED), Long.MIN_VALUE, Long.MAX_VALUE),
                null);
        Node repNode = root.get(StudyFields.REPLICATES);
        Integer replicates = repNode == null ? Integer.valueOf(1)
                : problems.attempt(() -> (int) integer(repNode, 1, StudyFields.MAX_REPLICATES), null);
        List<List<ComponentSpec>> truthSpecs = problems.attempt(() -> truths(required(root, StudyFields.TRUTH),
                baseDir, problems), null);
        List<SampleSize> samples = problems.attempt(() -> samples(required(root, StudyFields.SAMPLES), problems),
                null);
        int before = problems.all().size();
        List<LearnerEntry> entries = problems.attempt(() -> learners(required(root, StudyFields.LEARNERS),
                problems), null);
        boolean entriesWhole = problems.all().size() == before;
        List<String> metricNames = problems.attempt(() -> metrics(root.get(StudyFields.METRICS), problems), null);
        Limits limits = problems.attempt(() -> limits(root.get(StudyFields.LIMITS), problems), null);
        // compare_to names an entry: checked only when every entry could be read, or it would
        // repeat an entry's own problem.
        String compareTo = entriesWhole ? problems.attempt(() -> compareTo(root.get(StudyFields.COMPARE_TO), entries),
                null) : null;
        List<GraphClass> scoreAgainst = problems.attempt(() -> scoreAgainst(root.get(StudyFields.SCORE_AGAINST),
                problems), null);
        problems.throwIfAny();
        Study study = Study.builder(name).description(description).seed(seed).replicates(replicates)
                .truths(truthSpecs).samples(samples).learners(entries).metrics(metricNames).limits(limits)
                .compareTo(compareTo).scoreAgainst(scoreAgainst).source(root).build();
        checkSize(root, study);
        return study;
    }

    private static String name(Node root) {
        String name = text(required(root, StudyFields.NAME));
        if (!NAME.matcher(name).matches()) {
            throw StudyException.at(root.get(StudyFields.NAME), "'" + name
                    + "' is not allowed (letters, digits, '.', '_' and '-', starting with a letter or digit)");
        }
        return name;
    }

    // ---- truth

    /** The {@code truth} field: one map, or a list of maps each expanding into its own grid. */
    private List<List<ComponentSpec>> truths(Node node, Path baseDir, StudyProblems problems) {
        if (!node.isList()) {
            return List.of(truth(node, baseDir, problems));
        }
        if (node.items().isEmpty()) {
            throw StudyException.at(node, "an empty list gives no truth (give a map such as {graph: …, model: …},"
                    + " or a list of them)");
        }
        List<List<ComponentSpec>> out = new ArrayList<>();
        for (Node item : node.items()) {
            out.add(problems.attempt(() -> truth(item, baseDir, problems), List.of()));
        }
        return out;
    }

    private List<ComponentSpec> truth(Node node, Path baseDir, StudyProblems problems) {
        requireMap(node);
        List<String> sectionNames = truth.sections().stream().map(TruthCatalog.Section::name).toList();
        checkKeys(node, sectionNames, problems);
        Set<String> replaced = new HashSet<>();
        for (TruthCatalog.Section section : truth.sections()) {
            Node s = node.get(section.name());
            if (s != null && !s.isNull()) {
                for (String other : section.replaces()) {
                    if (node.get(other) != null) {
                        throw new StudyException(node.keyPlace(other), path(node, other), "not allowed together with "
                                + path(node, section.name()) + " (the " + section.name() + " brings its own "
                                + String.join(" and ", section.replaces()) + ")");
                    }
                }
                replaced.addAll(section.replaces());
            }
        }
        List<ComponentSpec> out = new ArrayList<>();
        for (TruthCatalog.Section section : truth.sections()) {
            Node s = node.get(section.name());
            if (s == null || s.isNull()) {
                if (section.optional() || replaced.contains(section.name())) {
                    continue;
                }
                if (section.defaultKind() == null) {
                    throw new StudyException(node.place(), path(node, section.name()),
                            "this field is required (allowed " + section.kindField() + ": "
                                    + String.join(", ", section.kindNames()) + ")" + alternatives(section));
                }
                out.add(new ComponentSpec(section.name(), section.kindField(), section.defaultKind(), Map.of()));
                continue;
            }
            ComponentSpec c = problems.attempt(() -> component(section, s, baseDir, problems), null);
            if (c != null) {
                out.add(c);
            }
        }
        return out;
    }

    /** ", or give truth.network instead" for a section another one can stand in for. */
    private String alternatives(TruthCatalog.Section section) {
        List<String> by = new ArrayList<>();
        for (TruthCatalog.Section other : truth.sections()) {
            if (other.replaces().contains(section.name())) {
                by.add(other.name());
            }
        }
        return by.isEmpty() ? "" : ", or give " + String.join(" or ", by) + " instead";
    }

    private ComponentSpec component(TruthCatalog.Section section, Node node, Path baseDir, StudyProblems problems) {
        if (!node.isMap()) {
            if (section.bareValueIsKind()) {
                return new ComponentSpec(section.name(), section.kindField(), kinds(section, node), Map.of());
            }
            if (section.shorthand() == null) {
                throw StudyException.at(node, "expected a map such as {" + section.kindField() + ": "
                        + section.kindNames().get(0) + ", …}, found " + node.describe());
            }
            TruthCatalog.Kind kind = section.kind(section.shorthandKind());
            ParameterSpec spec = kind.parameter(section.shorthand());
            Map<String, List<Object>> axes = new LinkedHashMap<>();
            axes.put(spec.name(), bind(section, kind.name(), spec.name(), node, axis(node, spec), baseDir));
            return new ComponentSpec(section.name(), section.kindField(), kind.name(), axes);
        }
        Node kindNode = node.get(section.kindField());
        List<String> kindNames;
        if (kindNode == null) {
            if (section.defaultKind() == null) {
                throw new StudyException(node.place(), path(node, section.kindField()),
                        "this field is required (allowed: " + String.join(", ", section.kindNames()) + ")");
            }
            kindNames = List.of(section.defaultKind());
        } else {
            kindNames = kinds(section, kindNode);
        }
        Map<String, Node> flat = new LinkedHashMap<>();
        Map<String, Node.Place> keyPlaces = new LinkedHashMap<>();
        flatten(node, "", flat, keyPlaces, section.kindField());
        Map<String, List<Object>> axes = new LinkedHashMap<>();
        for (Map.Entry<String, Node> e : flat.entrySet()) {
            List<Object> values = problems.attempt(() -> parameter(section, kindNames, e, keyPlaces, baseDir), null);
            if (values != null) {
                axes.put(e.getKey(), values);
            }
        }
        return new ComponentSpec(section.name(), section.kindField(), kindNames, axes);
    }

    /** One truth parameter's values, checked against every kind the section lists. */
    private List<Object> parameter(TruthCatalog.Section section, List<String> kindNames, Map.Entry<String, Node> e,
                                   Map<String, Node.Place> keyPlaces, Path baseDir) {
        List<Object> values = null;
        for (String kindName : kindNames) {
                TruthCatalog.Kind kind = section.kind(kindName);
                ParameterSpec spec = kind.parameter(e.getKey());
                if (spec == null) {
                    List<String> allowed = kind.parameters().stream().map(ParameterSpec::name).toList();
                    throw new StudyException(keyPlaces.get(e.getKey()), e.getValue().path(), "unknown parameter '"
                            + e.getKey() + "' of " + section.name() + " " + kindName + " (allowed: "
                            + (allowed.isEmpty() ? "none" : String.join(", ", allowed)) + ")"
                            + FormerNames.hint(e.getKey(), allowed));
                }
                List<Object> v = bind(section, kindName, e.getKey(), e.getValue(), axis(e.getValue(), spec), baseDir);
                if (values == null) {
                    values = v;
                }
        }
        return values;
    }

    /** The kind names a node gives (one word or a list), each checked against the section. */
    private static List<String> kinds(TruthCatalog.Section section, Node kindNode) {
        List<String> kindNames = new ArrayList<>();
        for (Node k : kindNode.isList() ? kindNode.items() : List.of(kindNode)) {
            String name = text(k);
            if (section.kind(name) == null) {
                throw StudyException.at(k, "unknown " + section.name() + " " + section.kindField() + " '"
                        + name + "' (allowed: " + String.join(", ", section.kindNames()) + ")");
            }
            if (kindNames.contains(name)) {
                throw StudyException.at(k, "the " + section.kindField() + " " + name + " is listed twice");
            }
            kindNames.add(name);
        }
        if (kindNames.isEmpty()) {
            throw StudyException.at(kindNode, "an empty list gives no " + section.kindField() + " (allowed: "
                    + String.join(", ", section.kindNames()) + ")");
        }
        return kindNames;
    }

    /** Lets the catalogue check and bind values that name something outside the file (a graph file). */
    private List<Object> bind(TruthCatalog.Section section, String kind, String parameter, Node node,
                              List<Object> values, Path baseDir) {
        List<Node> items = node.isList() ? node.items() : List.of(node);
        List<Object> out = new ArrayList<>();
        for (int i = 0; i < values.size(); i++) {
            try {
                out.add(truth.bind(section.name(), kind, parameter, values.get(i), baseDir));
            } catch (IllegalArgumentException | dev.touchstone.harness.BadInputException e) {
                throw StudyException.at(items.get(i), e.getMessage());
            }
        }
        return out;
    }

    /** Nested maps name grouped parameters: {@code edge_weight: {low: 0.5}} is the parameter {@code edge_weight_low}. */
    private static void flatten(Node map, String prefix, Map<String, Node> out, Map<String, Node.Place> places,
                                String skip) {
        for (Map.Entry<String, Node> e : map.entries().entrySet()) {
            if (prefix.isEmpty() && e.getKey().equals(skip)) {
                continue;
            }
            String name = prefix.isEmpty() ? e.getKey() : prefix + "_" + e.getKey();
            if (e.getValue().isMap()) {
                flatten(e.getValue(), name, out, places, skip);
            } else {
                out.put(name, e.getValue());
                places.put(name, map.keyPlace(e.getKey()));
            }
        }
    }

    /** One value or a list of values, each checked by the parameter's declaration. */
    private static List<Object> axis(Node node, ParameterSpec spec) {
        List<Node> items = node.isList() ? node.items() : List.of(node);
        if (items.isEmpty()) {
            throw StudyException.at(node, "an empty list gives no values (allowed: " + spec.allowed() + ")");
        }
        List<Object> values = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        for (Node item : items) {
            if (!item.isScalar()) {
                throw StudyException.at(item, "expected a value (allowed: " + spec.allowed() + "), found "
                        + item.describe());
            }
            Object v;
            try {
                v = spec.parse(item.value());
            } catch (ParameterException e) {
                throw StudyException.at(item, e.getMessage());
            }
            if (!seen.add(Canonical.value(v))) {
                throw StudyException.at(item, "the value " + Canonical.value(v) + " is listed twice");
            }
            values.add(v);
        }
        return values;
    }

    // ---- samples

    private static List<SampleSize> samples(Node node, StudyProblems problems) {
        List<Node> items = node.isList() ? node.items() : List.of(node);
        if (items.isEmpty()) {
            throw StudyException.at(node, "needs at least one sample size (whole numbers of at least "
                    + StudyFields.MIN_SAMPLES + ", or oracle)");
        }
        List<SampleSize> out = new ArrayList<>();
        for (Node item : items) {
            SampleSize s = problems.attempt(() -> sample(item), null);
            if (s != null && out.contains(s)) {
                problems.add(StudyException.at(item, "the sample size " + s.word() + " is listed twice"));
            } else if (s != null) {
                out.add(s);
            }
        }
        return out;
    }

    private static SampleSize sample(Node item) {
        Object v = item.value();
        if (item.isScalar() && v instanceof String
                && ((String) v).trim().toLowerCase(Locale.ROOT).equals(SampleSize.ORACLE_WORD)) {
            return SampleSize.oracle();
        }
        if (item.isScalar() && v instanceof Long && (Long) v >= StudyFields.MIN_SAMPLES && (Long) v <= Integer.MAX_VALUE) {
            return SampleSize.of((Long) v);
        }
        throw StudyException.at(item, item.describe() + " is not a sample size (allowed: whole numbers from "
                + StudyFields.MIN_SAMPLES + " to " + Integer.MAX_VALUE + ", or oracle)");
    }

    // ---- learners

    private List<LearnerEntry> learners(Node node, StudyProblems problems) {
        if (!node.isList()) {
            throw StudyException.at(node, "expected a list of learner entries, found " + node.describe());
        }
        if (node.items().isEmpty()) {
            throw StudyException.at(node, "needs at least one learner (see 'touchstone learners')");
        }
        List<LearnerEntry> out = new ArrayList<>();
        Map<String, Node> ids = new LinkedHashMap<>();
        for (Node item : node.items()) {
            LearnerEntry e = problems.attempt(() -> entry(item, problems), null);
            if (e == null) {
                continue;
            }
            if (ids.containsKey(e.id())) {
                throw StudyException.at(item, "the learner id '" + e.id() + "' is already used at line "
                        + ids.get(e.id()).place().line() + "; give each entry its own id");
            }
            ids.put(e.id(), item);
            out.add(e);
        }
        return out;
    }

    private LearnerEntry entry(Node item, StudyProblems problems) {
        if (item.isScalar() && item.value() instanceof String) {
            String use = (String) item.value();
            LearnerCatalog.Entry found = findLearner(item, use);
            return new LearnerEntry(checkId(item, use), found.id(), Map.of(), item.place());
        }
        if (!item.isMap()) {
            throw StudyException.at(item, "expected a learner id or {id: …, use: …, with: {…}}, found "
                    + item.describe());
        }
        if (item.get(StudyFields.ENTRY_STEPS) != null) {
            return composedEntry(item, problems);
        }
        checkKeys(item, List.of(StudyFields.ENTRY_ID, StudyFields.ENTRY_USE, StudyFields.ENTRY_WITH,
                StudyFields.ENTRY_KNOWLEDGE, StudyFields.ENTRY_STEPS), problems);
        Node useNode = required(item, StudyFields.ENTRY_USE);
        LearnerCatalog.Entry found = findLearner(useNode, text(useNode));
        Node idNode = item.get(StudyFields.ENTRY_ID);
        String id = idNode == null ? found.id() : checkId(idNode, text(idNode));
        LearnerDescription d = found.learner().description();
        return new LearnerEntry(id, found.id(), axes(item, d, problems), knowledge(item.get(StudyFields.ENTRY_KNOWLEDGE), d),
                item.place());
    }

    /** The parameter axes of an entry or step's {@code with}, checked against the learner's declared parameters. */
    private Map<String, List<Object>> axes(Node item, LearnerDescription d, StudyProblems problems) {
        Map<String, List<Object>> axes = new LinkedHashMap<>();
        Set<String> given = new HashSet<>();
        Node with = item.get(StudyFields.ENTRY_WITH);
        if (with != null && !with.isNull()) {
            requireMap(with);
            for (Map.Entry<String, Node> p : with.entries().entrySet()) {
                ParameterSpec spec = d.parameter(p.getKey());
                if (spec == null) {
                    List<String> allowed = d.parameters().stream().map(ParameterSpec::name).toList();
                    problems.add(new StudyException(with.keyPlace(p.getKey()), p.getValue().path(), "unknown parameter '"
                            + p.getKey() + "' of learner " + d.id() + " (allowed: "
                            + (allowed.isEmpty() ? "none, it has no parameters" : String.join(", ", allowed)) + ")"
                            + FormerNames.hint(p.getKey(), allowed)));
                    continue;
                }
                given.add(spec.name());
                List<Object> values = problems.attempt(() -> axis(p.getValue(), spec), null);
                if (values != null) {
                    axes.put(spec.name(), values);
                }
            }
        }
        for (ParameterSpec spec : d.parameters()) {
            if (spec.defaultValue() == null && !given.contains(spec.name())) {
                problems.add(new StudyException(item.place(), item.path() + "." + StudyFields.ENTRY_WITH + "." + spec.name(),
                        "learner " + d.id() + " needs this parameter (allowed: " + spec.allowed() + ")"));
            }
        }
        return axes;
    }

    /**
     * An entry made of steps: {@code {id: …, steps: [{use: …, with: {…}}, {use: …, with: {…}, given: …}]}}.
     * Each step is checked like a learner entry, and each hand-on against what the receiving
     * learner honours, at the step's own line.
     */
    private LearnerEntry composedEntry(Node item, StudyProblems problems) {
        checkKeys(item, List.of(StudyFields.ENTRY_ID, StudyFields.ENTRY_STEPS, StudyFields.ENTRY_KNOWLEDGE), problems);
        Node stepsNode = item.get(StudyFields.ENTRY_STEPS);
        if (!stepsNode.isList() || stepsNode.items().size() < 2) {
            throw StudyException.at(stepsNode, "expected a list of at least two steps ({use: …, with: {…}, given: …}),"
                    + " found " + stepsNode.describe());
        }
        List<LearnerEntry.Step> steps = new ArrayList<>();
        List<ComposedStep> composed = new ArrayList<>();
        for (Node stepNode : stepsNode.items()) {
            requireMap(stepNode);
            checkKeys(stepNode, List.of(StudyFields.ENTRY_USE, StudyFields.ENTRY_WITH, StudyFields.STEP_GIVEN), problems);
            Node useNode = required(stepNode, StudyFields.ENTRY_USE);
            LearnerCatalog.Entry found = findLearner(useNode, text(useNode));
            Handoff given = given(stepNode, composed, found.learner().description());
            steps.add(new LearnerEntry.Step(found.id(), axes(stepNode, found.learner().description(), problems), given));
            composed.add(new ComposedStep(found.learner(), given));
        }
        ComposedLearner learner;
        try {
            learner = ComposedLearner.of(composed);
        } catch (IllegalArgumentException e) {
            throw StudyException.at(stepsNode, e.getMessage());
        }
        Node idNode = item.get(StudyFields.ENTRY_ID);
        String id = idNode == null ? learner.description().id() : checkId(idNode, text(idNode));
        return new LearnerEntry(id, steps, knowledge(item.get(StudyFields.ENTRY_KNOWLEDGE), learner.description()),
                item.place());
    }

    /** A step's {@code given}: none for the first step, one of the hand-ons the receiving learner honours after it. */
    private static Handoff given(Node stepNode, List<ComposedStep> before, LearnerDescription receiver) {
        Node node = stepNode.get(StudyFields.STEP_GIVEN);
        if (before.isEmpty()) {
            if (node != null) {
                throw StudyException.at(node, "the first step receives nothing, so it takes no '"
                        + StudyFields.STEP_GIVEN + "'");
            }
            return null;
        }
        if (node == null) {
            throw new StudyException(stepNode.place(), stepNode.path() + "." + StudyFields.STEP_GIVEN,
                    "a step after the first must say how it is given the estimate of the step before (allowed: "
                            + String.join(", ", Handoff.words()) + ")");
        }
        String word = text(node);
        Handoff given = Handoff.of(word);
        if (given == null) {
            throw StudyException.at(node, "unknown hand-on '" + word + "' (allowed: "
                    + String.join(", ", Handoff.words()) + ")");
        }
        String refusal = given.refusal(before.get(before.size() - 1).learner().description(), receiver);
        if (refusal != null) {
            throw StudyException.at(node, refusal);
        }
        return given;
    }

    /** The entry's {@code knowledge}: none (default) or tiers, which the learner must honour. */
    private static KnowledgeSource knowledge(Node node, LearnerDescription d) {
        if (node == null || node.isNull()) {
            return KnowledgeSource.NONE;
        }
        String word = text(node);
        KnowledgeSource k = KnowledgeSource.of(word);
        if (k == null) {
            throw StudyException.at(node, "unknown knowledge '" + word + "' (allowed: "
                    + String.join(", ", KnowledgeSource.words()) + ")");
        }
        if (k == KnowledgeSource.TIERS && !d.knowledge().contains(dev.touchstone.core.learner.KnowledgeUse.TIERS)) {
            throw StudyException.at(node, "learner " + d.id() + " does not honour tiers (it honours: "
                    + (d.knowledge().isEmpty() ? "no knowledge" : String.join(", ", d.knowledge().stream()
                    .map(dev.touchstone.core.learner.KnowledgeUse::word).toList())) + ")");
        }
        return k;
    }

    private LearnerCatalog.Entry findLearner(Node node, String use) {
        LearnerCatalog.Entry found = learners.find(use);
        if (found == null) {
            throw StudyException.at(node, "unknown learner '" + use + "' (available: "
                    + String.join(", ", learners.ids()) + "). An external command learner must be declared in a"
                    + " learners file given with --learners FILE; a study file alone cannot make one runnable");
        }
        return found;
    }

    private static String checkId(Node node, String id) {
        if (!ENTRY_ID.matcher(id).matches()) {
            throw StudyException.at(node, "'" + id + "' is not allowed as an id (lower-case letters, digits, '.', '_'"
                    + " and '-', starting with a letter or digit)");
        }
        return id;
    }

    // ---- metrics, limits, compare_to

    private List<String> metrics(Node node, StudyProblems problems) {
        if (node == null || node.isNull()) {
            return metrics.defaults();
        }
        List<Node> items = node.isList() ? node.items() : List.of(node);
        if (items.isEmpty()) {
            throw StudyException.at(node, "needs at least one metric (allowed: " + String.join(", ", metrics.names())
                    + "), or leave the field out for the defaults");
        }
        List<String> out = new ArrayList<>();
        for (Node item : items) {
            String m = problems.attempt(() -> text(item), null);
            if (m == null) {
                continue;
            }
            if (!metrics.contains(m)) {
                problems.add(StudyException.at(item, "unknown metric '" + m + "' (allowed: "
                        + String.join(", ", metrics.names()) + ")"));
            } else if (out.contains(m)) {
                problems.add(StudyException.at(item, "the metric " + m + " is listed twice"));
            } else {
                out.add(m);
            }
        }
        return out;
    }

    private static Limits limits(Node node, StudyProblems problems) {
        if (node == null || node.isNull()) {
            return Limits.defaults();
        }
        requireMap(node);
        checkKeys(node, List.of(StudyFields.LIMIT_SECONDS, StudyFields.LIMIT_MAX_RUNS), problems);
        Duration perRun = null;
        Node s = node.get(StudyFields.LIMIT_SECONDS);
        if (s != null && !s.isNull()) {
            double sec = real(s);
            if (!(sec > 0) || sec > 7 * 24 * 3600) {
                throw StudyException.at(s, s.describe() + " is not allowed (allowed: more than 0, at most 604800 seconds)");
            }
            perRun = Duration.ofNanos(Math.round(sec * 1e9));
        }
        Node m = node.get(StudyFields.LIMIT_MAX_RUNS);
        long maxRuns = m == null || m.isNull() ? Limits.DEFAULT_MAX_RUNS : integer(m, 1, Integer.MAX_VALUE);
        return new Limits(perRun, maxRuns);
    }

    private static String compareTo(Node node, List<LearnerEntry> entries) {
        if (node == null || node.isNull()) {
            return null;
        }
        String id = text(node);
        for (LearnerEntry e : entries) {
            if (e.id().equals(id)) {
                if (e.configurations() != 1) {
                    throw StudyException.at(node, "learner entry '" + id + "' expands into " + e.configurations()
                            + " configurations; compare_to needs an entry with one configuration");
                }
                if (entries.size() < 2) {
                    throw StudyException.at(node, "there is no other learner to compare with '" + id + "'");
                }
                return id;
            }
        }
        throw StudyException.at(node, "no learner entry has the id '" + id + "' (ids: "
                + String.join(", ", entries.stream().map(LearnerEntry::id).toList()) + ")");
    }

    private static List<GraphClass> scoreAgainst(Node node, StudyProblems problems) {
        if (node == null || node.isNull()) {
            return List.of();
        }
        List<String> allowed = List.of("dag", "cpdag", "mag", "pag");
        List<GraphClass> out = new ArrayList<>();
        for (Node item : node.isList() ? node.items() : List.of(node)) {
            problems.attempt(() -> {
                String word = text(item);
                if (!allowed.contains(word)) {
                    throw StudyException.at(item, "unknown graph class '" + word + "' (allowed: "
                            + String.join(", ", allowed) + ")");
                }
                GraphClass c = GraphClass.parse(word);
                if (out.contains(c)) {
                    throw StudyException.at(item, "the class " + word + " is listed twice");
                }
                out.add(c);
            });
        }
        return out;
    }

    private static void checkSize(Node root, Study study) {
        long runs;
        try {
            runs = study.runCount();
        } catch (ArithmeticException e) {
            runs = Long.MAX_VALUE;
        }
        if (runs > study.limits().maxRuns()) {
            Node at = root.get(StudyFields.LIMITS) != null ? root.get(StudyFields.LIMITS) : root;
            throw new StudyException(at.place(), StudyFields.LIMITS + "." + StudyFields.LIMIT_MAX_RUNS,
                    String.format(Locale.ROOT, "the study expands to %,d runs (%,d truth settings x %d replicates x %d"
                                    + " sample sizes x %d learner configurations), more than the limit of %,d;"
                                    + " make the grid smaller or raise limits.max_runs",
                            runs, study.truthCombinations(), study.replicates(), study.samples().size(),
                            study.configurations(), study.limits().maxRuns()));
        }
    }

    // ---- helpers

    private static Node required(Node map, String key) {
        Node n = map.get(key);
        if (n == null || n.isNull()) {
            StudyFields.Field f = StudyFields.TOP_LEVEL.stream().filter(x -> x.name().equals(key)).findFirst()
                    .orElse(null);
            throw new StudyException(n == null ? map.place() : n.place(), path(map, key), "this field is required"
                    + (f != null && map.path().isEmpty() ? " (" + f.meaning() + ")" : ""));
        }
        return n;
    }

    /** Records every key of the map that is not allowed; the others are read as usual. */
    private static void checkKeys(Node map, List<String> allowed, StudyProblems problems) {
        requireMap(map);
        for (String key : map.entries().keySet()) {
            if (!allowed.contains(key)) {
                String hint = closest(key, allowed);
                problems.add(new StudyException(map.keyPlace(key), path(map, key), "unknown field"
                        + (hint == null ? "" : " (did you mean '" + hint + "'?)") + "; allowed here: "
                        + String.join(", ", allowed)));
            }
        }
    }

    private static void requireMap(Node node) {
        if (!node.isMap()) {
            throw StudyException.at(node, "expected a map (name: value, …), found " + node.describe());
        }
    }

    private static String text(Node node) {
        if (!node.isScalar() || node.value() == null || node.value() instanceof Boolean) {
            throw StudyException.at(node, "expected a word or text, found " + node.describe());
        }
        return node.value().toString();
    }

    private static long integer(Node node, long min, long max) {
        Object v = node.value();
        if (!node.isScalar() || !(v instanceof Long)) {
            throw StudyException.at(node, "expected a whole number, found " + node.describe());
        }
        long x = (Long) v;
        if (x < min || x > max) {
            throw StudyException.at(node, x + " is outside the allowed range [" + min + ", " + max + "]");
        }
        return x;
    }

    private static double real(Node node) {
        Object v = node.value();
        if (!node.isScalar() || !(v instanceof Number)) {
            throw StudyException.at(node, "expected a number, found " + node.describe());
        }
        return ((Number) v).doubleValue();
    }

    private static String path(Node parent, String key) {
        return parent.path().isEmpty() ? key : parent.path() + "." + key;
    }

    /** The allowed word closest to a misspelt one (edit distance at most 2), or null. */
    static String closest(String word, List<String> allowed) {
        String best = null;
        int bestDistance = 3;
        for (String a : allowed) {
            int d = distance(word.toLowerCase(Locale.ROOT), a);
            if (d < bestDistance) {
                bestDistance = d;
                best = a;
            }
        }
        return best;
    }

    private static int distance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                cur[j] = Math.min(Math.min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + cost);
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }
}
