package dev.touchstone.harness.study;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.param.ParameterValues;

import java.util.Map;

/**
 * One learner configuration of the expansion: a study entry with one value for each of its
 * parameters (defaults filled in). Immutable.
 *
 * @param index   position in the expansion's list of configurations
 * @param entryId the study entry's id
 * @param learner the catalogue learner
 * @param values  all parameter values
 * @param details what else names or defines the configuration (none for a plain entry)
 */
public record LearnerConfig(int index, String entryId, Learner learner, ParameterValues values, Details details) {

    public LearnerConfig {
        details = details == null ? Details.NONE : details;
    }

    /** A configuration with nothing varied, no fingerprint and no background knowledge. */
    public LearnerConfig(int index, String entryId, Learner learner, ParameterValues values) {
        this(index, entryId, learner, values, Details.NONE);
    }

    /**
     * What else names or defines a configuration.
     *
     * @param varied      the values of parameters the entry gave several values for (they name the configuration)
     * @param fingerprint what defines the learner beyond its id and parameters (e.g. an external command line);
     *                    may be empty
     * @param knowledge   the background knowledge its runs receive
     */
    public record Details(Map<String, Object> varied, String fingerprint, KnowledgeSource knowledge) {

        /** Nothing varied, no fingerprint, no knowledge. */
        public static final Details NONE = new Details(Map.of(), "", KnowledgeSource.NONE);

        public Details {
            varied = Map.copyOf(varied);
            knowledge = knowledge == null ? KnowledgeSource.NONE : knowledge;
        }
    }

    /** The values of parameters the entry gave several values for. */
    public Map<String, Object> varied() {
        return details.varied();
    }

    /** What defines the learner beyond its id and parameters; may be empty. */
    public String fingerprint() {
        return details.fingerprint();
    }

    /** The background knowledge its runs receive. */
    public KnowledgeSource knowledge() {
        return details.knowledge();
    }

    public String use() {
        return learner.description().id();
    }

    /** The configuration's name in results: the entry id, with the varied values in brackets when there are any. */
    public String label() {
        Map<String, Object> varied = varied();
        if (varied.isEmpty()) {
            return entryId;
        }
        StringBuilder sb = new StringBuilder(entryId).append('[');
        boolean first = true;
        for (Map.Entry<String, Object> e : values.asMap().entrySet()) {
            if (varied.containsKey(e.getKey())) {
                if (!first) {
                    sb.append(',');
                }
                first = false;
                sb.append(e.getKey()).append('=').append(Canonical.value(e.getValue()));
            }
        }
        return sb.append(']').toString();
    }

    /** All parameter values as {@code name=value} joined by {@code ;}, in declaration order. */
    public String parametersText() {
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<String, Object> e : values.asMap().entrySet()) {
            if (sb.length() > 0) {
                sb.append(';');
            }
            sb.append(e.getKey()).append('=').append(Canonical.value(e.getValue()));
        }
        return sb.toString();
    }

    /**
     * What defines this configuration, for run keys: the learner id, its values, its
     * fingerprint and (when it gets any) its knowledge. Runs without knowledge keep the keys
     * they had before knowledge could be given.
     */
    public String canonical() {
        String fingerprint = fingerprint();
        KnowledgeSource knowledge = knowledge();
        return use() + "{" + parametersText() + "}" + (fingerprint.isEmpty() ? "" : "#" + fingerprint)
                + (knowledge == KnowledgeSource.NONE ? "" : "+knowledge=" + knowledge.word());
    }
}
