package dev.touchstone.learners.composed;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * A learner made of steps of other learners, run in order on the same input: each step after
 * the first receives the estimate of the step before as allowed edges, required edges or a
 * start graph ({@link Handoff}), merged with the run's own knowledge. The estimate is the last
 * step's. Restricting a score search to the skeleton of a constraint-based search is the
 * hybrid scheme of MMHC (Tsamardinos, Brown and Aliferis 2006, Machine Learning 65; from
 * memory); this class lets any learners be combined that way.
 *
 * <p>Its description is derived from the steps: data kinds accepted by every step, the last
 * step's graph class, the most restrictive missing-value handling, the knowledge every step
 * honours, and the oracle only when every step can use it. Each step's parameters are its own,
 * named {@code STEP.PARAMETER} (for example {@code pc.alpha}; a learner used twice is
 * {@code hill-climbing-2} the second time). All steps share the run's context, so the tests and
 * score evaluations counted and the time spent are the sums over the steps, and the time limit
 * covers them all. Stateless and thread-safe when its steps are.
 */
public final class ComposedLearner extends DeclaredLearner {

    private static final String JOIN = "-then-";

    private final List<ComposedStep> steps;
    private final List<String> names;

    private ComposedLearner(List<ComposedStep> steps, List<String> names) {
        super(describe(steps, names));
        this.steps = steps;
        this.names = names;
    }

    /**
     * A composed learner of these steps.
     *
     * @throws IllegalArgumentException with a one-line reason when there are fewer than two
     *     steps, the first is given something or a later one is not, a step cannot receive
     *     what it is given, or the steps share no data kind
     */
    public static ComposedLearner of(List<ComposedStep> steps) {
        if (steps.size() < 2) {
            throw new IllegalArgumentException("a composed learner needs at least two steps, got " + steps.size());
        }
        if (steps.get(0).given() != null) {
            throw new IllegalArgumentException("the first step receives nothing, so it takes no 'given'");
        }
        for (int i = 1; i < steps.size(); i++) {
            ComposedStep s = steps.get(i);
            if (s.given() == null) {
                throw new IllegalArgumentException("step " + (i + 1) + " (" + s.learner().description().id()
                        + ") must say how it is given the estimate of the step before (allowed: "
                        + String.join(", ", Handoff.words()) + ")");
            }
            String refusal = s.given().refusal(steps.get(i - 1).learner().description(), s.learner().description());
            if (refusal != null) {
                throw new IllegalArgumentException("step " + (i + 1) + ": " + refusal);
            }
        }
        List<String> ids = new ArrayList<>();
        for (ComposedStep s : steps) {
            ids.add(s.learner().description().id());
        }
        return new ComposedLearner(List.copyOf(steps), stepNames(ids));
    }

    /** The id of a composed learner of steps using these learner ids, e.g. {@code pc-then-hill-climbing}. */
    public static String idOf(List<String> stepIds) {
        return String.join(JOIN, stepNames(stepIds));
    }

    /**
     * The names the steps' parameters are prefixed with: each learner id, with {@code -2},
     * {@code -3}, … when the same learner is used again.
     */
    public static List<String> stepNames(List<String> stepIds) {
        Map<String, Integer> seen = new HashMap<>();
        List<String> out = new ArrayList<>();
        for (String id : stepIds) {
            int n = seen.merge(id, 1, Integer::sum);
            out.add(n == 1 ? id : id + "-" + n);
        }
        return out;
    }

    /** The name a step's parameter goes by in the composed learner, e.g. {@code pc.alpha}. */
    public static String parameterName(String stepName, String parameter) {
        return stepName + "." + parameter;
    }

    /** The steps, in order. */
    public List<ComposedStep> steps() {
        return steps;
    }

    /** What it is made of in one line, e.g. {@code pc > allowed-edges > hill-climbing}; part of a run's identity. */
    public String composition() {
        StringBuilder sb = new StringBuilder(names.get(0));
        for (int i = 1; i < steps.size(); i++) {
            sb.append(" > ").append(steps.get(i).given().word()).append(" > ").append(names.get(i));
        }
        return sb.toString();
    }

    @Override
    protected Estimate run(LearnerRun run) {
        LearnerInput input = run.input();
        Knowledge knowledge = run.knowledge();
        RunContext context = run.context();
        Map<String, Double> extras = new LinkedHashMap<>();
        Estimate previous = null;
        for (int i = 0; i < steps.size(); i++) {
            context.checkDeadline();
            ComposedStep step = steps.get(i);
            LearnerInput stepInput = input;
            Knowledge stepKnowledge = knowledge;
            if (i > 0) {
                stepInput = step.given().input(input, previous.graph());
                stepKnowledge = handedOn(i, knowledge, previous);
            }
            previous = step.learner().learn(stepInput, stepKnowledge, valuesOf(i, run.parameters()), context);
            String name = names.get(i);
            previous.extras().forEach((k, v) -> extras.put(name + "." + k, v));
        }
        return new Estimate(previous.graph(), previous.graphClass(), extras);
    }

    private Knowledge handedOn(int i, Knowledge knowledge, Estimate previous) {
        try {
            return steps.get(i).given().knowledge(knowledge, previous.graph());
        } catch (IllegalArgumentException e) {
            throw new LearnerException("step " + (i + 1) + " (" + names.get(i) + "): the " + steps.get(i).given().word()
                    + " of step " + i + " (" + names.get(i - 1) + ") contradict the run's knowledge: " + e.getMessage(), e);
        }
    }

    /** The values of step {@code i}'s own parameters, taken from the composed learner's prefixed ones. */
    private ParameterValues valuesOf(int i, ParameterValues parameters) {
        String prefix = parameterName(names.get(i), "");
        Map<String, Object> own = new LinkedHashMap<>();
        parameters.asMap().forEach((k, v) -> {
            if (k.startsWith(prefix)) {
                own.put(k.substring(prefix.length()), v);
            }
        });
        LearnerDescription d = steps.get(i).learner().description();
        try {
            return ParameterValues.resolve("learner " + d.id(), d.parameters(), own);
        } catch (ParameterException e) {
            throw new LearnerException("step " + (i + 1) + " (" + names.get(i) + "): " + e.getMessage(), e);
        }
    }

    private static LearnerDescription describe(List<ComposedStep> steps, List<String> names) {
        LearnerDescription last = steps.get(steps.size() - 1).learner().description();
        Set<DataKind> kinds = EnumSet.allOf(DataKind.class);
        Set<KnowledgeUse> knowledge = EnumSet.allOf(KnowledgeUse.class);
        StringBuilder summary = new StringBuilder(names.get(0));
        StringBuilder publication = new StringBuilder("composition of steps (common practice for hybrid learners,"
                + " e.g. Tsamardinos, Brown and Aliferis 2006, Machine Learning 65)");
        for (int i = 0; i < steps.size(); i++) {
            LearnerDescription d = steps.get(i).learner().description();
            kinds.retainAll(d.accepts());
            knowledge.retainAll(d.knowledge());
            if (i > 0) {
                summary.append(", then ").append(names.get(i)).append(" given ")
                        .append(steps.get(i).given().phrase()).append(" the estimate of ").append(names.get(i - 1));
            }
            publication.append("; ").append(names.get(i)).append(": ").append(d.publication());
        }
        if (kinds.isEmpty()) {
            throw new IllegalArgumentException("the steps " + String.join(", ", names)
                    + " accept no data kind in common, so no data can go through all of them");
        }
        List<DataKind> ordered = new ArrayList<>(kinds);
        LearnerDescription.Builder b = LearnerDescription.builder(idOf(names))
                .summary(summary.toString())
                .publication(publication.toString())
                .family(LearnerFamily.HYBRID)
                .accepts(ordered.get(0), ordered.subList(1, ordered.size()).toArray(new DataKind[0]))
                .returns(last.returns())
                .missingValues(missingValues(steps))
                .knowledge(knowledge.toArray(new KnowledgeUse[0]))
                .oracle(oracle(steps));
        for (int i = 0; i < steps.size(); i++) {
            LearnerDescription d = steps.get(i).learner().description();
            for (String a : d.assumptions()) {
                b.assumption(names.get(i) + ": " + a);
            }
            for (ParameterSpec p : d.parameters()) {
                b.parameter(p.renamed(parameterName(names.get(i), p.name()), names.get(i) + ": " + p.meaning()));
            }
        }
        return b.build();
    }

    /**
     * Refuses missing values if any step does; otherwise the steps' common handling, or
     * {@link MissingValues#OWN_METHOD} when they differ (each step then applies its own).
     */
    private static MissingValues missingValues(List<ComposedStep> steps) {
        MissingValues common = null;
        for (ComposedStep s : steps) {
            MissingValues m = s.learner().description().missingValues();
            if (m == MissingValues.REJECTS) {
                return MissingValues.REJECTS;
            }
            common = common == null || common == m ? m : MissingValues.OWN_METHOD;
        }
        return common;
    }

    /**
     * The oracle only when every step can use it: {@link OracleUse#NONE} if one cannot,
     * {@link OracleUse#COVARIANCE} if one needs the population covariance, otherwise
     * {@link OracleUse#INDEPENDENCE}.
     */
    private static OracleUse oracle(List<ComposedStep> steps) {
        OracleUse out = OracleUse.INDEPENDENCE;
        for (ComposedStep s : steps) {
            OracleUse o = s.learner().description().oracle();
            if (o == OracleUse.NONE) {
                return OracleUse.NONE;
            }
            if (o == OracleUse.COVARIANCE) {
                out = OracleUse.COVARIANCE;
            }
        }
        return out;
    }
}
